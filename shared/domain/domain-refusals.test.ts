import { describe, expect, it } from 'vitest';
import type { AircraftTypeDefinition, Checkpoint, Reading } from '../schemas/limits';
import { evaluatePrecharge, expectedPrecharge, prechargeBands } from './accumulator';
import { consumptionOverWindow, unexplainedLevelDrops } from './consumption';
import { InvalidReadingError } from './reading-input';
import { checkFluidAllowed, fluidToAdd, knownFluids, levelAfterTopUp, targetMark } from './servicing';
import { inWords } from '../i18n/phrase';

// Invented fixtures for refusals and messages; the reference values live in the files beside each module.
const accumulator: Checkpoint = {
  code: 'acc.precharge',
  label: 'Accumulator pre-charge',
  instruction: 'Read the pre-charge.',
  kind: 'pressure',
  unit: 'bar',
  range: { min: 0, max: 200 },
  precharge: { referencePressure: 90, referenceTempC: 20, tolerance: 5 },
  takenWith: { systemPressure: 'relieved' },
  requires: [],
  ata: '29',
  reference: 'test',
  bands: [],
};
const read = (value: number, context: Reading['context']) => ({ value, unit: 'bar', context }) as Reading;

function refusal(run: () => unknown): [string, string] {
  try {
    run();
  } catch (error) {
    if (error instanceof InvalidReadingError) return [error.code, error.message];
    if (error instanceof Error) return ['Error', error.message];
  }
  throw new Error('expected a refusal');
}

describe('pre-charge refusals and bands', () => {
  it('when the unit is not a pressure or an input is not finite, then the correction refuses with the input named', () => {
    const base = { referencePressure: 90, referenceTemp: 20, ambientTemp: 20, unit: 'bar' as const };
    expect(refusal(() => expectedPrecharge({ ...base, unit: 'L' as never }))).toEqual([
      'Error',
      "A pre-charge is a pressure; 'L' is not a pressure unit.",
    ]);
    expect(refusal(() => expectedPrecharge({ ...base, referencePressure: Number.NaN }))).toEqual([
      'Error',
      'referencePressure must be a finite number, got NaN.',
    ]);
    expect(refusal(() => expectedPrecharge({ ...base, referenceTemp: Infinity }))[1]).toBe(
      'referenceTemp must be a finite number, got Infinity.',
    );
    expect(refusal(() => expectedPrecharge({ ...base, ambientTemp: -Infinity }))[1]).toBe(
      'ambientTemp must be a finite number, got -Infinity.',
    );
  });

  it('when a temperature is at absolute zero, then it is refused; just above, it is worked out', () => {
    const base = { referencePressure: 90, referenceTemp: 20, ambientTemp: 20, unit: 'bar' as const };
    const message = 'Temperatures must be above absolute zero (-273.15 °C).';
    expect(refusal(() => expectedPrecharge({ ...base, ambientTemp: -273.15 }))).toEqual(['Error', message]);
    expect(refusal(() => expectedPrecharge({ ...base, referenceTemp: -273.15 }))).toEqual(['Error', message]);
    expect(Number.isFinite(expectedPrecharge({ ...base, ambientTemp: -273.14 }))).toBe(true);
  });

  it('when the reference is at or below a vacuum, then it is refused', () => {
    // One standard atmosphere is 1.01325 bar (NIST SP 811, B.8: 1 atm = 1.01325E+05 Pa).
    expect(
      refusal(() =>
        expectedPrecharge({ referencePressure: -1.01325, referenceTemp: 20, ambientTemp: 30, unit: 'bar' }),
      ),
    ).toEqual(['Error', 'The reference pre-charge is below a vacuum.']);
    expect(
      expectedPrecharge({ referencePressure: -1, referenceTemp: 20, ambientTemp: 20, unit: 'bar' }),
    ).toBe(-1);
  });

  it('when the bands are made for 90 bar with a 5 bar tolerance, then low, in limits and high meet at 85 and 95', () => {
    expect(prechargeBands(accumulator, 90)).toEqual([
      {
        id: 'precharge_low',
        lower: null,
        upper: { value: 85, closed: false },
        verdict: 'service',
        message: 'Pre-charge low: expected 90.0 bar at this temperature.',
        action: 'With system pressure relieved, recharge nitrogen to 90.0 bar, then read again.',
      },
      {
        id: 'precharge_in_limits',
        lower: { value: 85, closed: true },
        upper: { value: 95, closed: true },
        verdict: 'in_limits',
        message: 'Pre-charge in limits (expected 90.0 bar at this temperature).',
        action: 'None.',
      },
      {
        id: 'precharge_high',
        lower: { value: 95, closed: false },
        upper: null,
        verdict: 'service',
        message: 'Pre-charge high: expected 90.0 bar at this temperature.',
        action: 'With system pressure relieved, bleed nitrogen to 90.0 bar, then read again.',
      },
    ]);
  });
});

