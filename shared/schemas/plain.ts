// The words and input patterns the kiosk's first screen needs, kept free of zod so that screen does not load it.
// The schemas in auth.ts and checks.ts are built from the same patterns and re-export these labels.

export const badgePattern = /^[A-Za-z0-9-]{2,32}$/;
export const badgeMessage = 'A badge number is 2 to 32 letters, digits or dashes.';
export const pinPattern = /^\d{4,8}$/;
export const pinMessage = 'A PIN is 4 to 8 digits.';

/** A badge as typed or scanned: surrounding spaces do not count. */
export const isBadge = (value: string) => badgePattern.test(value.trim());
export const isPin = (value: string) => pinPattern.test(value);

export const checkKindLabels = {
  pre_flight: 'Pre-flight',
  ground_run: 'Ground run',
  after_flight: 'After-flight',
  servicing: 'Servicing',
} as const;

export const verdictLabels = {
  in_limits: 'In limits',
  service: 'Service',
  out_of_limits: 'Out of limits',
} as const;

export const roleLabels = {
  mechanic: 'Mechanic',
  shift_lead: 'Shift lead',
  pilot: 'Pilot',
  engineering: 'Engineering',
} as const;

/** What each audit trail event records, as people say it. */
const auditActionWords: Record<string, string> = {
  'airframe.accepted': 'Pilot accepted the aircraft',
  'airframe.changed': 'Airframe details changed',
  'airframe.created': 'Airframe added',
  'airframe.released': 'Certificate of release to service signed',
  'authorisation.granted': 'Authorisation granted',
  'authorisation.revoked': 'Authorisation revoked',
  'board_link.created': 'Board link made',
  'board_link.revoked': 'Board link revoked',
  'check.signed': 'Check signed',
  'check_draft.closed': 'Unsigned check closed',
  'defect.raised': 'Defect raised',
  'defect.work': 'Defect work recorded',
  'defect.inspection': 'Defect inspection signed',
  'defect.certification': 'Defect rectification certified',
  'defect.deferral': 'Defect deferred',
  'defect.recorded': 'Defect entry recorded',
  'handover.sent': 'Shift handover sent',
  'hold.corrective_action': 'Corrective action recorded',
  'hold.opened': 'Aircraft put on hold',
  'hold.released': 'Hold released',
  'kiosk.enrolled': 'Tablet enrolled',
  'kiosk.enrolment_created': 'Tablet enrolment link made',
  'kiosk.renamed': 'Tablet renamed',
  'kiosk.revoked': 'Tablet revoked',
  'limits.draft_saved': 'Limits draft saved',
  'limits.published': 'Limits published',
  'staff.changed': 'Person details changed',
  'staff.created': 'Person added',
  'staff.deactivated': 'Person deactivated',
  'staff.pin_changed': 'PIN changed',
  'staff.pin_reset': 'PIN reset',
  'staff.unlocked': 'Badge unlocked',
  'tag.issued': 'Airframe tag issued',
  'tag.revoked': 'Airframe tag revoked',
  'type.created': 'Aircraft type added',
};

/** Any program name in words: "board_link" reads "board link", "defect.deferral" reads "defect: deferral". */
export const plainName = (name: string) =>
  name
    .replace(/[._](?=[a-z])/g, (sep) => (sep === '.' ? ': ' : ' '))
    .replace(/^./, (first) => first.toUpperCase());

/** An audit event's action in words; one the product does not know yet still reads as words, never as a code. */
export const auditActionLabel = (action: string) => auditActionWords[action] ?? plainName(action);
