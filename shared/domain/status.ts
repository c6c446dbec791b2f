import type { AirframeState, UnserviceableCause } from '../schemas/airframes';
import type { CheckKind, ValidityWindow, Verdict } from '../schemas/limits';
import { authorisationCovers, type Authorisation } from './authorisation';
import { deferralState, type DeferralLimit, type DeferralState, type Usage } from './deferral';
import { nextLocalTime } from './local-time';
import { instantValue, phrase, type Phrase } from '../i18n/phrase';

// One rule for whether an airframe may fly, used by the kiosk, the board, the pilot view, the handover, the
// e-mail and the API alike. Every finding counts, from every kind of check, until the records show it cleared:
// - a SERVICE finding clears with a later signed reading of the same checkpoint in limits;
// - an OUT OF LIMITS finding clears only through its hold's release, countersigned by someone other than the
//   signer of the check and of the re-check, holding a certifying authorisation that covers the type and the
//   work (EASA Part-145 145.A.30 and 145.A.50, from memory);
// - a defect counts until it is rectified and certified, or deferred within its limit.
// "Released" is kept for an airframe with a certificate of release to service in force: one signed after the
// last finding, defect or deferral. Without one, a serviceable airframe with a valid pre-flight reads
// "checks in limits", which claims no release.

export type { AirframeState, UnserviceableCause };

/** A signature given under the rules in force before certifying authorisations were recorded. */
export type Authority = Authorisation | 'legacy' | null;

export interface ReadingVerdict {
  code: string;
  /** The checkpoint's words, for reasons people read. */
  label?: string;
  verdict: Verdict;
  /** The checkpoint's ATA chapter, for the scope of the work a release certifies. */
  ata?: string | null;
}

export interface SignedCheck {
  id: string;
  kind: CheckKind;
  signedAt: Date | string;
  /** Staff id of the mechanic who signed. */
  signedBy: string;
  /** The check's overall verdict: the worst of its readings. */
  verdict: Verdict;
  /**
   * The check's readings as judged. The caller gives every reading not in limits, and for each checkpoint with a
   * SERVICE finding at least its latest reading in limits; readings of other checkpoints may be left out.
   */
  readings: readonly ReadingVerdict[];
  /** Flights flown since the check was signed; counts against a window given in flights. */
  flightsSince?: number;
}

export interface CheckInProgress {
  id: string;
  kind: CheckKind;
  startedAt: Date | string;
  startedBy: string;
}

export interface Countersign {
  by: string;
  at: Date | string;
  decision: 'release' | 'keep';
  /** Who signed the passing re-check a release rests on: they cannot certify it. */
  recheckBy?: string | null;
  /** The signer's authorisation as it stood at signing; 'legacy' for releases signed before they were kept. */
  authorisation?: Authority;
}

export interface Hold {
  id: string;
  /** The signed check whose finding raised the hold. */
  checkId?: string;
  openedAt: Date | string;
  reason: string;
  /** Who signed the check that raised the hold; that person cannot countersign its release. */
  raisedBy: string;
  /** ATA chapters of the findings (null: unclassified): the release must be authorised for them. */
  chapters?: readonly (string | null)[];
  /** Flight controls disturbed or a checkpoint that says so: a second person inspects before release. */
  needsIndependentInspection?: boolean;
  /** Who recorded the corrective actions: an independent inspection must come from someone else. */
  correctiveActionsBy?: readonly string[];
  inspections?: readonly { by: string; at: Date | string }[];
  countersigns?: readonly Countersign[];
}

export type DefectEntry =
  | { kind: 'work'; at: Date | string; by: string; independentInspection?: boolean }
  | { kind: 'inspection'; at: Date | string; by: string }
  | { kind: 'certification'; at: Date | string; by: string; authorisation?: Authority }
  | { kind: 'deferral'; at: Date | string; by: string; authorisation?: Authority; limit: DeferralLimit };

export interface Defect {
  id: string;
  /** The tech-log number people quote. */
  number: number;
  raisedAt: Date | string;
  raisedBy: string;
  description: string;
  /** ATA chapter of the defect, null when nobody classified it. */
  chapter: string | null;
  /** The hold it belongs to, for a finding out of limits: it clears with the hold's release. */
  holdId?: string | null;
  needsIndependentInspection?: boolean;
  entries: readonly DefectEntry[];
}

