// Invented for the demo (Tern Island Air Ambulance). Real limits come only from the aircraft's approved
// maintenance data; none of these figures belongs to any real aircraft.
import {
  aircraftTypeDefinitionSchema,
  type AircraftTypeDefinition,
  type AircraftTypeDefinitionInput,
  type Attitude,
  type CheckpointInput,
  type Edge,
  type LimitBand,
  type Verdict,
} from '../schemas/limits';

const closed = (value: number): Edge => ({ value, closed: true });
const open = (value: number): Edge => ({ value, closed: false });

function band(
  id: string,
  lower: Edge | null,
  upper: Edge | null,
  verdict: Verdict,
  message: string,
  action: string,
  attitude?: Attitude,
): LimitBand {
  return { id, lower, upper, verdict, message, action, ...(attitude ? { when: { attitude } } : {}) };
}

interface Finding {
  verdict: Verdict;
  message: string;
  action: string;
}

interface YesNoInput {
  code: string;
  label: string;
  instruction: string;
  ata: string;
  reference: string;
  system?: string;
  yes: Finding;
  no: Finding;
}

function yesNo({ yes, no, ...rest }: YesNoInput): CheckpointInput {
  return {
    ...rest,
    kind: 'yes_no',
    unit: null,
    range: { min: 0, max: 1 },
    bands: [
      band('no', closed(0), closed(0), no.verdict, no.message, no.action),
      band('yes', closed(1), closed(1), yes.verdict, yes.message, yes.action),
    ],
  };
}

const capitalised = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

const noFinding: Finding = { verdict: 'in_limits', message: 'Nothing found.', action: 'None.' };

/** Drops per minute up to which a leak is in limits, and up to which it is watched rather than grounding. */
interface LeakLimits {
  inLimitsUpTo: number;
  serviceUpTo: number;
}

/**
 * A leak judged by its rate, static (system not pressurised) and dynamic (pressurised or operating) apart. The
 * figures are invented and only plausible: a dynamic leak at a moving seal is allowed a few drops a minute, a
 * static joint much fewer (common practice, no source). Real figures come from the approved maintenance data.
 */
function leakRate(
  code: string,
  label: string,
  instruction: string,
  ata: string,
  reference: string,
  limits: { static: LeakLimits; dynamic: LeakLimits },
  system?: string,
): CheckpointInput {
  const bands = (['static', 'dynamic'] as const).flatMap((leakState) => {
    const { inLimitsUpTo, serviceUpTo } = limits[leakState];
    const named = capitalised(leakState);
    return [
      band(
        `${leakState}_in_limits`,
        closed(0),
        closed(inLimitsUpTo),
        'in_limits',
        `No leak, or a ${leakState} leak within the allowed rate.`,
        'None.',
      ),
      band(
        `${leakState}_watch`,
        open(inLimitsUpTo),
        closed(serviceUpTo),
        'service',
        `${named} leak above the allowed rate, not yet a grounding leak.`,
        'Clean the area, tell the shift lead and count again after the next flight.',
      ),
      band(
        `${leakState}_out`,
        open(serviceUpTo),
        closed(leakRateRangeMax),
        'out_of_limits',
        `${named} leak beyond the limit.`,
        'Do not fly. Mark the leak, put the aircraft on hold and tell the shift lead.',
      ),
    ].map((leakBand) => ({ ...leakBand, when: { leakState } }));
  });
  return {
    code,
    label,
    instruction: `${instruction} If fluid drips, count the drops for one minute.`,
    kind: 'leak_rate',
    unit: null,
    range: { min: 0, max: leakRateRangeMax },
    ata,
    reference: `${reference}, allowed leak rates`,
    bands,
    ...(system ? { system } : {}),
  };
}

/** Beyond about fifty drops a minute nobody counts drops: it is a running leak, out of limits in every state. */
const leakRateRangeMax = 50;

