import { describe, expect, it } from 'vitest';
import {
  consumptionOverWindow,
  unexplainedLevelDrops,
  type FlightHoursEntry,
  type LevelCheck,
  type ServicingEvent,
} from './consumption';

const events: ServicingEvent[] = [
  { at: '2026-03-01T08:00:00Z', system: 'sys1', litres: 0.5 },
  { at: '2026-03-04T08:00:00Z', system: 'sys1', litres: 0.25, airframeHours: 1204.5 },
  { at: '2026-03-05T08:00:00Z', system: 'sys2', litres: 1.0 },
  { at: '2026-03-06T08:00:00Z', system: 'sys1', litres: -0.2 },
  { at: '2026-02-20T08:00:00Z', system: 'sys1', litres: 5.0 },
];
const flights: FlightHoursEntry[] = [
  { at: '2026-03-02T18:00:00Z', flightHours: 4 },
  { at: '2026-03-05T18:00:00Z', flightHours: 4 },
  { at: '2026-02-21T18:00:00Z', flightHours: 100 },
];

describe('consumptionOverWindow', () => {
  const base = { events, flights, windowEnd: '2026-03-07T00:00:00Z', windowDays: 7 };

  it.each([
    // system, threshold, litres, hours, per FH, per day, alert (binary-exact figures, so the edge is exact)
    ['sys1', 0.1, 0.75, 8, 0.09375, 0.75 / 7, null],
    ['sys1', 0.09375, 0.75, 8, 0.09375, 0.75 / 7, 'rate_at_or_above_threshold'],
    ['sys2', 0.1, 1.0, 8, 0.125, 1 / 7, 'rate_at_or_above_threshold'],
  ] as const)(
    'when %s is judged against %s L/FH, then it added %s L over %s FH',
    (system, alertLPerFh, litres, hours, perFh, perDay, alert) => {
      const summary = consumptionOverWindow({ ...base, system, alertLPerFh });
      expect(summary.litresAdded).toBeCloseTo(litres, 12);
      expect(summary.flightHours).toBe(hours);
      expect(summary.litresPerFlightHour).toBeCloseTo(perFh, 12);
      expect(summary.litresPerDay).toBeCloseTo(perDay, 12);
      expect(summary.alert?.kind ?? null).toBe(alert);
    },
  );

  it('when an event falls exactly on the window start, then it is outside; exactly on the end, inside', () => {
    const edge = consumptionOverWindow({
      system: 'sys1',
      events: [
        { at: '2026-03-01T00:00:00Z', system: 'sys1', litres: 1 },
        { at: '2026-03-08T00:00:00Z', system: 'sys1', litres: 2 },
      ],
      flights: [],
      windowEnd: '2026-03-08T00:00:00Z',
      windowDays: 7,
      alertLPerFh: 0.08,
    });
    expect(edge.litresAdded).toBe(2);
  });

  it('when fluid went in and nothing was flown, then it alerts for fluid without flying', () => {
    const summary = consumptionOverWindow({ ...base, flights: [], system: 'sys1', alertLPerFh: 0.08 });
    expect(summary.litresPerFlightHour).toBeNull();
    expect(summary.alert?.kind).toBe('fluid_without_flying');
  });

  it('when the window is not a positive number of days, then it throws', () => {
    expect(() =>
      consumptionOverWindow({ ...base, system: 'sys1', alertLPerFh: 0.08, windowDays: 0 }),
    ).toThrow(/days/);
  });
});

describe('unexplainedLevelDrops', () => {
  const check = (at: string, levelL: number, attitude: LevelCheck['attitude'] = 'on_wheels'): LevelCheck => ({
    at,
    system: 'sys1',
    levelL,
    attitude,
  });

  it.each([
    // first level, second level, fluid events between, flights between, tolerance, alerts
    ['nothing between and a 0.5 L drop', 7.0, 6.5, [], [], undefined, 1],
    ['a drop within the default 0.2 L', 7.0, 6.85, [], [], undefined, 0],
    ['a drop of exactly the tolerance', 7.0, 6.75, [], [], 0.25, 0],
    ['a flight between', 7.0, 6.5, [], [{ at: '2026-03-01T12:00:00Z', flightHours: 1.5 }], undefined, 0],
    [
      '0.5 L drawn off between',
      7.0,
      6.5,
      [{ at: '2026-03-01T12:00:00Z', system: 'sys1', litres: -0.5 }],
      [],
      undefined,
      0,
    ],
    [
      '1 L added yet only 0.3 L higher',
      6.0,
      6.3,
      [{ at: '2026-03-01T12:00:00Z', system: 'sys1', litres: 1 }],
      [],
      undefined,
      1,
    ],
    [
      'fluid added to the other system',
      7.0,
      6.5,
      [{ at: '2026-03-01T12:00:00Z', system: 'sys2', litres: 0.5 }],
      [],
      undefined,
      1,
    ],
  ] as const)(
    'when there is %s, then %s alert(s)',
    (_what, first, second, between, flown, toleranceL, count) => {
      const alerts = unexplainedLevelDrops({
        system: 'sys1',
        checks: [check('2026-03-01T18:00:00Z', second), check('2026-03-01T06:00:00Z', first)],
        events: [...between],
        flights: [...flown],
        ...(toleranceL === undefined ? {} : { toleranceL }),
      });
      expect(alerts).toHaveLength(count);
    },
  );

  it('when a drop is found, then it says how much and against what was expected', () => {
    const [alert] = unexplainedLevelDrops({
      system: 'sys1',
      checks: [check('2026-03-01T06:00:00Z', 6.0), check('2026-03-01T18:00:00Z', 6.3)],
      events: [{ at: '2026-03-01T12:00:00Z', system: 'sys1', litres: 1 }],
      flights: [],
    });
    expect(alert?.expectedL).toBe(7);
    expect(alert?.dropL).toBeCloseTo(0.7, 12);
  });

  it('when the two checks were read in different attitudes, then they are not compared', () => {
    const alerts = unexplainedLevelDrops({
      system: 'sys1',
      checks: [
        check('2026-03-01T06:00:00Z', 9.0, 'on_jacks_gear_retracted'),
        check('2026-03-01T18:00:00Z', 7.0),
      ],
      events: [],
      flights: [],
    });
    expect(alerts).toEqual([]);
  });
});