/** A certificate of release to service for the whole airframe. */
export interface Certificate {
  at: Date | string;
  by: string;
  authorisation?: Authority;
  /** ATA chapters of the work it certifies. */
  chapters?: readonly (string | null)[];
}

export interface AirframeStatusInput {
  now: Date | string;
  /** The type's time zone, for windows that end at a local clock time. */
  timeZone: string;
  /** The airframe's type code, which every certifying signature must be authorised for. */
  typeCode?: string;
  validity: Partial<Record<CheckKind, ValidityWindow>>;
  checks: readonly SignedCheck[];
  inProgress?: readonly CheckInProgress[];
  holds?: readonly Hold[];
  defects?: readonly Defect[];
  certificates?: readonly Certificate[];
  /** The airframe's hours and flights now, for deferral limits. */
  usage?: Usage;
}

export interface DueItem {
  kind: CheckKind;
  /** The instant the latest check of this kind stops being valid; null when only a flight count limits it, or none was signed. */
  at: Date | null;
  expired: boolean;
  reason: Phrase;
}

export interface OpenFinding {
  checkId: string;
  kind: CheckKind;
  code: string;
  label: string;
  verdict: Exclude<Verdict, 'in_limits'>;
  signedAt: Date;
}

export type DefectStatus = 'open' | 'deferred' | 'deferral_expired' | 'rectified';

export interface DefectState {
  id: string;
  number: number;
  description: string;
  status: DefectStatus;
  /** Why it is still open, or its deferral's limit. */
  reason: Phrase;
  deferral: (DeferralState & { limit: DeferralLimit; at: Date }) | null;
}

export interface AirframeStatus {
  state: AirframeState;
  /** Why the airframe is unserviceable; empty otherwise. */
  causes: UnserviceableCause[];
  /** Why, as phrases each reader writes in its own language. */
  reasons: Phrase[];
  /** Until when the pre-flight holds (exclusive), when the state rests on it. */
  validUntil?: Date;
  due: DueItem[];
  openHolds: string[];
  findings: OpenFinding[];
  /** Defects not rectified: open, deferred, or deferred past their limit. */
  defects: DefectState[];
  /** The certificate of release to service in force, if one is. */
  release: { at: Date; by: string } | null;
}

function toDate(at: Date | string): Date {
  const date = at instanceof Date ? at : new Date(at);
  if (Number.isNaN(date.getTime())) throw new Error(`'${String(at)}' is not a date and time.`);
  return date;
}

const time = (at: Date | string) => toDate(at).getTime();

/**
 * The instant a check stops being valid: the earliest of its hours limit and its local clock limit; null when
 * neither applies. Valid up to, not including, this instant.
 */
export function checkValidUntil(
  signedAt: Date | string,
  window: ValidityWindow,
  timeZone: string,
): Date | null {
  const signed = toDate(signedAt);
  const limits: number[] = [];
  if (window.hours !== undefined) limits.push(signed.getTime() + window.hours * 3_600_000);
  if (window.untilLocalTime !== undefined)
    limits.push(nextLocalTime(signed, window.untilLocalTime, timeZone).getTime());
  return limits.length === 0 ? null : new Date(Math.min(...limits));
}

/** Why a signed release does not count, or null when it does. */
export function releaseProblem(
  sign: Pick<Countersign, 'by' | 'at' | 'recheckBy' | 'authorisation'>,
  work: { typeCode: string; chapters: readonly (string | null)[] },
): Phrase | null {
  if (sign.recheckBy && sign.recheckBy === sign.by) return phrase('certifiedByRecheckSigner');
  if (sign.authorisation === 'legacy') return null;
  if (!sign.authorisation) return phrase('signerNotAuthorised');
  const cover = authorisationCovers(sign.authorisation, work, sign.at);
  return cover.ok ? null : cover.reason;
}

function latestCountersign(hold: Hold, now: Date): Countersign | undefined {
  const valid = (hold.countersigns ?? []).filter(
    (sign) => sign.by !== hold.raisedBy && time(sign.at) <= now.getTime(),
  );
  return valid.sort((a, b) => time(a.at) - time(b.at)).at(-1);
}

/** Why this hold's latest release does not release it; null when there is no release to judge or it holds. */
export function holdReleaseProblem(hold: Hold, now: Date | string, typeCode = ''): Phrase | null {
  const last = latestCountersign(hold, toDate(now));
  if (last?.decision !== 'release') return null;
  const problem = releaseProblem(last, { typeCode, chapters: hold.chapters ?? [] });
  if (problem) return problem;
  if (hold.needsIndependentInspection) {
    const doers = new Set(hold.correctiveActionsBy ?? []);
    const inspected = (hold.inspections ?? []).some((i) => !doers.has(i.by) && time(i.at) <= time(last.at));
    if (!inspected) return phrase('inspectionAfterRelease');
  }
  return null;
}