describe('pre-charge bands, context and edges', () => {
  it.each([
    ['no pre-charge', { precharge: undefined }],
    ['no unit', { unit: null }],
    ['a volume unit', { unit: 'L' as const }],
  ])('when the checkpoint has %s, then engineering is told', (_, change) => {
    const broken = { ...accumulator, ...change } as Checkpoint;
    const expected = [
      'bad_checkpoint',
      'Accumulator pre-charge (acc.precharge): This checkpoint has no pre-charge definition in a pressure unit; tell engineering.',
    ];
    expect(refusal(() => prechargeBands(broken, 90))).toEqual(expected);
    expect(
      refusal(() => evaluatePrecharge(broken, read(90, { systemPressure: 'relieved', ambientTempC: 20 }))),
    ).toEqual(expected);
  });

  it('when the context is wrong or incomplete, then each refusal says what to do', () => {
    const prefix = 'Accumulator pre-charge (acc.precharge): ';
    expect(
      refusal(() => evaluatePrecharge(accumulator, read(90, { systemPressure: 'on', ambientTempC: 20 }))),
    ).toEqual([
      'pressure_on',
      `${prefix}System pressure is on, so the gauge is not showing the pre-charge. Relieve system pressure, then read again.`,
    ]);
    expect(refusal(() => evaluatePrecharge(accumulator, read(90, { ambientTempC: 20 })))).toEqual([
      'missing_context',
      `${prefix}Confirm system pressure is relieved before reading the pre-charge.`,
    ]);
    expect(refusal(() => evaluatePrecharge(accumulator, read(90, { systemPressure: 'relieved' })))).toEqual([
      'missing_context',
      `${prefix}Record the ambient temperature; the pre-charge limit depends on it.`,
    ]);
    expect(
      refusal(() =>
        evaluatePrecharge(accumulator, read(90, { systemPressure: 'relieved', ambientTempC: Number.NaN })),
      ),
    ).toEqual(['not_a_number', `${prefix}The ambient temperature is not a number. Enter it again.`]);
  });

  it('when the reading sits on the edges at the reference temperature, then 85 and 95 are in limits and just outside is service', () => {
    const at = (value: number) =>
      evaluatePrecharge(accumulator, read(value, { systemPressure: 'relieved', ambientTempC: 20 })).band.id;
    expect([at(84.99), at(85), at(95), at(95.01)]).toEqual([
      'precharge_low',
      'precharge_in_limits',
      'precharge_in_limits',
      'precharge_high',
    ]);
  });
});

describe('servicing refusals', () => {
  const glass: Checkpoint = {
    ...accumulator,
    code: 'sys1.level',
    label: 'System 1 level',
    kind: 'level',
    unit: 'L',
    range: { min: 0, max: 10 },
    precharge: undefined,
    takenWith: undefined,
    marks: { minimum: 3, normal: 5, maximum: 8 },
  };

  it.each([
    ['a pressure gauge', { kind: 'pressure' as const }],
    ['a glass without marks', { marks: undefined }],
    ['a checkpoint without a unit', { unit: null }],
  ])('when the fluid to add is asked of %s, then it is refused as not a marked glass', (_, change) => {
    expect(refusal(() => targetMark({ ...glass, ...change }, undefined))).toEqual([
      'Error',
      'System 1 level (sys1.level) is not a sight glass with marks.',
    ]);
  });

  it('when the glass depends on attitude only through requires, then on jacks the maximum mark is the target', () => {
    const byRequires = { ...glass, requires: ['attitude' as const] };
    expect(targetMark(byRequires, 'on_jacks_gear_retracted')).toEqual({ mark: 'maximum', level: 8 });
    expect(targetMark(byRequires, 'on_wheels')).toEqual({ mark: 'normal', level: 5 });
    expect(targetMark(glass, 'on_jacks_gear_retracted')).toEqual({ mark: 'normal', level: 5 });
  });

  it('when the glass depends on attitude only through a band, then the attitude must be known', () => {
    const byBand = {
      ...glass,
      bands: [
        {
          id: 'a',
          lower: null,
          upper: null,
          verdict: 'in_limits' as const,
          message: 'a',
          action: 'a',
          when: { attitude: 'on_wheels' as const },
        },
      ],
    };
    expect(refusal(() => targetMark(byBand, undefined))[1]).toBe(
      'System 1 level (sys1.level): record how the aircraft stands before working out the fluid to add.',
    );
    expect(targetMark(byBand, 'on_jacks_gear_retracted').mark).toBe('maximum');
  });

  it('when a level or an amount added is not a number of litres, then the refusal names which', () => {
    expect(refusal(() => fluidToAdd({ checkpoint: glass, currentLevelL: -1, attitude: undefined }))[1]).toBe(
      'The current level must be a number of litres, zero or more; got -1.',
    );
    expect(refusal(() => levelAfterTopUp({ currentLevelL: Number.NaN, addedL: 1 }))[1]).toBe(
      'The current level must be a number of litres, zero or more; got NaN.',
    );
    expect(refusal(() => levelAfterTopUp({ currentLevelL: 1, addedL: -0.5 }))[1]).toBe(
      'The fluid added must be a number of litres, zero or more; got -0.5.',
    );
  });
});

