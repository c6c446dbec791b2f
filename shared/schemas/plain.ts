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
