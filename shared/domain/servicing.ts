import type { AircraftTypeDefinition, Attitude, Checkpoint, Fluid } from '../schemas/limits';
import { convert } from './units';
import { phrase, phraseWords, type Phrase } from '../i18n/phrase';

export interface TargetMark {
  mark: 'normal' | 'maximum';
  /** Litres. */
  level: number;
}

/**
 * The mark to fill to. The upper mark is the target only on jacks with gear retracted, and only on a glass whose
 * limits depend on attitude; otherwise the normal mark.
 */
export function targetMark(checkpoint: Checkpoint, attitude: Attitude | undefined): TargetMark {
  const marks = checkpoint.marks;
  if (checkpoint.kind !== 'level' || marks === undefined || checkpoint.unit === null) {
    throw new Error(`${checkpoint.label} (${checkpoint.code}) is not a sight glass with marks.`);
  }
  const dependsOnAttitude =
    checkpoint.requires.includes('attitude') ||
    checkpoint.bands.some((band) => band.when?.attitude !== undefined);
  if (dependsOnAttitude && attitude === undefined) {
    throw new Error(
      `${checkpoint.label} (${checkpoint.code}): record how the aircraft stands before working out the fluid to add.`,
    );
  }
  const useMaximum = dependsOnAttitude && attitude === 'on_jacks_gear_retracted';
  const level = useMaximum ? marks.maximum : marks.normal;
  return { mark: useMaximum ? 'maximum' : 'normal', level: convert(level, checkpoint.unit, 'L') };
}

function assertLitres(name: string, value: number): void {
  if (!Number.isFinite(value) || value < 0)
    throw new Error(`${name} must be a number of litres, zero or more; got ${value}.`);
}

export interface FluidToAddInput {
  checkpoint: Checkpoint;
  /** Current level in litres. */
  currentLevelL: number;
  attitude?: Attitude;
}

/** Litres to add to reach the applicable mark; zero when the level is already at or above it. */
export function fluidToAdd({ checkpoint, currentLevelL, attitude }: FluidToAddInput): number {
  assertLitres('The current level', currentLevelL);
  return Math.max(0, targetMark(checkpoint, attitude).level - currentLevelL);
}

export interface LevelAfterTopUpInput {
  /** Litres. */
  currentLevelL: number;
  /** Litres added. */
  addedL: number;
}

/** The level the glass should show after the top-up, in litres. */
export function levelAfterTopUp({ currentLevelL, addedL }: LevelAfterTopUpInput): number {
  assertLitres('The current level', currentLevelL);
  assertLitres('The fluid added', addedL);
  return currentLevelL + addedL;
}

/** Chemical base of specifications a mechanic may find on a can, so that a mix of bases can be named as such. */
export const knownFluids: readonly Fluid[] = [
  { spec: 'MIL-PRF-5606', base: 'mineral' },
  { spec: 'MIL-PRF-6083', base: 'mineral' },
  { spec: 'MIL-PRF-83282', base: 'synthetic_hydrocarbon' },
  { spec: 'MIL-PRF-87257', base: 'synthetic_hydrocarbon' },
  { spec: 'MIL-PRF-46170', base: 'synthetic_hydrocarbon' },
  { spec: 'SAE AS1241', base: 'phosphate_ester' },
];

const basePhrases: Record<Fluid['base'], Phrase> = {
  mineral: phrase('fluidBaseMineral'),
  synthetic_hydrocarbon: phrase('fluidBaseSyntheticHydrocarbon'),
  phosphate_ester: phrase('fluidBasePhosphateEster'),
};

function sameSpec(a: string, b: string): boolean {
  const normal = (spec: string) => spec.toUpperCase().replace(/[^A-Z0-9]/g, '');
  return normal(a) === normal(b);
}

export type FluidCheck =
  | { allowed: true; fluid: Fluid }
  | {
      allowed: false;
      reason: 'different_base' | 'not_approved';
      /** What the mechanic is told, for the answers to write in their reader's language. */
      words: Phrase;
      /** The words in the language of the process: the screen's on a screen, English on the server. */
      message: string;
      fluid?: Fluid;
    };

/**
 * Whether a fluid specification may go into this type. A fluid of another base than the type's is refused with a
 * stronger message than one that is merely not on the list, because mixing bases damages seals and the system.
 */
export function checkFluidAllowed(
  type: Pick<AircraftTypeDefinition, 'code' | 'fluid'>,
  spec: string | Fluid,
): FluidCheck {
  const specName = typeof spec === 'string' ? spec : spec.spec;
  const approved = type.fluid.allowed.find((fluid) => sameSpec(fluid.spec, specName));
  if (approved !== undefined) return { allowed: true, fluid: approved };
  const fluid = typeof spec === 'string' ? knownFluids.find((known) => sameSpec(known.spec, specName)) : spec;
  const allowedList = type.fluid.allowed.map((allowedFluid) => allowedFluid.spec).join(', ');
  const typeBases = new Set(type.fluid.allowed.map((allowedFluid) => allowedFluid.base));
  if (fluid !== undefined && !typeBases.has(fluid.base)) {
    const words = phrase('fluidDifferentBase', {
      spec: specName,
      base: { phrase: basePhrases[fluid.base] },
      type: type.code,
      typeBases: { phrases: [...typeBases].map((base) => basePhrases[base]), joiner: 'or' },
    });
    return { allowed: false, reason: 'different_base', fluid, words, message: phraseWords(words) };
  }
  const words = phrase('fluidNotApproved', { spec: specName, type: type.code, allowed: allowedList });
  return {
    allowed: false,
    reason: 'not_approved',
    ...(fluid ? { fluid } : {}),
    words,
    message: phraseWords(words),
  };
}

/** One record of fluid put into a system: a top-up entry, or an older card's "fluid added" reading. */
export interface FluidRecord {
  checkId: string;
  system: string | null;
  source: 'servicing' | 'reading';
}

/**
 * Each litre counted once. Checks signed before the top-up became the one fluid record may carry both a top-up
 * entry and a "fluid added" reading for the same system: the entry (quantity as measured, with its fluid and
 * batch) counts and the reading is dropped. A "fluid added" reading with no top-up of its system in its check is the
 * only record of that fluid, so it counts.
 */
export function countedOnce<T extends FluidRecord>(records: readonly T[]): T[] {
  const entered = new Set(
    records.filter((r) => r.source === 'servicing').map((r) => `${r.checkId}\u0000${r.system ?? ''}`),
  );
  return records.filter(
    (r) => r.source === 'servicing' || !entered.has(`${r.checkId}\u0000${r.system ?? ''}`),
  );
}

/** How an older card's "fluid added" checkpoint code ends ("sys1.fluid_added"); its system is the part before. */
export const fluidAddedSuffix = '.fluid_added';
