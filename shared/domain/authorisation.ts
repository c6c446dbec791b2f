// Certifying authorisations: who may sign a certificate of release to service or defer a defect, on which types
// and for which work. EASA Part-145 145.A.30 and 145.A.35 (from memory): the organisation issues each certifying
// person an authorisation whose scope (licence category, aircraft types, and the work it covers) is written down,
// and which is valid only until its expiry date.
import { formatDay } from './when';

export const licenceCategories = ['A', 'B1', 'B2', 'B3', 'C'] as const;
export type LicenceCategory = (typeof licenceCategories)[number];

/** ATA 100 / iSpec 2200 chapters the product's checks touch; "all" is the whole type. */
export const ataChapters = {
  all: 'All chapters of the type',
  '05': 'ATA 05 Time limits and maintenance checks',
  '12': 'ATA 12 Servicing',
  '27': 'ATA 27 Flight controls',
  '29': 'ATA 29 Hydraulic power',
  '32': 'ATA 32 Landing gear',
  '62': 'ATA 62 Main rotor',
  '64': 'ATA 64 Tail rotor',
  '67': 'ATA 67 Rotor flight controls',
} as const;
export type AtaScope = keyof typeof ataChapters;

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

export type Cover = { ok: true } | { ok: false; reason: string };

const endOfDayUtc = (day: string) => {
  const [y, m, d] = day.split('-').map(Number);
  return Date.UTC(y ?? 0, (m ?? 1) - 1, d ?? 1, 23, 59, 59, 999);
};

const chapterWords = (chapter: string | null) =>
  chapter === null
    ? 'work not classified by ATA chapter'
    : (ataChapters[chapter as AtaScope] ?? `ATA ${chapter}`);

/**
 * Whether one authorisation covers this work at this instant. Valid through the whole of its expiry day (UTC).
 * Unclassified work (no chapter) needs an authorisation for all chapters of the type.
 */
export function authorisationCovers(auth: Authorisation, work: WorkScope, at: Date | string): Cover {
  const when = (at instanceof Date ? at : new Date(at)).getTime();
  if (auth.revokedAt && new Date(auth.revokedAt).getTime() <= when)
    return { ok: false, reason: 'the authorisation was withdrawn' };
  if (when > endOfDayUtc(auth.expiresOn))
    return { ok: false, reason: `the authorisation expired on ${formatDay(auth.expiresOn)}` };
  if (!auth.typeCodes.includes(work.typeCode)) {
    return {
      ok: false,
      reason: `the authorisation covers ${auth.typeCodes.join(', ') || 'no type'}, not ${work.typeCode}`,
    };
  }
  if (!auth.scope.includes('all')) {
    const outside = [...new Set(work.chapters)].filter((c) => c === null || !auth.scope.includes(c));
    if (outside.length > 0)
      return {
        ok: false,
        reason: `the authorisation does not cover ${outside.map(chapterWords).join(', ')}`,
      };
  }
  return { ok: true };
}

/** The first of a person's authorisations that covers the work, or the reason none does. */
export function coveringAuthorisation<A extends Authorisation>(
  auths: readonly A[],
  work: WorkScope,
  at: Date | string,
): { ok: true; authorisation: A } | { ok: false; reason: string } {
  if (auths.length === 0)
    return { ok: false, reason: 'no certifying authorisation is recorded for this person' };
  const reasons: string[] = [];
  for (const auth of auths) {
    const cover = authorisationCovers(auth, work, at);
    if (cover.ok) return { ok: true, authorisation: auth };
    reasons.push(cover.reason);
  }
  return { ok: false, reason: [...new Set(reasons)].join('; ') };
}
