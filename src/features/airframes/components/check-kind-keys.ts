import type { CheckKind } from '@shared/schemas/limits';

/** Each kind of check's name in the airframes catalogue; the kind itself stays a code in what is stored. */
export const checkKindKeys = {
  pre_flight: 'checkKinds.preFlight',
  ground_run: 'checkKinds.groundRun',
  after_flight: 'checkKinds.afterFlight',
  servicing: 'checkKinds.servicing',
} as const satisfies Record<CheckKind, string>;
