import type { CheckContext, CheckKind, ReadingEntry, Unit } from '@shared/schemas/limits';
import type { UsageFigures } from '@shared/schemas/usage';
import { tabletDelete, tabletEntries, tabletGet, tabletSet } from '@/lib/tablet-store';

export type StepId = 'context' | 'usage' | 'review' | 'sign' | `cp:${string}`;

/** Fluid added at a level checkpoint; the checkpoint's reading is the level re-read after it. */
export interface ServicingDraft {
  /** As measured: what went in, not the estimate to the mark. */
  quantity: { value: number; unit: 'L' | 'US_qt' };
  fluidSpec: string;
  batch: string;
  /** "YYYY-MM-DD", the day the can was opened. */
  canOpenedOn: string;
  /** A servicing cart's tool number, when the fluid was pumped from one. */
  tool?: string;
  /** The first reading, the one that showed the fluid was needed. */
  levelBefore: ReadingEntry;
}

export interface PhotoRef {
  id: string;
  mimeType: string;
  sizeBytes: number;
}

/** Everything typed so far for one check; kept on the tablet so a reload or an idle lock costs nothing. */
export interface CheckDraft {
  /** Made on the tablet; the server's idempotency key, so a resend after a dropped answer is stored once. */
  id: string;
  airframeId: number;
  kind: CheckKind;
  context: CheckContext;
  /** True while the ambient temperature is the tablet's last value and not yet confirmed by a touch. */
  ambientFromMemory: boolean;
  tempUnit: 'C' | 'F';
  readings: Record<string, ReadingEntry>;
  /** The unit each checkpoint is shown in (what the gauge reads). */
  units: Record<string, Unit>;
  servicing: Record<string, ServicingDraft>;
  /** The tool number each reading was taken with, by checkpoint code. */
  tools: Record<string, string>;
  photos: Record<string, PhotoRef[]>;
  note: string;
  /** After-flight: the airframe's hours, flights and landings as entered; unset until the step is passed. */
  usage?: UsageFigures;
  step: StepId;
  savedAt: number;
}

export interface DraftOwner {
  kioskId: number;
  badge: string;
}

// Kept for the owner for 30 minutes after the last change; after that a fresh start is safer than old readings.
// The key holds the badge, so the next person at the tablet never sees someone else's half-done check.
export const draftKeepMs = 30 * 60_000;

const draftPrefix = 'draft:';
const draftKey = (owner: DraftOwner, airframeId: number, kind: CheckKind) =>
  `${draftPrefix}${owner.kioskId}:${owner.badge}:${airframeId}:${kind}`;
const ambientKey = (kioskId: number) => `ambient:${kioskId}`;

/** Drafts saved before photos, servicing, tools and notes existed get empty ones. */
function complete(draft: CheckDraft): CheckDraft {
  return {
    ...draft,
    servicing: draft.servicing ?? {},
    tools: draft.tools ?? {},
    photos: draft.photos ?? {},
    note: draft.note ?? '',
    units: draft.units ?? {},
  };
}

export async function loadDraft(
  owner: DraftOwner,
  airframeId: number,
  kind: CheckKind,
): Promise<CheckDraft | null> {
  const key = draftKey(owner, airframeId, kind);
  const draft = await tabletGet<CheckDraft>(key);
  if (!draft) return null;
  if (Date.now() - draft.savedAt > draftKeepMs) {
    await tabletDelete(key);
    return null;
  }
  return complete(draft);
}

export const saveDraft = (owner: DraftOwner, draft: CheckDraft): Promise<void> =>
  tabletSet(draftKey(owner, draft.airframeId, draft.kind), { ...draft, savedAt: Date.now() });

export const discardDraft = (owner: DraftOwner, airframeId: number, kind: CheckKind): Promise<void> =>
  tabletDelete(draftKey(owner, airframeId, kind));

/** Readings left longer than the keep time are removed, whoever started them. */
export async function purgeStaleDrafts(now = Date.now()): Promise<void> {
  const drafts = await tabletEntries<CheckDraft>(draftPrefix);
  await Promise.all(
    drafts.filter(([, draft]) => now - draft.savedAt > draftKeepMs).map(([key]) => tabletDelete(key)),
  );
}

export function newDraft(airframeId: number, kind: CheckKind, rememberedAmbientC: number | null): CheckDraft {
  return {
    id: crypto.randomUUID(),
    airframeId,
    kind,
    context: rememberedAmbientC === null ? {} : { ambientTempC: rememberedAmbientC },
    ambientFromMemory: rememberedAmbientC !== null,
    tempUnit: 'C',
    readings: {},
    units: {},
    servicing: {},
    tools: {},
    photos: {},
    note: '',
    step: 'context',
    savedAt: Date.now(),
  };
}

export async function lastAmbientC(kioskId: number): Promise<number | null> {
  const value = await tabletGet<number>(ambientKey(kioskId));
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}

export const rememberAmbientC = (kioskId: number, value: number): Promise<void> =>
  tabletSet(ambientKey(kioskId), value);

/** The owner's draft if one is kept, else a new one; a tablet whose storage fails still runs the check in memory. */
export async function openDraft(
  owner: DraftOwner,
  airframeId: number,
  kind: CheckKind,
): Promise<{ draft: CheckDraft; stored: boolean }> {
  try {
    void purgeStaleDrafts().catch(() => undefined);
    const kept = await loadDraft(owner, airframeId, kind);
    if (kept) return { draft: kept, stored: true };
    return { draft: newDraft(airframeId, kind, await lastAmbientC(owner.kioskId)), stored: true };
  } catch {
    return { draft: newDraft(airframeId, kind, null), stored: false };
  }
}
