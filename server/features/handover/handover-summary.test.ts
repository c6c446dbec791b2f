import { describe, expect, it } from 'vitest';
import { countChecks, flightHoursBetween, handoverText, systemConsumption } from './handover-summary';
import { limitsCaution } from '@shared/schemas/limits';
import { type HandoverSummary } from '@shared/schemas/handover';
import { inWords, phrase } from '@shared/i18n/phrase';

const at = (iso: string) => new Date(iso);
const from = at('2026-01-08T00:00:00Z');
const to = at('2026-01-15T00:00:00Z');
const airframe = { id: 1, fleetNumber: 'T-01' };

describe('flightHoursBetween', () => {
  it('when hours were recorded before and inside the window, then the difference is the hours flown', () => {
    const hours = flightHoursBetween(
      [
        { at: at('2026-01-07T08:00:00Z'), hours: 1000 },
        { at: at('2026-01-10T08:00:00Z'), hours: 1004.5 },
        { at: at('2026-01-14T08:00:00Z'), hours: 1010 },
      ],
      from,
      to,
    );
    expect(hours).toBeCloseTo(10, 9);
  });

  it('when the hours never moved, then they are unknown, not zero', () => {
    expect(
      flightHoursBetween(
        [
          { at: at('2026-01-09T08:00:00Z'), hours: 1000 },
          { at: at('2026-01-12T08:00:00Z'), hours: 1000 },
        ],
        from,
        to,
      ),
    ).toBeNull();
  });

  it('when only one value is recorded, then the hours are unknown', () => {
    expect(flightHoursBetween([{ at: at('2026-01-09T08:00:00Z'), hours: 1000 }], from, to)).toBeNull();
  });
});

describe('systemConsumption', () => {
  it('when 1.0 L went in over 10 flight hours against a 0.08 L/FH threshold, then it alerts (0.1 is at or above 0.08)', () => {
    const result = systemConsumption({
      airframe,
      system: 'sys1',
      events: [{ at: '2026-01-12T08:00:00Z', litres: 1.0 }],
      flightHours: 10,
      windowEnd: to,
      alertLPerFh: 0.08,
    });
    expect(result.litresPerFlightHour).toBeCloseTo(0.1, 9);
    expect(result.alert?.kind).toBe('rate_at_or_above_threshold');
    expect(inWords(result.alert?.message)).toMatch(/^T-01 System 1: /);
  });

  it('when flight hours are unknown, then there is no per-hour rate and no alert, only litres per day', () => {
    const result = systemConsumption({
      airframe,
      system: 'sys1',
      events: [{ at: '2026-01-12T08:00:00Z', litres: 0.7 }],
      flightHours: null,
      windowEnd: to,
      alertLPerFh: 0.08,
    });
    expect(result.litresPerFlightHour).toBeNull();
    expect(result.flightHours).toBeNull();
    expect(result.alert).toBeNull();
    expect(result.litresPerDay).toBeCloseTo(0.1, 9);
  });
});

describe('handover text', () => {
  it('when a shift had a hold, a deferred defect and fluid, then the text names each airframe state, the defect and the litres', () => {
    const summary: HandoverSummary = {
      from: from.toISOString(),
      to: to.toISOString(),
      checks: countChecks([
        { kind: 'pre_flight', verdict: 'in_limits' },
        { kind: 'pre_flight', verdict: 'out_of_limits' },
      ]),
      holdsOpened: [
        {
          id: 7,
          airframe,
          reason: 'System 2 reservoir level: below isolation',
          openedAt: from.toISOString(),
          checkId: 'c',
        },
      ],
      holdsReleased: [],
      holdsStillOpen: 1,
      states: [
        { airframe, state: 'unserviceable', causes: ['on_hold'] },
        { airframe: { id: 2, fleetNumber: 'T-02' }, state: 'released', causes: [] },
      ],
      defects: [
        {
          airframe: { id: 2, fleetNumber: 'T-02' },
          defects: [
            {
              id: 4,
              number: 4,
              holdId: null,
              description: 'Cabin step light inoperative.',
              status: 'deferred',
              reason: phrase('deferred', {
                limit: { phrase: phrase('untilInstant', { at: { instant: '2026-12-12T23:59:59.999Z' } }) },
              }),
              deferredUntil: '2026-12-12T23:59:59.999Z',
            },
          ],
        },
      ],
      fluidUsed: {
        bySystem: [{ system: 'sys2', litres: 0.5 }],
        byAirframe: [{ airframe, system: 'sys2', litres: 0.5 }],
      },
      consumption: [],
      consumptionAlerts: [],
      notes: [],
      caution: limitsCaution,
    };
    expect(summary.checks.byKind).toEqual([
      { kind: 'pre_flight', total: 2, in_limits: 1, service: 0, out_of_limits: 1 },
    ]);
    const text = handoverText(summary);
    expect(text).toContain('Pre-flight: 2 (In limits 1, Service 0, Out of limits 1)');
    expect(text).toContain('T-01 (hold 7');
    expect(text).toContain('- T-01: Unserviceable (on hold)');
    expect(text).toContain('- T-02: Released');
    expect(text).toContain(
      '- T-02 defect 4: Cabin step light inoperative. (deferred until 12 Dec 2026, 23:59 UTC)',
    );
    expect(text).not.toMatch(/\d{4}-\d\d-\d\dT/);
    expect(text).toContain('T-01 System 2: 0.50 L');
    expect(text).toContain('approved maintenance data');
  });
});
