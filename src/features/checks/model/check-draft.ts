import type { CheckContext, CheckKind, ReadingEntry, Unit } from '../../../../shared/schemas/limits';

export type StepId = 'context' | 'review' | 'sign' | `cp:${string}`;

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
  step: StepId;
  savedAt: number;
}

export interface DraftOwner {
  kioskId: number;
  badge: string;
}

// Kept for the owner for 30 minutes after the last change; after that a fresh start is safer than old readings.
const keepMs = 30 * 60_000;

const draftKey = (owner: DraftOwner, airframeId: number, kind: CheckKind) => `gw.check.${owner.kioskId}.${owner.badge}.${airframeId}.${kind}`;
const ambientKey = (kioskId: number) => `gw.ambientC.${kioskId}`;

export function loadDraft(owner: DraftOwner, airframeId: number, kind: CheckKind): CheckDraft | null {
  try {
    const raw = localStorage.getItem(draftKey(owner, airframeId, kind));
    if (!raw) return null;
    const draft = JSON.parse(raw) as CheckDraft;
    if (Date.now() - draft.savedAt > keepMs) {
      localStorage.removeItem(draftKey(owner, airframeId, kind));
      return null;
    }
    return draft;
  } catch {
    return null;
  }
}

export function saveDraft(owner: DraftOwner, draft: CheckDraft): void {
  localStorage.setItem(draftKey(owner, draft.airframeId, draft.kind), JSON.stringify({ ...draft, savedAt: Date.now() }));
}

export function discardDraft(owner: DraftOwner, airframeId: number, kind: CheckKind): void {
  localStorage.removeItem(draftKey(owner, airframeId, kind));
}

export function newDraft(owner: DraftOwner, airframeId: number, kind: CheckKind): CheckDraft {
  const remembered = lastAmbientC(owner.kioskId);
  return {
    id: crypto.randomUUID(),
    airframeId,
    kind,
    context: remembered === null ? {} : { ambientTempC: remembered },
    ambientFromMemory: remembered !== null,
    tempUnit: 'C',
    readings: {},
    units: {},
    step: 'context',
    savedAt: Date.now(),
  };
}

export function lastAmbientC(kioskId: number): number | null {
  const raw = localStorage.getItem(ambientKey(kioskId));
  const value = raw === null ? NaN : Number(raw);
  return Number.isFinite(value) ? value : null;
}

export function rememberAmbientC(kioskId: number, value: number): void {
  localStorage.setItem(ambientKey(kioskId), String(value));
}
