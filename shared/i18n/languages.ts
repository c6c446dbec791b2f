// The languages Gaugewalk ships. A hangar adds one by copying shared/i18n/locales/en to a folder named by its
// BCP 47 code, translating every value, and adding the code here (README: "Adding a language").
export const languages = ['en', 'de'] as const;
export type Language = (typeof languages)[number];
export const sourceLanguage: Language = 'en';

// Each language named in itself, so a person who cannot read the current one still finds theirs.
export const languageNames: Record<Language, string> = { en: 'English', de: 'Deutsch' };

export function isLanguage(value: unknown): value is Language {
  return typeof value === 'string' && (languages as readonly string[]).includes(value);
}

// "de-AT" or "de_DE" becomes "de"; anything not shipped becomes undefined.
export function toLanguage(value: string | null | undefined): Language | undefined {
  const base = value?.trim().toLowerCase().split(/[-_]/)[0];
  return isLanguage(base) ? base : undefined;
}

// The first shipped language in an Accept-Language header, in the order the browser prefers them.
export function fromAcceptLanguage(header: string | undefined): Language | undefined {
  const ranked = (header ?? '')
    .split(',')
    .map((part) => {
      const [tag, ...params] = part.trim().split(';');
      const q = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
      return { tag: tag ?? '', q: q ? Number(q.slice(2)) : 1 };
    })
    .filter((entry) => entry.tag && Number.isFinite(entry.q) && entry.q > 0)
    .sort((a, b) => b.q - a.q);
  for (const { tag } of ranked) {
    const language = toLanguage(tag);
    if (language) return language;
  }
  return undefined;
}
