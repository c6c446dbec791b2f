import { randomUUID } from 'node:crypto';
import type { CheckKind, ReadingEntry } from '@shared/schemas/limits';
import type { SignedIn } from './sign-in';

// The one check builder of the API tests: bodies for POST /api/checks on the demo RX-4 card, and a signer.

/** Readings for an RX-4 pre-flight that are all in limits. */
export const goodPreFlight = {
  context: { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 20 } as const,
  readings: [
    { code: 'sys1.level', entry: { value: 7.0, unit: 'L' } },
    { code: 'sys2.level', entry: { value: 4.5, unit: 'L' } },
    { code: 'brake.precharge', entry: { value: 45, unit: 'bar' } },
    { code: 'sys1.filter_bypass', entry: { answer: false } },
    { code: 'sys2.filter_bypass', entry: { answer: false } },
    { code: 'sys1.leaks', entry: { dropsPerMinute: 0 } },
    { code: 'sys2.leaks', entry: { dropsPerMinute: 0 } },
    { code: 'brakes.leaks', entry: { dropsPerMinute: 0 } },
  ] as { code: string; entry: ReadingEntry; photoIds?: string[] }[],
};

/** Fluid added at system 1 during a check: half a litre of an approved fluid, the level 6.1 L before. */
export function topUp(changes: Record<string, unknown> = {}) {
  return {
    code: 'sys1.level',
    quantity: { value: 0.5, unit: 'L' },
    fluidSpec: 'MIL-PRF-83282',
    batch: 'LOT 24-117',
    canOpenedOn: '2026-01-05',
    levelBefore: { value: 6.1, unit: 'L' },
    ...changes,
  };
}

export function preFlightBody(
  airframeId: number,
  limitsVersionId: number,
  pin: string,
  changes: Record<string, unknown> = {},
) {
  return {
    id: randomUUID(),
    airframeId,
    kind: 'pre_flight',
    limitsVersionId,
    pin,
    ...structuredClone(goodPreFlight),
    ...changes,
  };
}

/** Readings for an RX-4 servicing card, all in limits: each level re-read after any top-up. */
export function servicingReadings() {
  return [
    { code: 'sys1.level', entry: { value: 7.0, unit: 'L' } },
    { code: 'sys2.level', entry: { value: 4.5, unit: 'L' } },
    { code: 'brake.precharge', entry: { value: 45, unit: 'bar' } },
  ];
}

/** The top-ups of an RX-4 servicing card (litres per system; none for 0), each level found that much below its mark. */
export function servicingTopUps(sys1AddedL = 0, sys2AddedL = 0) {
  return [
    ...(sys1AddedL > 0
      ? [
          topUp({
            quantity: { value: sys1AddedL, unit: 'L' },
            levelBefore: { value: 7.0 - sys1AddedL, unit: 'L' },
          }),
        ]
      : []),
    ...(sys2AddedL > 0
      ? [
          topUp({
            code: 'sys2.level',
            quantity: { value: sys2AddedL, unit: 'L' },
            levelBefore: { value: 4.5 - sys2AddedL, unit: 'L' },
          }),
        ]
      : []),
  ];
}

/** A check body of any kind: the pre-flight's context, with the readings given. */
export function checkBody(
  kind: CheckKind,
  airframeId: number,
  limitsVersionId: number,
  pin: string,
  readings: { code: string; entry: unknown; photoIds?: string[] }[],
  changes: Record<string, unknown> = {},
) {
  return { ...preFlightBody(airframeId, limitsVersionId, pin, changes), kind, readings, ...changes };
}

/** System 1 at 2.9 L: below the 3.0 L isolation mark of the demo RX-4, so out of limits. */
export const isolatedLevel = { code: 'sys1.level', entry: { value: 2.9, unit: 'L' } };

export async function signCheck(
  mechanic: SignedIn,
  airframeId: number,
  limitsId: number,
  changes: Record<string, unknown> = {},
  readings: { code: string; entry: unknown }[] = [],
) {
  const body = preFlightBody(airframeId, limitsId, mechanic.pin, changes);
  body.readings = body.readings.map(
    (r) => readings.find((x) => x.code === r.code) ?? r,
  ) as typeof body.readings;
  const res = await mechanic.client.post('/api/checks', body);
  if (res.status !== 201) throw new Error(`check refused: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body as { id: string; holdOpened: boolean; verdict: string };
}

/**
 * An RX-4 after-flight recording the airframe's figures read at the end of the flight; system 1 at 7.0 L unless
 * given (what the flight left in it), everything else in limits.
 */
export function afterFlightBody(
  airframeId: number,
  limitsVersionId: number,
  pin: string,
  usage: { hours: number; flights: number; landings: number } | undefined,
  changes: Record<string, unknown> = {},
  sys1Litres = 7.0,
) {
  return {
    id: randomUUID(),
    airframeId,
    kind: 'after_flight',
    limitsVersionId,
    pin,
    context: { attitude: 'on_wheels' },
    readings: [
      { code: 'sys1.level', entry: { value: sys1Litres, unit: 'L' } },
      { code: 'sys2.level', entry: { value: 4.5, unit: 'L' } },
      { code: 'sys1.leaks', entry: { dropsPerMinute: 0 } },
      { code: 'sys2.leaks', entry: { dropsPerMinute: 0 } },
      { code: 'brakes.leaks', entry: { dropsPerMinute: 0 } },
      { code: 'sys1.filter_bypass', entry: { answer: false } },
      { code: 'sys2.filter_bypass', entry: { answer: false } },
    ],
    ...(usage ? { usage } : {}),
    ...changes,
  };
}