// Invented demo leak limits, drops per minute (common practice, no source).
const hydraulicLeakLimits = {
  static: { inLimitsUpTo: 1, serviceUpTo: 3 },
  dynamic: { inLimitsUpTo: 3, serviceUpTo: 6 },
};
// Brakes: fewer drops allowed, a brake leak near a hot disc is a fire risk (common practice, no source).
const brakeLeakLimits = {
  static: { inLimitsUpTo: 0, serviceUpTo: 1 },
  dynamic: { inLimitsUpTo: 1, serviceUpTo: 3 },
};

function filterBypass(system: string, systemLabel: string, reference: string): CheckpointInput {
  return yesNo({
    code: `${system}.filter_bypass`,
    label: capitalised(`${systemLabel} filter bypass indicator`),
    instruction: `Look at the ${systemLabel} pressure filter. Is the red bypass button out?`,
    ata: '29',
    reference,
    system,
    yes: {
      verdict: 'out_of_limits',
      message: 'Filter bypass indicator out: the element is clogged and fluid may be bypassing it.',
      action:
        'Do not fly. Put the aircraft on hold; the filter element and fluid need attention per the maintenance data.',
    },
    no: noFinding,
  });
}

function cautionTest(system: string, systemLabel: string, reference: string): CheckpointInput {
  // Here "yes" is the healthy answer: a caution that fails to come on hides a real pressure loss in flight.
  return yesNo({
    code: `${system}.caution_test`,
    label: capitalised(`${systemLabel} low-pressure caution test`),
    instruction: `Switch the ${systemLabel} pump off. Did the LOW PRESS caution come on?`,
    ata: '29',
    reference,
    system,
    yes: {
      verdict: 'in_limits',
      message: 'Caution came on as pressure fell.',
      action: 'Switch the pump back on.',
    },
    no: {
      verdict: 'out_of_limits',
      message: 'Low-pressure caution did not come on.',
      action: 'Do not fly. Put the aircraft on hold and report the caution circuit as faulty.',
    },
  });
}

interface LevelFigures {
  system: string;
  systemLabel: string;
  rangeMax: number;
  minimum: number;
  normal: number;
  maintenance: number;
  isolation: number;
  /** Whether the level switch has isolated at the isolation level itself, or only below it. */
  isolatedAtIsolationLevel: boolean;
  reference: string;
}

/** A twin-system reservoir: the upper mark applies only on jacks with gear retracted. */
function twinReservoirLevel(f: LevelFigures): CheckpointInput {
  const isolationEdge = f.isolatedAtIsolationLevel ? closed(f.isolation) : open(f.isolation);
  const aboveIsolation = f.isolatedAtIsolationLevel ? open(f.isolation) : closed(f.isolation);
  const topUp =
    'Top up with approved fluid to the normal mark (on jacks, gear retracted: the maintenance mark), record fluid and batch, and look for leaks.';
  return {
    code: `${f.system}.level`,
    label: `${f.systemLabel} reservoir level`,
    instruction: `Read the ${f.systemLabel} reservoir sight glass.`,
    kind: 'level',
    unit: 'L',
    range: { min: 0, max: f.rangeMax },
    system: f.system,
    marks: { minimum: f.minimum, normal: f.normal, maximum: f.maintenance, isolation: f.isolation },
    requires: ['attitude'],
    ata: '12',
    reference: f.reference,
    bands: [
      band(
        'isolated',
        closed(0),
        isolationEdge,
        'out_of_limits',
        `Level at or below the low-level switch mark: at this level the switch isolates part of ${f.systemLabel}.`,
        'Do not fly. Put the aircraft on hold, find the leak and tell the shift lead.',
      ),
      band(
        'below_minimum',
        aboveIsolation,
        open(f.minimum),
        'service',
        'Level below the minimum mark.',
        topUp,
      ),
      band(
        'in_limits_wheels',
        closed(f.minimum),
        closed(f.normal),
        'in_limits',
        'Level at or between the minimum and normal marks.',
        'None.',
        'on_wheels',
      ),
      band(
        'overfilled_wheels',
        open(f.normal),
        closed(f.rangeMax),
        'service',
        'Overfilled: on wheels the level must not be above the normal mark.',
        'Drain to the normal mark with the aircraft on wheels.',
        'on_wheels',
      ),
      band(
        'in_limits_jacks',
        closed(f.minimum),
        closed(f.maintenance),
        'in_limits',
        'Level within the marks for gear retracted on jacks.',
        'None.',
        'on_jacks_gear_retracted',
      ),
      band(
        'overfilled_jacks',
        open(f.maintenance),
        closed(f.rangeMax),
        'service',
        'Overfilled: above the maintenance mark.',
        'Drain to the maintenance mark with gear retracted on jacks.',
        'on_jacks_gear_retracted',
      ),
    ],
  };
}