/**
 * Open until its latest countersign, by someone other than the check's signer, is a release that counts: given
 * by certifying staff authorised for the type and the work, not the re-check's signer, and after any independent
 * inspection the hold needs.
 */
export function isHoldOpen(hold: Hold, now: Date | string, typeCode = ''): boolean {
  const at = toDate(now);
  if (time(hold.openedAt) > at.getTime()) return false;
  if (latestCountersign(hold, at)?.decision !== 'release') return true;
  return holdReleaseProblem(hold, at, typeCode) !== null;
}

export interface CountersignDecision {
  allowed: boolean;
  reason?: string;
}

/** A countersign is a second person's judgement; the signer of the check cannot give it. */
export function canCountersign(hold: Pick<Hold, 'raisedBy'>, countersignerId: string): CountersignDecision {
  if (countersignerId === hold.raisedBy) {
    return {
      allowed: false,
      reason: 'The person who signed the check cannot countersign its hold. Ask another shift lead.',
    };
  }
  return { allowed: true };
}

interface DefectContext {
  now: Date;
  typeCode: string;
  usage: Usage;
  timeZone: string;
  holdOpen: (holdId: string) => boolean;
}

/** Why the latest certification of a defect does not rectify it, or null when it does. */
function certificationProblem(defect: Defect, entries: readonly DefectEntry[], typeCode: string) {
  const cert = entries.filter((e) => e.kind === 'certification').at(-1);
  if (!cert) return phrase('defectNotRectified');
  const work = entries.filter((e) => e.kind === 'work' && time(e.at) <= time(cert.at));
  if (work.length === 0) return phrase('defectNoWork');
  const problem = releaseProblem(cert, { typeCode, chapters: [defect.chapter] });
  if (problem) return phrase('certificationNotCounting', { problem: { phrase: problem } });
  const needsInspection =
    defect.needsIndependentInspection === true ||
    work.some((e) => e.kind === 'work' && e.independentInspection === true);
  if (needsInspection) {
    const doers = new Set(work.map((e) => e.by));
    const lastWork = Math.max(...work.map((e) => time(e.at)));
    const inspected = entries.some(
      (e) =>
        e.kind === 'inspection' && !doers.has(e.by) && time(e.at) >= lastWork && time(e.at) <= time(cert.at),
    );
    if (!inspected) return phrase('inspectionMissing');
  }
  return null;
}

/** A defect's standing now: rectified, deferred (with its countdown), deferred past its limit, or open. */
export function defectState(defect: Defect, ctx: DefectContext): DefectState {
  const entries = defect.entries
    .filter((e) => time(e.at) <= ctx.now.getTime())
    .sort((a, b) => time(a.at) - time(b.at));
  const base = { id: defect.id, number: defect.number, description: defect.description, deferral: null };
  if (defect.holdId) {
    return ctx.holdOpen(defect.holdId)
      ? { ...base, status: 'open', reason: phrase('defectOnHold') }
      : { ...base, status: 'rectified', reason: phrase('defectHoldReleased') };
  }
  const problem = certificationProblem(defect, entries, ctx.typeCode);
  if (problem === null) return { ...base, status: 'rectified', reason: phrase('defectRectified') };
  const deferral = entries
    .filter(
      (e): e is Extract<DefectEntry, { kind: 'deferral' }> =>
        e.kind === 'deferral' &&
        releaseProblem(e, { typeCode: ctx.typeCode, chapters: [defect.chapter] }) === null,
    )
    .at(-1);
  if (!deferral) return { ...base, status: 'open', reason: problem };
  // Said in UTC, as records are: the limit itself is the end of the base's local day.
  const state = deferralState(deferral.limit, ctx.now, ctx.usage);
  return {
    ...base,
    status: state.expired ? 'deferral_expired' : 'deferred',
    reason:
      state.expired && state.reason
        ? phrase('deferralRanOut', { reason: { phrase: state.reason } })
        : phrase('deferred', { limit: { phrase: state.until } }),
    deferral: { ...state, limit: deferral.limit, at: toDate(deferral.at) },
  };
}

