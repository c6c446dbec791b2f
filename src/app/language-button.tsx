import { useState } from 'react';
import { useTranslation } from 'react-i18next';
import { languageNames, languages, type Language } from '@shared/i18n/languages';
import { Button } from '@/components/ui/button';
import { currentLanguage } from '@/i18n/i18n';

/** A speech-bubble glyph: the button reads the same whatever language the screen is in. */
function LanguageGlyph() {
  return (
    <svg viewBox="0 0 24 24" width="28" height="28" aria-hidden="true" fill="none" stroke="currentColor">
      <path strokeWidth="2" strokeLinejoin="round" d="M4 5h16v11H10l-5 4v-4H4z" />
      <path strokeWidth="2" strokeLinecap="round" d="M8 9h8M8 12h5" />
    </svg>
  );
}

/**
 * The kiosk header's language button: it shows the language in use and opens a list of every shipped language,
 * each named in itself, so a mechanic who cannot read the current one still finds theirs. i18next keeps the choice
 * in this tablet's localStorage, so the tablet stays in it for the next badge until someone changes it.
 */
export function LanguageButton() {
  const { t, i18n } = useTranslation('app');
  const [open, setOpen] = useState(false);
  const current = currentLanguage();
  const choose = (language: Language) => {
    setOpen(false);
    if (language !== current) void i18n.changeLanguage(language);
  };
  return (
    <>
      <Button
        tone="neutral"
        aria-haspopup="dialog"
        aria-label={t('language.button', { language: languageNames[current] })}
        data-testid="language-button"
        onClick={() => setOpen(true)}
      >
        <LanguageGlyph />
        <span lang={current}>{languageNames[current]}</span>
      </Button>
      {open && (
        <div
          role="dialog"
          aria-modal="true"
          aria-label={t('language.title')}
          className="fixed inset-0 z-50 flex flex-col gap-5 overflow-auto bg-ink p-6 text-paper"
        >
          <div className="flex items-center gap-4">
            <h2 className="mr-auto text-[34px] font-bold">{t('language.title')}</h2>
            <Button tone="neutral" size="large" onClick={() => setOpen(false)}>
              {t('language.close')}
            </Button>
          </div>
          <ul className="grid gap-4 landscape:grid-cols-2" aria-label={t('language.title')}>
            {languages.map((language) => (
              <li key={language} className="contents">
                <Button
                  tone={language === current ? 'primary' : 'neutral'}
                  size="huge"
                  lang={language}
                  aria-pressed={language === current}
                  data-testid={`language-${language}`}
                  onClick={() => choose(language)}
                >
                  {languageNames[language]}
                </Button>
              </li>
            ))}
          </ul>
        </div>
      )}
    </>
  );
}