interface PressureFigures {
  code: string;
  label: string;
  instruction: string;
  system: string;
  nominal: number;
  /** The caution comes on strictly below this pressure. */
  cautionBelow: number;
  maximum: number;
  reference: string;
}

function runPressure(f: PressureFigures): CheckpointInput {
  return {
    code: f.code,
    label: f.label,
    instruction: f.instruction,
    kind: 'pressure',
    unit: 'bar',
    range: { min: 0, max: 250 },
    system: f.system,
    requires: ['systemPressure'],
    takenWith: { systemPressure: 'on' },
    ata: '29',
    reference: f.reference,
    bands: [
      band(
        'low',
        closed(0),
        open(f.cautionBelow),
        'out_of_limits',
        `Below ${f.cautionBelow} bar: low-pressure caution range.`,
        'Stop the run. Put the aircraft on hold; check the pump and the fluid level.',
      ),
      band(
        'in_limits',
        closed(f.cautionBelow),
        closed(f.maximum),
        'in_limits',
        `Pressure in limits (nominal ${f.nominal} bar).`,
        'None.',
      ),
      band(
        'high',
        open(f.maximum),
        closed(250),
        'out_of_limits',
        `Above the ${f.maximum} bar maximum.`,
        'Stop the run. Put the aircraft on hold; the relief valve or pump compensator needs checking.',
      ),
    ],
  };
}

const rx4Servicing = 'Approved maintenance data, RX-4 ch. 12-10 (demo)';
const rx4Hydraulics = 'Approved maintenance data, RX-4 ch. 29-10 (demo)';
const rx4Brakes = 'Approved maintenance data, RX-4 ch. 32-40 (demo)';