function latestOf(checks: readonly SignedCheck[], kind: CheckKind): SignedCheck | undefined {
  return checks
    .filter((check) => check.kind === kind)
    .sort((a, b) => time(a.signedAt) - time(b.signedAt))
    .at(-1);
}

function dueItem(
  check: SignedCheck,
  kind: CheckKind,
  window: ValidityWindow,
  timeZone: string,
  now: Date,
): DueItem {
  const at = checkValidUntil(check.signedAt, window, timeZone);
  const flightsUsed = window.flights !== undefined && (check.flightsSince ?? 0) >= window.flights;
  const timeUsed = at !== null && now.getTime() >= at.getTime();
  const label = { checkKind: kind };
  const signed = instantValue(check.signedAt);
  const reason = flightsUsed
    ? phrase('usedUpByFlights', { kind: label, signed, count: check.flightsSince ?? 0 })
    : timeUsed
      ? phrase('ranOut', { kind: label, signed, at: instantValue(at) })
      : at === null
        ? window.flights === undefined
          ? phrase('validWithNoLimit', { kind: label })
          : phrase('validForFlights', { kind: label, count: window.flights })
        : phrase('validUntil', { kind: label, at: instantValue(at) });
  return { kind, at, expired: flightsUsed || timeUsed, reason };
}

/**
 * Findings not yet cleared: a SERVICE reading with no later reading of its checkpoint in limits, and an OUT OF
 * LIMITS reading whose check has no hold, or a hold still open.
 */
export function openFindings(
  checks: readonly SignedCheck[],
  holdOpenForCheck: (checkId: string) => boolean | undefined,
): OpenFinding[] {
  const sorted = [...checks].sort((a, b) => time(a.signedAt) - time(b.signedAt));
  const lastInLimits = new Map<string, number>();
  for (const check of sorted) {
    for (const reading of check.readings) {
      if (reading.verdict === 'in_limits') lastInLimits.set(reading.code, time(check.signedAt));
    }
  }
  const open: OpenFinding[] = [];
  for (const check of sorted) {
    for (const reading of check.readings) {
      if (reading.verdict === 'in_limits') continue;
      const cleared =
        reading.verdict === 'service'
          ? (lastInLimits.get(reading.code) ?? -Infinity) > time(check.signedAt)
          : holdOpenForCheck(check.id) === false;
      if (!cleared) {
        open.push({
          checkId: check.id,
          kind: check.kind,
          code: reading.code,
          label: reading.label ?? reading.code,
          verdict: reading.verdict,
          signedAt: toDate(check.signedAt),
        });
      }
    }
  }
  return open;
}

export function findingPhrase(f: OpenFinding): Phrase {
  return phrase(f.verdict === 'service' ? 'findingService' : 'findingOutOfLimits', {
    label: f.label,
    kind: { checkKind: f.kind, inSentence: true },
    at: instantValue(f.signedAt),
  });
}

/** The newest certificate of release to service that counts, from any of the acts that give one. */
function lastCertificate(
  input: AirframeStatusInput,
  holds: readonly Hold[],
  defects: readonly Defect[],
  now: Date,
): { at: Date; by: string } | null {
  const typeCode = input.typeCode ?? '';
  const certs: { at: Date; by: string }[] = [];
  for (const cert of input.certificates ?? []) {
    if (time(cert.at) > now.getTime()) continue;
    if (releaseProblem(cert, { typeCode, chapters: cert.chapters ?? [] }) === null)
      certs.push({ at: toDate(cert.at), by: cert.by });
  }
  for (const hold of holds) {
    const last = latestCountersign(hold, now);
    if (last?.decision === 'release' && holdReleaseProblem(hold, now, typeCode) === null)
      certs.push({ at: toDate(last.at), by: last.by });
  }
  for (const defect of defects) {
    const entries = defect.entries.filter((e) => time(e.at) <= now.getTime());
    const cert = entries.filter((e) => e.kind === 'certification').at(-1);
    if (cert && !defect.holdId && certificationProblem(defect, entries, typeCode) === null)
      certs.push({ at: toDate(cert.at), by: cert.by });
  }
  return certs.sort((a, b) => a.at.getTime() - b.at.getTime()).at(-1) ?? null;
}

