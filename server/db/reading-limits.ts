import type { StoredCheck } from '@shared/schemas/checks';
import type { Checkpoint, LimitBand } from '@shared/schemas/limits';
import type { ReadingAgainstLimits } from '@shared/schemas/checks';
import { languageOfTranslate, localNumber } from '@shared/domain/words';
import { sourceLanguage } from '@shared/i18n/languages';
import { englishTranslate, say, type Translate } from '@shared/i18n/translate';
import { limitsById } from './limits-store';

const unitLabel = (unit: string | null) => (unit ? ` ${unit.replace('_', ' ')}` : '');

/** A number as the language writes it, with the decimals it has: "5.5" in English, "5,5" in German. */
function plainNumber(value: number, t: Translate): string {
  const language = languageOfTranslate(t);
  return language === sourceLanguage
    ? String(value)
    : new Intl.NumberFormat(language, { maximumFractionDigits: 10, useGrouping: false }).format(value);
}

/**
 * A band's edges in words, keeping open and closed edges apart ("below 100" is not "at or below 100"), in the
 * language of `t` (English by default).
 */
export function describeBand(
  band: LimitBand,
  checkpoint: Pick<Checkpoint, 'kind' | 'unit'>,
  t: Translate = englishTranslate(),
): string {
  const w = (key: string, values?: Record<string, unknown>) => say(t, `words:band.${key}`, values);
  if (checkpoint.kind === 'yes_no') {
    const yes = (band.lower?.value ?? 0) > 0 || (band.lower?.value === 0 && !band.lower.closed);
    return yes ? w('answerYes') : w('answerNo');
  }
  const leak = checkpoint.kind === 'leak_rate';
  const unit = leak ? ` ${say(t, 'words:leak.unit')}` : unitLabel(checkpoint.unit);
  const edge = (key: string, value: number) => w(key, { value: `${plainNumber(value, t)}${unit}` });
  const lower = band.lower && edge(band.lower.closed ? 'atOrAbove' : 'above', band.lower.value);
  const upper = band.upper && edge(band.upper.closed ? 'atOrBelow' : 'below', band.upper.value);
  const edges = lower && upper ? w('both', { lower, upper }) : (lower ?? upper ?? w('any'));
  if (!leak || !band.when?.leakState) return edges;
  return w(band.when.leakState === 'static' ? 'staticLeak' : 'dynamicLeak', { edges });
}

/** A pre-charge has no fixed bands: its limit is the temperature-corrected expected pressure plus or minus the tolerance. */
function prechargeText(checkpoint: Checkpoint, expected: number | null, t: Translate): string | null {
  if (!checkpoint.precharge || expected === null) return null;
  const unit = unitLabel(checkpoint.unit);
  return say(t, 'words:band.precharge', {
    expected: `${localNumber(expected, 1, t)}${unit}`,
    tolerance: `${plainNumber(checkpoint.precharge.tolerance, t)}${unit}`,
  });
}

/** Each reading of a stored check next to the band of the limits version it was judged against. */
export async function readingsAgainstLimits(
  check: StoredCheck,
  t: Translate = englishTranslate(),
): Promise<ReadingAgainstLimits[]> {
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
          ? describeBand(band, checkpoint, t)
          : prechargeText(checkpoint, reading.expected, t)
        : null,
      marks: checkpoint?.marks ?? null,
      reference: checkpoint?.reference ?? null,
    };
  });
}
