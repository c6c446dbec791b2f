// ATA chapter names, read in the reader's language: the authorisations' scopes, the defects' chapters and the
// phrases that name them.
import { ambientTranslate, liveLabels, say, type Translate } from '../i18n/translate';

/** ATA 100 / iSpec 2200 chapters the product's checks touch; "all" is the whole type. Words in words.json "ata". */
const ataKeys = {
  all: 'words:ata.all',
  '05': 'words:ata.05',
  '12': 'words:ata.12',
  '27': 'words:ata.27',
  '29': 'words:ata.29',
  '32': 'words:ata.32',
  '62': 'words:ata.62',
  '64': 'words:ata.64',
  '67': 'words:ata.67',
} as const;
export type AtaScope = keyof typeof ataKeys;
/** The chapters with their names, read in the screen's language (English in Node). */
export const ataChapters: Readonly<Record<AtaScope, string>> = liveLabels(ataKeys);
export const ataScopes = Object.keys(ataKeys) as AtaScope[];

/** A chapter's name: "ATA 29 Hydraulic power"; "ATA 45" for one the product has no name for; null: unclassified. */
export function ataChapterWords(chapter: string | null, t: Translate = ambientTranslate()): string {
  if (chapter === null) return say(t, 'words:ata.unclassified');
  return chapter in ataKeys ? say(t, ataKeys[chapter as AtaScope]) : say(t, 'words:ata.other', { chapter });
}
