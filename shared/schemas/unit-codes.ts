// The units a limit may be written in, as codes. Kept apart from the zod schemas (limits.ts) so a screen that only
// writes a figure with its unit does not load zod.
export const pressureUnits = ['bar', 'psi', 'kPa', 'MPa'] as const;
export const volumeUnits = ['L', 'US_qt', 'US_gal', 'UK_gal'] as const;
export const temperatureUnits = ['C', 'F', 'K'] as const;

export type PressureUnit = (typeof pressureUnits)[number];
export type VolumeUnit = (typeof volumeUnits)[number];
export type TemperatureUnit = (typeof temperatureUnits)[number];
export type Unit = PressureUnit | VolumeUnit | TemperatureUnit;
