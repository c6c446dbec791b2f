// Certifying authorisations: who may sign a certificate of release to service or defer a defect, on which types
// and for which work. EASA Part-145 145.A.30 and 145.A.35 (from memory): the organisation issues each certifying
// person an authorisation whose scope (licence category, aircraft types, and the work it covers) is written down,
// and which is valid only until its expiry date.
import { ambientTranslate, say, type Translate } from '../i18n/translate';
import { ataChapterWords } from './ata';
import { formatDay } from './when';
import { joined, phrase, type Phrase } from '../i18n/phrase';
import { languageOfTranslate } from './words';

export const licenceCategories = ['A', 'B1', 'B2', 'B3', 'C'] as const;
export type LicenceCategory = (typeof licenceCategories)[number];

export { ataChapters, ataChapterWords, ataScopes, type AtaScope } from './ata';

/** An authorisation as a signature keeps it: what it covered on the day it was used. */
export interface AuthorisationTerms {
  category: string;
  reference?: string;
  typeCodes: readonly string[];
  scope: readonly string[];
  expiresOn: string;
}

/** "B1 (TIA-A-12) for RX-4, RL-2, all chapters of the type, until 1 Dec 2027", in the translate function's language. */
export function authorisationWords(a: AuthorisationTerms, t: Translate = ambientTranslate()): string {
  const chapters = a.scope.includes('all')
    ? say(t, 'words:authorisation.allChapters')
    : a.scope.map((c) => ataChapterWords(c, t)).join(', ');
  const values = {
    category: a.category,
    reference: a.reference,
    types: a.typeCodes.join(', '),
    chapters,
    until: formatDay(a.expiresOn, languageOfTranslate(t)),
  };
  return say(
    t,
    a.reference ? 'words:authorisation.inWordsWithReference' : 'words:authorisation.inWords',
    values,
  );
}

export interface Authorisation {
  category: LicenceCategory;
  /** Type codes covered, for example ["RX-4"]. */
  typeCodes: readonly string[];
  /** ATA chapters covered, or ["all"]. */
  scope: readonly string[];
  /** Last calendar day (UTC) on which it is valid, "YYYY-MM-DD". */
  expiresOn: string;
  /** When it was withdrawn, if it was. */
  revokedAt?: Date | string | null;
}

/** What a signature needs: the type, and the ATA chapters of the work (empty or null: unclassified work). */
export interface WorkScope {
  typeCode: string;
  chapters: readonly (string | null)[];
}

export type Cover = { ok: true } | { ok: false; reason: Phrase };

const endOfDayUtc = (day: string) => {
  const [y, m, d] = day.split('-').map(Number);
  return Date.UTC(y ?? 0, (m ?? 1) - 1, d ?? 1, 23, 59, 59, 999);
};

/**
 * Whether one authorisation covers this work at this instant. Valid through the whole of its expiry day (UTC).
 * Unclassified work (no chapter) needs an authorisation for all chapters of the type.
 */
export function authorisationCovers(auth: Authorisation, work: WorkScope, at: Date | string): Cover {
  const when = (at instanceof Date ? at : new Date(at)).getTime();
  if (auth.revokedAt && new Date(auth.revokedAt).getTime() <= when)
    return { ok: false, reason: phrase('authorisationWithdrawn') };
  if (when > endOfDayUtc(auth.expiresOn))
    return { ok: false, reason: phrase('authorisationExpired', { day: { day: auth.expiresOn } }) };
  if (!auth.typeCodes.includes(work.typeCode)) {
    return {
      ok: false,
      reason:
        auth.typeCodes.length === 0
          ? phrase('authorisationNoType', { type: work.typeCode })
          : phrase('authorisationOtherTypes', { types: auth.typeCodes.join(', '), type: work.typeCode }),
    };
  }
  if (!auth.scope.includes('all')) {
    const outside = [...new Set(work.chapters)].filter((c) => c === null || !auth.scope.includes(c));
    if (outside.length > 0)
      return { ok: false, reason: phrase('authorisationChapters', { chapters: { chapters: outside } }) };
  }
  return { ok: true };
}

/** The first of a person's authorisations that covers the work, or the reason none does. */
export function coveringAuthorisation<A extends Authorisation>(
  auths: readonly A[],
  work: WorkScope,
  at: Date | string,
): { ok: true; authorisation: A } | { ok: false; reason: Phrase } {
  if (auths.length === 0) return { ok: false, reason: phrase('noAuthorisationRecorded') };
  const reasons = new Map<string, Phrase>();
  for (const auth of auths) {
    const cover = authorisationCovers(auth, work, at);
    if (cover.ok) return { ok: true, authorisation: auth };
    reasons.set(JSON.stringify(cover.reason), cover.reason);
  }
  return { ok: false, reason: joined([...reasons.values()], 'semicolon') };
}