const rx4: AircraftTypeDefinitionInput = {
  code: 'RX-4',
  name: 'RX-4 medium twin',
  fluid: {
    allowed: [
      { spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' },
      { spec: 'MIL-PRF-87257', base: 'synthetic_hydrocarbon' },
    ],
  },
  systems: [
    { code: 'sys1', label: 'System 1', reservoirCheckpoint: 'sys1.level' },
    { code: 'sys2', label: 'System 2', reservoirCheckpoint: 'sys2.level' },
  ],
  checkpoints: [
    twinReservoirLevel({
      system: 'sys1',
      systemLabel: 'System 1',
      rangeMax: 10,
      minimum: 5.5,
      normal: 7.0,
      maintenance: 9.0,
      isolation: 3.0,
      isolatedAtIsolationLevel: false,
      reference: rx4Servicing,
    }),
    twinReservoirLevel({
      system: 'sys2',
      systemLabel: 'System 2',
      rangeMax: 7,
      minimum: 3.5,
      normal: 4.5,
      maintenance: 6.0,
      isolation: 1.5,
      isolatedAtIsolationLevel: true,
      reference: rx4Servicing,
    }),
    {
      code: 'brake.precharge',
      label: 'Brake accumulator pre-charge',
      instruction: 'Pump the brake pedals until pressure is relieved. Read the accumulator gauge.',
      kind: 'pressure',
      unit: 'bar',
      range: { min: 0, max: 100 },
      precharge: { referencePressure: 45, referenceTempC: 20, tolerance: 5 },
      requires: ['systemPressure', 'ambientTempC'],
      takenWith: { systemPressure: 'relieved' },
      bands: [],
      ata: '32',
      reference: rx4Brakes,
      // Read on the accumulator's own gauge on a walk-round; a test gauge or a charging kit's gauge, when used, is
      // named from the tools register with its calibration (optional, so the pre-flight asks nothing more).
      tool: { kinds: ['pressure_gauge', 'nitrogen_charging_kit'], required: false },
    },
    filterBypass('sys1', 'System 1', rx4Hydraulics),
    filterBypass('sys2', 'System 2', rx4Hydraulics),
    leakRate(
      'sys1.leaks',
      'System 1 leaks',
      'Look at the System 1 pump, lines and servos.',
      '29',
      rx4Hydraulics,
      hydraulicLeakLimits,
      'sys1',
    ),
    leakRate(
      'sys2.leaks',
      'System 2 leaks',
      'Look at the System 2 pump, lines and servos.',
      '29',
      rx4Hydraulics,
      hydraulicLeakLimits,
      'sys2',
    ),
    leakRate(
      'brakes.leaks',
      'Brake leaks',
      'Look at the brake units, lines and wheel wells.',
      '32',
      rx4Brakes,
      brakeLeakLimits,
    ),
    runPressure({
      code: 'sys1.pressure',
      label: 'System 1 pressure',
      instruction: 'Engines at ground idle. Read System 1 pressure.',
      system: 'sys1',
      nominal: 160,
      cautionBelow: 100,
      maximum: 195,
      reference: rx4Hydraulics,
    }),
    runPressure({
      code: 'sys2.pressure',
      label: 'System 2 pressure',
      instruction: 'Engines at ground idle. Read System 2 pressure.',
      system: 'sys2',
      nominal: 150,
      cautionBelow: 90,
      maximum: 180,
      reference: rx4Hydraulics,
    }),
    {
      code: 'backup.pressure',
      label: 'Backup pump pressure',
      instruction: 'System 1 pump off, backup pump on. Read System 1 pressure.',
      kind: 'pressure',
      unit: 'bar',
      range: { min: 0, max: 250 },
      system: 'sys1',
      requires: ['systemPressure'],
      takenWith: { systemPressure: 'on' },
      ata: '29',
      reference: rx4Hydraulics,
      bands: [
        band(
          'low',
          closed(0),
          open(100),
          'out_of_limits',
          'Backup pump below its 100 to 130 bar band.',
          'Put the aircraft on hold; report the backup pump.',
        ),
        band(
          'in_limits',
          closed(100),
          closed(130),
          'in_limits',
          'Backup pump within 100 to 130 bar.',
          'Switch the backup pump off.',
        ),
        band(
          'high',
          open(130),
          closed(250),
          'out_of_limits',
          'Backup pump above its 100 to 130 bar band.',
          'Put the aircraft on hold; report the backup pump.',
        ),
      ],
    },
    cautionTest('sys1', 'System 1', rx4Hydraulics),
    cautionTest('sys2', 'System 2', rx4Hydraulics),
  ],
  cards: {
    pre_flight: [
      'sys1.level',
      'sys2.level',
      'brake.precharge',
      'sys1.filter_bypass',
      'sys2.filter_bypass',
      'sys1.leaks',
      'sys2.leaks',
      'brakes.leaks',
    ],
    ground_run: [
      'sys1.pressure',
      'sys2.pressure',
      'backup.pressure',
      'sys1.caution_test',
      'sys2.caution_test',
      'sys1.level',
      'sys2.level',
    ],
    after_flight: [
      'sys1.level',
      'sys2.level',
      'sys1.leaks',
      'sys2.leaks',
      'brakes.leaks',
      'sys1.filter_bypass',
      'sys2.filter_bypass',
    ],
    // Fluid added is recorded once, with the top-up at each level (quantity, fluid, batch, can opened).
    servicing: ['sys1.level', 'sys2.level', 'brake.precharge'],
  },
  // Pre-flight: the local flying day and no more than 14 h; a ground run covers the next flight only.
  validity: {
    pre_flight: { untilLocalTime: '23:59', hours: 14 },
    ground_run: { flights: 1 },
    after_flight: { hours: 12 },
    servicing: { hours: 24 },
  },
  consumptionAlertLPerFh: 0.08,
  timeZone: 'Atlantic/Madeira',
};

const rl2Servicing = 'Approved maintenance data, RL-2 ch. 12-10 (demo)';
const rl2Hydraulics = 'Approved maintenance data, RL-2 ch. 29-10 (demo)';

const rl2: AircraftTypeDefinitionInput = {
  code: 'RL-2',
  name: 'RL-2 light single',
  fluid: { allowed: [{ spec: 'MIL-PRF-5606', base: 'mineral' }] },
  systems: [{ code: 'sys1', label: 'Hydraulic system', reservoirCheckpoint: 'sys1.level' }],
  checkpoints: [
    {
      code: 'sys1.level',
      label: 'Reservoir level',
      instruction: 'Read the reservoir sight glass.',
      kind: 'level',
      unit: 'L',
      range: { min: 0, max: 1.8 },
      system: 'sys1',
      marks: { minimum: 0.9, normal: 1.2, maximum: 1.5 },
      ata: '12',
      reference: rl2Servicing,
      bands: [
        // One system and no backup: a level below minimum grounds the aircraft rather than asking for a top-up.
        band(
          'below_minimum',
          closed(0),
          open(0.9),
          'out_of_limits',
          'Level below the minimum mark.',
          'Do not fly. Put the aircraft on hold, find the leak, then top up.',
        ),
        band(
          'in_limits',
          closed(0.9),
          closed(1.5),
          'in_limits',
          'Level at or between the minimum and maximum marks.',
          'None.',
        ),
        band(
          'overfilled',
          open(1.5),
          closed(1.8),
          'service',
          'Overfilled: above the maximum mark.',
          'Drain to the normal mark.',
        ),
      ],
    },
    filterBypass('sys1', 'hydraulic', rl2Hydraulics),
    leakRate(
      'sys1.leaks',
      'Hydraulic leaks',
      'Look at the pump, lines and reservoir.',
      '29',
      rl2Hydraulics,
      hydraulicLeakLimits,
      'sys1',
    ),
    leakRate(
      'servos.leaks',
      'Servo leaks',
      'Look at the main and tail rotor servos.',
      '29',
      rl2Hydraulics,
      hydraulicLeakLimits,
      'sys1',
    ),
    runPressure({
      code: 'sys1.pressure',
      label: 'System pressure',
      instruction: 'Engine at ground idle. Read system pressure.',
      system: 'sys1',
      nominal: 70,
      cautionBelow: 50,
      maximum: 85,
      reference: rl2Hydraulics,
    }),
    cautionTest('sys1', 'hydraulic', rl2Hydraulics),
  ],
  cards: {
    pre_flight: ['sys1.level', 'sys1.filter_bypass', 'sys1.leaks', 'servos.leaks'],
    ground_run: ['sys1.pressure', 'sys1.caution_test', 'sys1.level'],
    after_flight: ['sys1.level', 'sys1.leaks', 'servos.leaks'],
    servicing: ['sys1.level'],
  },
  validity: {
    pre_flight: { untilLocalTime: '23:59', hours: 14 },
    ground_run: { flights: 1 },
    after_flight: { hours: 12 },
    servicing: { hours: 24 },
  },
  consumptionAlertLPerFh: 0.03,
  timeZone: 'Atlantic/Madeira',
};

export const demoTypes: AircraftTypeDefinition[] = [rx4, rl2].map((type) =>
  aircraftTypeDefinitionSchema.parse(type),
);
