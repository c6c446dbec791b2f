import { ambientTranslate, liveLabels, say, type Translate } from '../i18n/translate';
import type { ToolKind } from './tools';

// The words and input patterns the kiosk's first screen needs, kept free of zod so that screen does not load it.
// The schemas in auth.ts and checks.ts are built from the same patterns and re-export these labels.

export const badgePattern = /^[A-Za-z0-9-]{2,32}$/;
export const pinPattern = /^\d{4,8}$/;

/** A badge as typed or scanned: surrounding spaces do not count. */
export const isBadge = (value: string) => badgePattern.test(value.trim());
export const isPin = (value: string) => pinPattern.test(value);

const checkKindKeys = {
  pre_flight: 'words:checkKind.preFlight',
  ground_run: 'words:checkKind.groundRun',
  after_flight: 'words:checkKind.afterFlight',
  servicing: 'words:checkKind.servicing',
} as const;
export const checkKindLabels = liveLabels(checkKindKeys);

const checkKindInSentenceKeys = {
  pre_flight: 'words:checkKindInSentence.preFlight',
  ground_run: 'words:checkKindInSentence.groundRun',
  after_flight: 'words:checkKindInSentence.afterFlight',
  servicing: 'words:checkKindInSentence.servicing',
} as const satisfies Record<keyof typeof checkKindKeys, string>;

const toolKindKeys = {
  pressure_gauge: 'words:toolKind.pressureGauge',
  nitrogen_charging_kit: 'words:toolKind.nitrogenChargingKit',
  servicing_cart: 'words:toolKind.servicingCart',
} as const satisfies Record<ToolKind, string>;
const toolKindInSentenceKeys = {
  pressure_gauge: 'words:toolKindInSentence.pressureGauge',
  nitrogen_charging_kit: 'words:toolKindInSentence.nitrogenChargingKit',
  servicing_cart: 'words:toolKindInSentence.servicingCart',
} as const satisfies Record<ToolKind, string>;
export const toolKindLabels: Readonly<Record<ToolKind, string>> = liveLabels(toolKindKeys);

const verdictKeys = {
  in_limits: 'words:verdict.inLimits',
  service: 'words:verdict.service',
  out_of_limits: 'words:verdict.outOfLimits',
} as const;
export const verdictLabels = liveLabels(verdictKeys);

const roleKeys = {
  mechanic: 'words:role.mechanic',
  shift_lead: 'words:role.shiftLead',
  pilot: 'words:role.pilot',
  engineering: 'words:role.engineering',
} as const;
export const roleLabels = liveLabels(roleKeys);

// The labels above read in the screen's language whenever they are read (English on the server); code that writes
// for a named language (the server's e-mails, PDFs and exports) asks with its own translate function.
export const checkKindLabel = (kind: keyof typeof checkKindLabels, t: Translate = ambientTranslate()) =>
  say(t, checkKindKeys[kind]);
export const verdictLabel = (verdict: keyof typeof verdictLabels, t: Translate = ambientTranslate()) =>
  say(t, verdictKeys[verdict]);
/** The kind inside a sentence: "pre-flight check" in "Sign the pre-flight check". */
export const checkKindInSentence = (kind: keyof typeof checkKindLabels, t: Translate = ambientTranslate()) =>
  say(t, checkKindInSentenceKeys[kind]);
export const toolKindLabel = (kind: ToolKind, t: Translate = ambientTranslate()) =>
  say(t, toolKindKeys[kind]);
export const toolKindInSentence = (kind: ToolKind, t: Translate = ambientTranslate()) =>
  say(t, toolKindInSentenceKeys[kind]);
export const roleLabel = (role: keyof typeof roleLabels, t: Translate = ambientTranslate()) =>
  say(t, roleKeys[role]);

/** What each audit trail event records, as people say it. */
const auditActionKeys: Record<string, `words:audit.${string}`> = {
  'airframe.accepted': 'words:audit.airframeAccepted',
  'airframe.changed': 'words:audit.airframeChanged',
  'airframe.created': 'words:audit.airframeCreated',
  'airframe.released': 'words:audit.airframeReleased',
  'authorisation.granted': 'words:audit.authorisationGranted',
  'authorisation.revoked': 'words:audit.authorisationRevoked',
  'board_link.created': 'words:audit.boardLinkCreated',
  'board_link.revoked': 'words:audit.boardLinkRevoked',
  'check.signed': 'words:audit.checkSigned',
  'check_draft.closed': 'words:audit.checkDraftClosed',
  'defect.raised': 'words:audit.defectRaised',
  'defect.work': 'words:audit.defectWork',
  'defect.inspection': 'words:audit.defectInspection',
  'defect.certification': 'words:audit.defectCertification',
  'defect.deferral': 'words:audit.defectDeferral',
  'defect.recorded': 'words:audit.defectRecorded',
  'handover.sent': 'words:audit.handoverSent',
  'hold.corrective_action': 'words:audit.holdCorrectiveAction',
  'hold.opened': 'words:audit.holdOpened',
  'hold.released': 'words:audit.holdReleased',
  'kiosk.enrolled': 'words:audit.kioskEnrolled',
  'kiosk.enrolment_created': 'words:audit.kioskEnrolmentCreated',
  'kiosk.placed': 'words:audit.kioskPlaced',
  'kiosk.renamed': 'words:audit.kioskRenamed',
  'kiosk.revoked': 'words:audit.kioskRevoked',
  'limits.draft_saved': 'words:audit.limitsDraftSaved',
  'limits.published': 'words:audit.limitsPublished',
  'staff.changed': 'words:audit.staffChanged',
  'staff.created': 'words:audit.staffCreated',
  'staff.deactivated': 'words:audit.staffDeactivated',
  'staff.pin_changed': 'words:audit.staffPinChanged',
  'staff.pin_reset': 'words:audit.staffPinReset',
  'staff.unlocked': 'words:audit.staffUnlocked',
  'tag.issued': 'words:audit.tagIssued',
  'tag.revoked': 'words:audit.tagRevoked',
  'type.created': 'words:audit.typeCreated',
};

/** Any program name in words: "board_link" reads "board link", "defect.deferral" reads "defect: deferral". */
export const plainName = (name: string) =>
  name
    .replace(/[._](?=[a-z])/g, (sep) => (sep === '.' ? ': ' : ' '))
    .replace(/^./, (first) => first.toUpperCase());

/** An audit event's action in words; one the product does not know yet still reads as words, never as a code. */
export function auditActionLabel(action: string, t: Translate = ambientTranslate()): string {
  const key = auditActionKeys[action];
  return key ? say(t, key) : plainName(action);
}
