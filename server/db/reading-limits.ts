import type { StoredCheck } from '@shared/schemas/checks';
import type { Checkpoint, LimitBand } from '@shared/schemas/limits';
import type { ReadingAgainstLimits } from '@shared/schemas/checks';
import { leakRateUnitWords } from '@shared/domain/units';
import { limitsById } from './limits-store';

const unitLabel = (unit: string | null) => (unit ? ` ${unit.replace('_', ' ')}` : '');

/** A band's edges in words, keeping open and closed edges apart ("below 100" is not "at or below 100"). */
export function describeBand(band: LimitBand, checkpoint: Pick<Checkpoint, 'kind' | 'unit'>): string {
  if (checkpoint.kind === 'yes_no') {
    const yes = (band.lower?.value ?? 0) > 0 || (band.lower?.value === 0 && !band.lower.closed);
    return yes ? 'answer yes' : 'answer no';
  }
  const leak = checkpoint.kind === 'leak_rate';
  const unit = leak ? ` ${leakRateUnitWords}` : unitLabel(checkpoint.unit);
  const lower = band.lower && `${band.lower.closed ? 'at or above' : 'above'} ${band.lower.value}${unit}`;
  const upper = band.upper && `${band.upper.closed ? 'at or below' : 'below'} ${band.upper.value}${unit}`;
  const edges = lower && upper ? `${lower} and ${upper}` : (lower ?? upper ?? 'any value');
  return leak && band.when?.leakState ? `${edges} for a ${band.when.leakState} leak` : edges;
}

/** A pre-charge has no fixed bands: its limit is the temperature-corrected expected pressure plus or minus the tolerance. */
function prechargeText(checkpoint: Checkpoint, expected: number | null): string | null {
  if (!checkpoint.precharge || expected === null) return null;
  const unit = unitLabel(checkpoint.unit);
  return `expected ${expected.toFixed(1)}${unit} plus or minus ${checkpoint.precharge.tolerance}${unit} at the ambient temperature`;
}

/** Each reading of a stored check next to the band of the limits version it was judged against. */
export async function readingsAgainstLimits(check: StoredCheck): Promise<ReadingAgainstLimits[]> {
  const limits = await limitsById(check.limitsVersion.id);
  const checkpoints = new Map((limits?.definition.checkpoints ?? []).map((c) => [c.code, c]));
  return check.readings.map((reading) => {
    const checkpoint = checkpoints.get(reading.code);
    const band = checkpoint?.bands.find((b) => b.id === reading.bandId) ?? null;
    return {
      ...reading,
      canonicalUnit: checkpoint?.unit ?? null,
      system: checkpoint?.system ?? null,
      band,
      limitText: checkpoint
        ? band
          ? describeBand(band, checkpoint)
          : prechargeText(checkpoint, reading.expected)
        : null,
      marks: checkpoint?.marks ?? null,
      reference: checkpoint?.reference ?? null,
    };
  });
}