describe('fluids', () => {
  const type = (allowed: AircraftTypeDefinition['fluid']['allowed']) => ({
    code: 'RX-4',
    fluid: { allowed },
  });
  const synthetic = type([{ spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' }]);

  // MIL-PRF-5606 and -6083 are mineral oils, -83282, -87257 and -46170 synthetic hydrocarbons, SAE AS1241 a
  // phosphate ester (from memory).
  it('when the known fluids are listed, then each specification has its base', () => {
    expect(knownFluids).toEqual([
      { spec: 'MIL-PRF-5606', base: 'mineral' },
      { spec: 'MIL-PRF-6083', base: 'mineral' },
      { spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' },
      { spec: 'MIL-PRF-87257', base: 'synthetic_hydrocarbon' },
      { spec: 'MIL-PRF-46170', base: 'synthetic_hydrocarbon' },
      { spec: 'SAE AS1241', base: 'phosphate_ester' },
    ]);
  });

  it('when a specification is typed in lower case or without dashes, then it is the same fluid', () => {
    expect(checkFluidAllowed(synthetic, 'mil prf 83282')).toEqual({
      allowed: true,
      fluid: { spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' },
    });
    expect(checkFluidAllowed(synthetic, 'milprf83282').allowed).toBe(true);
  });

  it('when a phosphate-ester fluid is offered to a type of two bases, then both bases are named in the warning', () => {
    const two = type([
      { spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' },
      { spec: 'MIL-PRF-5606', base: 'mineral' },
    ]);
    const check = checkFluidAllowed(two, 'sae as1241');
    expect(check).toMatchObject({
      allowed: false,
      reason: 'different_base',
      fluid: { spec: 'SAE AS1241', base: 'phosphate_ester' },
    });
    expect(check.allowed === false && check.message).toBe(
      'DO NOT ADD sae as1241: it is a phosphate ester-base fluid and the RX-4 uses synthetic hydrocarbon or mineral fluid. ' +
        'Mixing fluid bases contaminates the system. If any has gone in, do not fly: tell the shift lead and follow the approved maintenance data for contaminated fluid.',
    );
  });

  it('when a fluid of the same base is not on the list, then it is not approved and the list is given', () => {
    expect(checkFluidAllowed(synthetic, 'MIL-PRF-87257')).toEqual({
      allowed: false,
      reason: 'not_approved',
      fluid: { spec: 'MIL-PRF-87257', base: 'synthetic_hydrocarbon' },
      words: expect.objectContaining({ key: 'fluidNotApproved' }),
      message: 'MIL-PRF-87257 is not approved for the RX-4. Use one of: MIL-PRF-83282.',
    });
    expect(checkFluidAllowed(synthetic, 'Brand X')).toEqual({
      allowed: false,
      reason: 'not_approved',
      words: expect.objectContaining({ key: 'fluidNotApproved' }),
      message: 'Brand X is not approved for the RX-4. Use one of: MIL-PRF-83282.',
    });
  });

  it('when a fluid is given with its base, then that base decides even if the name is unknown', () => {
    expect(checkFluidAllowed(synthetic, { spec: 'Brand M', base: 'mineral' })).toMatchObject({
      allowed: false,
      reason: 'different_base',
    });
  });
});

const base = {
  system: 'sys1',
  events: [],
  flights: [],
  windowEnd: '2026-03-10T00:00:00Z',
  windowDays: 10,
  alertLPerFh: 0.1,
};

describe('consumption refusals and edges', () => {
  it('when the end is not a date, the threshold or an amount is not a number, or hours are negative, then each is refused by name', () => {
    expect(refusal(() => consumptionOverWindow({ ...base, windowEnd: 'soon' }))[1]).toBe(
      "'soon' is not a date and time.",
    );
    expect(refusal(() => consumptionOverWindow({ ...base, alertLPerFh: Number.NaN }))[1]).toBe(
      'The alert threshold must be a finite number, got NaN.',
    );
    const at = '2026-03-05T00:00:00Z';
    expect(
      refusal(() =>
        consumptionOverWindow({ ...base, events: [{ at, system: 'sys1', litres: Infinity }] }),
      )[1],
    ).toBe('Litres added must be a finite number, got Infinity.');
    expect(
      refusal(() => consumptionOverWindow({ ...base, flights: [{ at, flightHours: Number.NaN }] }))[1],
    ).toBe('Flight hours must be a finite number, got NaN.');
    expect(refusal(() => consumptionOverWindow({ ...base, flights: [{ at, flightHours: -1 }] }))[1]).toBe(
      'Flight hours cannot be negative, got -1.',
    );
    expect(consumptionOverWindow({ ...base, flights: [{ at, flightHours: 0 }] }).flightHours).toBe(0);
  });

  it('when fluid went in with nothing flown, then the alert says how much and over how many days', () => {
    const summary = consumptionOverWindow({
      ...base,
      events: [
        { at: '2026-03-05T00:00:00Z', system: 'sys1', litres: 0.5 },
        { at: '2026-03-05T00:00:00Z', system: 'sys1', litres: 0 },
      ],
    });
    expect(inWords(summary.alert)).toEqual({
      kind: 'fluid_without_flying',
      message:
        'System 1: 0.50 L added in 10 days with no flight hours. Unless it followed maintenance, look for a leak.',
    });
    expect(consumptionOverWindow({ ...base }).alert).toBeNull();
  });
});

describe('consumption edges', () => {
  it('when the rate is below the threshold, then there is no alert', () => {
    const summary = consumptionOverWindow({
      ...base,
      events: [{ at: '2026-03-05T00:00:00Z', system: 'sys1', litres: 0.5 }],
      flights: [{ at: '2026-03-05T00:00:00Z', flightHours: 10 }],
    });
    expect(summary.litresPerFlightHour).toBe(0.05);
    expect(summary.alert).toBeNull();
  });

  it('when the tolerance for a level drop is negative or not finite, then it is refused', () => {
    const input = { system: 'sys1', checks: [], events: [], flights: [] };
    expect(refusal(() => unexplainedLevelDrops({ ...input, toleranceL: -0.1 }))[1]).toBe(
      'The tolerance must be zero or more litres, got -0.1.',
    );
    expect(refusal(() => unexplainedLevelDrops({ ...input, toleranceL: Infinity }))[1]).toBe(
      'The tolerance must be zero or more litres, got Infinity.',
    );
    expect(unexplainedLevelDrops({ ...input, toleranceL: 0 })).toEqual([]);
  });

  it('when checks of several systems are mixed and only another system was serviced, then the drop is reported with its message', () => {
    const alerts = unexplainedLevelDrops({
      system: 'sys1',
      checks: [
        { at: '2026-03-01T06:00:00Z', system: 'sys1', levelL: 7 },
        { at: '2026-03-01T07:00:00Z', system: 'sys2', levelL: 1 },
        { at: '2026-03-01T08:00:00Z', system: 'sys1', levelL: 6.5 },
      ],
      events: [{ at: '2026-03-01T07:00:00Z', system: 'sys2', litres: 2 }],
      flights: [{ at: '2026-03-01T07:00:00Z', flightHours: 0 }],
    });
    expect(alerts.map((a) => [a.expectedL, a.dropL, inWords(a.message)])).toEqual([
      [
        7,
        0.5,
        'System 1: level fell 0.50 L between checks with nothing flown and no fluid drawn to account for it. Look for a leak before flight.',
      ],
    ]);
  });

  it('when a flight lies outside the two checks, then it does not explain the drop', () => {
    const alerts = unexplainedLevelDrops({
      system: 'sys1',
      checks: [
        { at: '2026-03-01T06:00:00Z', system: 'sys1', levelL: 7 },
        { at: '2026-03-01T08:00:00Z', system: 'sys1', levelL: 6 },
      ],
      events: [],
      flights: [{ at: '2026-03-01T09:00:00Z', flightHours: 1 }],
    });
    expect(alerts).toHaveLength(1);
  });
});
