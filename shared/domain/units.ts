import type { LeakState } from '../schemas/limits';
import {
  pressureUnits,
  temperatureUnits,
  volumeUnits,
  type PressureUnit,
  type TemperatureUnit,
  type Unit,
  type VolumeUnit,
} from '../schemas/unit-codes';

export type Dimension = 'pressure' | 'volume' | 'temperature';

// Exact definitions from NIST SP 811 (2008), appendix B: the pound (avoirdupois) is 0.45359237 kg, standard
// gravity 9.80665 m/s2 and the inch 0.0254 m, so the psi is derived rather than typed in as a rounded factor.
const pascalsPerPsi = (0.45359237 * 9.80665) / (0.0254 * 0.0254);
const litresPerUsGallon = 3.785411784;

const pascalsPer: Record<PressureUnit, number> = { bar: 1e5, psi: pascalsPerPsi, kPa: 1e3, MPa: 1e6 };
const litresPer: Record<VolumeUnit, number> = {
  L: 1,
  US_qt: litresPerUsGallon / 4,
  US_gal: litresPerUsGallon,
  UK_gal: 4.54609,
};

export const canonicalUnit: Record<Dimension, Unit> = { pressure: 'bar', volume: 'L', temperature: 'C' };

export function isPressureUnit(unit: string): unit is PressureUnit {
  return (pressureUnits as readonly string[]).includes(unit);
}

export function isVolumeUnit(unit: string): unit is VolumeUnit {
  return (volumeUnits as readonly string[]).includes(unit);
}

export function isTemperatureUnit(unit: string): unit is TemperatureUnit {
  return (temperatureUnits as readonly string[]).includes(unit);
}

export function dimensionOf(unit: string): Dimension | undefined {
  if (isPressureUnit(unit)) return 'pressure';
  if (isVolumeUnit(unit)) return 'volume';
  if (isTemperatureUnit(unit)) return 'temperature';
  return undefined;
}

function toKelvin(value: number, from: TemperatureUnit): number {
  if (from === 'K') return value;
  if (from === 'C') return value + 273.15;
  return (value - 32) / 1.8 + 273.15;
}

function fromKelvin(kelvin: number, to: TemperatureUnit): number {
  if (to === 'K') return kelvin;
  if (to === 'C') return kelvin - 273.15;
  return (kelvin - 273.15) * 1.8 + 32;
}

function convertTemperature(value: number, from: TemperatureUnit, to: TemperatureUnit): number {
  // C <-> F directly, so that a Celsius value does not pick up the rounding of a detour through kelvin.
  if (from === 'C' && to === 'F') return value * 1.8 + 32;
  if (from === 'F' && to === 'C') return (value - 32) / 1.8;
  return fromKelvin(toKelvin(value, from), to);
}

/** Converts at full precision; throws when a unit is unknown or the two units measure different things. */
export function convert(value: number, from: Unit | string, to: Unit | string): number {
  const fromDimension = dimensionOf(from);
  const toDimension = dimensionOf(to);
  if (fromDimension === undefined || toDimension === undefined) {
    const unknown = [from, to].filter((unit) => dimensionOf(unit) === undefined).join("' and '");
    throw new Error(`Cannot convert from '${from}' to '${to}': unknown unit '${unknown}'.`);
  }
  if (fromDimension !== toDimension) {
    throw new Error(`Cannot convert from '${from}' (${fromDimension}) to '${to}' (${toDimension}).`);
  }
  if (from === to) return value;
  if (isPressureUnit(from) && isPressureUnit(to)) return (value * pascalsPer[from]) / pascalsPer[to];
  if (isVolumeUnit(from) && isVolumeUnit(to)) return (value * litresPer[from]) / litresPer[to];
  if (isTemperatureUnit(from) && isTemperatureUnit(to)) return convertTemperature(value, from, to);
  throw new Error(`Cannot convert from '${from}' to '${to}'.`);
}

const unitLabels: Record<Unit, string> = {
  bar: 'bar',
  psi: 'psi',
  kPa: 'kPa',
  MPa: 'MPa',
  L: 'L',
  US_qt: 'US qt',
  US_gal: 'US gal',
  UK_gal: 'UK gal',
  C: '°C',
  F: '°F',
  K: 'K',
};

/** A unit's name as people write it: "US qt", "°C". */
export const unitLabel = (unit: Unit): string => unitLabels[unit];

export const displayDecimals: Record<Unit, number> = {
  bar: 1,
  psi: 0,
  kPa: 0,
  MPa: 2,
  L: 2,
  US_qt: 2,
  US_gal: 2,
  UK_gal: 2,
  C: 1,
  F: 1,
  K: 1,
};

/** The unit of a leak rate, in words: always counted, never converted. */
export const leakRateUnitWords = 'drops/min';

/** A leak as counted, in words: "No leak", "3 drops/min, dynamic". */
export function formatLeakRate(dropsPerMinute: number, leakState?: LeakState): string {
  if (dropsPerMinute === 0 && leakState === undefined) return 'No leak';
  const rate = `${dropsPerMinute} ${leakRateUnitWords}`;
  return leakState === undefined ? rate : `${rate}, ${leakState}`;
}