/** The newest act that changed what a release has to certify: a finding, a hold, a defect or a deferral. */
function lastChange(
  checks: readonly SignedCheck[],
  holds: readonly Hold[],
  defects: readonly Defect[],
  now: Date,
) {
  const instants = [
    ...checks.filter((c) => c.readings.some((r) => r.verdict !== 'in_limits')).map((c) => time(c.signedAt)),
    ...holds.map((h) => time(h.openedAt)),
    ...defects.map((d) => time(d.raisedAt)),
    ...defects.flatMap((d) => d.entries.filter((e) => e.kind === 'deferral').map((e) => time(e.at))),
  ].filter((t) => t <= now.getTime());
  return instants.length ? Math.max(...instants) : -Infinity;
}

/** Each kind of check with a validity window: when its latest runs out, or that no pre-flight was signed. */
function dueItems(input: AirframeStatusInput, signed: readonly SignedCheck[], now: Date): DueItem[] {
  const due: DueItem[] = [];
  for (const [kind, window] of Object.entries(input.validity) as [CheckKind, ValidityWindow | undefined][]) {
    const latest = latestOf(signed, kind);
    if (window === undefined) continue;
    if (latest === undefined) {
      if (kind === 'pre_flight') due.push({ kind, at: null, expired: true, reason: phrase('noPreFlight') });
      continue;
    }
    due.push(dueItem(latest, kind, window, input.timeZone, now));
  }
  return due;
}

interface Standing {
  now: Date;
  typeCode: string;
  holds: readonly Hold[];
  openHolds: readonly Hold[];
  defects: readonly Defect[];
  defectStates: DefectState[];
  findings: OpenFinding[];
  holdOpenForCheck: (checkId: string) => boolean | undefined;
}

/** Every cause that makes the airframe unserviceable, each with the words that name it. */
function unserviceability(s: Standing) {
  const causes: UnserviceableCause[] = [];
  const reasons: Phrase[] = [];
  const service = s.findings.filter((f) => f.verdict === 'service');
  const unheld = s.findings.filter(
    (f) => f.verdict === 'out_of_limits' && s.holdOpenForCheck(f.checkId) === undefined,
  );
  if (service.length > 0) {
    causes.push('service_needed');
    reasons.push(...service.map(findingPhrase));
  }
  if (s.openHolds.length > 0 || unheld.length > 0) {
    causes.push('on_hold');
    for (const hold of s.openHolds) {
      const problem = holdReleaseProblem(hold, s.now, s.typeCode);
      reasons.push(
        problem
          ? phrase('onHoldReleaseNotCounting', { reason: hold.reason, problem: { phrase: problem } })
          : phrase('onHold', { reason: hold.reason }),
      );
    }
    reasons.push(...unheld.map(findingPhrase));
  }
  const ownDefects = s.defectStates.filter((d) => !s.defects.find((x) => x.id === d.id)?.holdId);
  const open = ownDefects.filter((d) => d.status === 'open');
  if (open.length > 0) {
    causes.push('open_defect');
    reasons.push(
      ...open.map((d) =>
        phrase('defectOpen', { number: d.number, reason: { phrase: d.reason }, description: d.description }),
      ),
    );
  }
  const expired = ownDefects.filter((d) => d.status === 'deferral_expired');
  if (expired.length > 0) {
    causes.push('deferral_expired');
    reasons.push(
      ...expired.map((d) => phrase('defectExpired', { number: d.number, reason: { phrase: d.reason } })),
    );
  }
  return { causes, reasons };
}

/** Holds, findings and defects as they stand at the input's instant. */
function standingOf(input: AirframeStatusInput, signed: readonly SignedCheck[], now: Date): Standing {
  const typeCode = input.typeCode ?? '';
  const holds = (input.holds ?? []).filter((h) => time(h.openedAt) <= now.getTime());
  const defects = (input.defects ?? []).filter((d) => time(d.raisedAt) <= now.getTime());
  const usage = input.usage ?? { hours: 0, flights: 0 };
  const holdOpen = new Map(holds.map((h) => [h.id, isHoldOpen(h, now, typeCode)]));
  const holdOpenForCheck = (checkId: string) => {
    const own = holds.filter((h) => h.checkId === checkId);
    return own.length === 0 ? undefined : own.some((h) => holdOpen.get(h.id));
  };
  const defectStates = defects
    .map((d) =>
      defectState(d, {
        now,
        typeCode,
        usage,
        timeZone: input.timeZone,
        holdOpen: (id) => holdOpen.get(id) ?? false,
      }),
    )
    .filter((d) => d.status !== 'rectified');
  return {
    now,
    typeCode,
    holds,
    openHolds: holds.filter((h) => holdOpen.get(h.id)),
    defects,
    defectStates,
    findings: openFindings(signed, holdOpenForCheck),
    holdOpenForCheck,
  };
}

