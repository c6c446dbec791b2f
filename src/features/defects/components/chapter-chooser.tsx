import { ataChapterWords, ataScopes } from '@shared/domain/authorisation';
import { useTranslation } from 'react-i18next';

const chapters = ataScopes.filter((key) => key !== 'all');

/** The ATA chapter of a defect, or none: glove-sized choices, the chapter's name in words. */
export function ChapterChooser({
  value,
  onChange,
}: {
  value: string | null;
  onChange: (chapter: string | null) => void;
}) {
  const { t } = useTranslation('defects');
  const option = (key: string | null, words: string) => (
    <button
      key={key ?? 'none'}
      type="button"
      role="radio"
      aria-checked={value === key}
      onClick={() => onChange(key)}
      className={`min-h-touch rounded-xl border-2 px-3 text-left text-[20px] font-semibold leading-tight ${value === key ? 'border-signal-edge bg-signal-bright text-on-fill' : 'border-ink-line bg-ink-raised text-paper'}`}
    >
      {words}
    </button>
  );
  return (
    <div className="flex flex-col gap-2">
      <span className="text-[22px] font-semibold">{t('chapter.label')}</span>
      <div
        className="grid grid-cols-3 gap-2 portrait:grid-cols-2"
        role="radiogroup"
        aria-label={t('chapter.aria')}
      >
        {option(null, t('chapter.none'))}
        {chapters.map((key) => option(key, ataChapterWords(key)))}
      </div>
    </div>
  );
}