/**
 * The airframe's state, in this order: unserviceable (any open finding, hold, defect or expired deferral, each
 * named as a cause) -> in progress -> not checked -> due (the pre-flight ran out; valid up to, not including, its
 * expiry instant) -> released (a certificate of release to service in force) or checks in limits.
 */
export function deriveAirframeStatus(input: AirframeStatusInput): AirframeStatus {
  const now = toDate(input.now);
  const inProgress = input.inProgress ?? [];
  const signed = input.checks.filter((check) => time(check.signedAt) <= now.getTime());
  const standing = standingOf(input, signed, now);
  const { holds, defects, defectStates } = standing;
  const { causes, reasons } = unserviceability(standing);
  const certificate = lastCertificate(input, holds, defects, now);
  const changed = lastChange(signed, holds, defects, now);
  const inForce = certificate && certificate.at.getTime() >= changed ? certificate : null;
  const result = (state: AirframeState, stateReasons: Phrase[]): AirframeStatus => ({
    state,
    causes,
    reasons: stateReasons,
    due: dueItems(input, signed, now),
    openHolds: standing.openHolds.map((h) => h.id),
    findings: standing.findings,
    defects: defectStates,
    release: inForce,
  });

  if (causes.length > 0) return result('unserviceable', reasons);
  if (inProgress.length > 0) {
    return result(
      'in_progress',
      inProgress.map((c) =>
        phrase('inProgressSince', { kind: { checkKind: c.kind }, at: instantValue(c.startedAt) }),
      ),
    );
  }
  const preFlight = latestOf(signed, 'pre_flight');
  if (preFlight === undefined) return result('not_checked', [phrase('noPreFlight')]);
  const preFlightDue = dueItem(preFlight, 'pre_flight', input.validity.pre_flight ?? {}, input.timeZone, now);
  if (preFlightDue.expired) return result('due', [preFlightDue.reason]);
  const deferred = defectStates.map((d) =>
    phrase('defectDeferred', { number: d.number, reason: { phrase: d.reason }, description: d.description }),
  );
  const status = inForce
    ? result('released', [
        phrase('releaseSigned', { at: instantValue(inForce.at) }),
        preFlightDue.reason,
        ...deferred,
      ])
    : result('checks_in_limits', [
        preFlightDue.reason,
        changed === -Infinity ? phrase('noRelease') : phrase('noReleaseSinceChange'),
        ...deferred,
      ]);
  if (preFlightDue.at !== null) status.validUntil = preFlightDue.at;
  return status;
}

export interface ReleaseScope {
  /** The last certificate of release to service that counts, if any. */
  since: Date | null;
  /** ATA chapters of the findings and defects since then: what a new release certifies. */
  chapters: (string | null)[];
  /** Who signed a re-check that cleared a finding since then: they cannot certify its release. */
  recheckSigners: string[];
}

/** What a certificate of release to service signed now would cover, and who may not sign it. */
export function releaseScope(input: AirframeStatusInput): ReleaseScope {
  const now = toDate(input.now);
  const holds = (input.holds ?? []).filter((h) => time(h.openedAt) <= now.getTime());
  const defects = (input.defects ?? []).filter((d) => time(d.raisedAt) <= now.getTime());
  const signed = input.checks
    .filter((c) => time(c.signedAt) <= now.getTime())
    .sort((a, b) => time(a.signedAt) - time(b.signedAt));
  const since = lastCertificate(input, holds, defects, now)?.at ?? null;
  const after = (at: Date | string) => since === null || time(at) > since.getTime();
  const chapters = new Set<string | null>();
  for (const check of signed.filter((c) => after(c.signedAt)))
    for (const r of check.readings) if (r.verdict !== 'in_limits') chapters.add(r.ata ?? null);
  for (const d of defects) {
    if (after(d.raisedAt) || d.entries.some((e) => after(e.at))) chapters.add(d.chapter);
  }
  const serviced = new Set<string>();
  const recheckSigners = new Set<string>();
  for (const check of signed) {
    for (const r of check.readings) {
      if (r.verdict === 'service') serviced.add(r.code);
      else if (r.verdict === 'in_limits' && serviced.has(r.code) && after(check.signedAt))
        recheckSigners.add(check.signedBy);
    }
  }
  return { since, chapters: [...chapters], recheckSigners: [...recheckSigners] };
}
