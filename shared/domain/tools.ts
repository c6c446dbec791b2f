import type { Checkpoint } from '../schemas/limits';
import type { SignedTool, ToolKind } from '../schemas/tools';
import { phrase, type Phrase, type PhraseValue } from '../i18n/phrase';

export type ToolRule = NonNullable<Checkpoint['tool']>;

/** A top-up may be poured from a can or pumped from a cart; when a cart is used it is named (optional). */
export const topUpToolRule: ToolRule = { kinds: ['servicing_cart'], required: false };

/** What a tool is used for, in a refusal: a checkpoint's label as its card names it, or "a top-up". */
export const topUpWhat: PhraseValue = { phrase: phrase('topUp') };

export interface ToolRefusal {
  code: 'tool_required' | 'tool_not_asked' | 'tool_wrong_kind' | 'tool_retired' | 'tool_calibration_overdue';
  /** Why, for the person at the tablet: each screen and each answer writes it in its reader's language. */
  reason: Phrase;
}

/** The short name a mechanic uses for a tool in a sentence ("Gauge PG-014"), and "another gauge". */
const shortNames: Record<ToolKind, { named: string; another: string }> = {
  pressure_gauge: { named: 'toolGauge', another: 'anotherGauge' },
  nitrogen_charging_kit: { named: 'toolChargingKit', another: 'anotherChargingKit' },
  servicing_cart: { named: 'toolServicingCart', another: 'anotherServicingCart' },
};

/** A kind of tool inside a sentence ("pressure gauge"), from the words catalogue. */
const kindInSentence: Record<ToolKind, Phrase> = {
  pressure_gauge: { key: 'words:toolKindInSentence.pressureGauge' },
  nitrogen_charging_kit: { key: 'words:toolKindInSentence.nitrogenChargingKit' },
  servicing_cart: { key: 'words:toolKindInSentence.servicingCart' },
};

const kindsInWords = (kinds: readonly ToolKind[]): PhraseValue => ({
  phrases: kinds.map((k) => kindInSentence[k]),
  joiner: 'or',
});

/**
 * Why a reading (or a top-up) may not be recorded with this tool, or null when it may. A tool is usable up to and
 * including its calibration due date and not after it (common practice, no source; the duty to use calibrated
 * tools is Part-145 145.A.40, from memory). `what` is the checkpoint's label, or `topUpWhat`; `day` is the local
 * day of the reading, "YYYY-MM-DD".
 */
export function toolRefusal(
  what: PhraseValue,
  rule: ToolRule | undefined,
  tool: (SignedTool & { retired: boolean }) | null,
  day: string,
): ToolRefusal | null {
  if (!tool) {
    if (!rule?.required) return null;
    return {
      code: 'tool_required',
      reason: phrase('toolRequired', { what, kinds: kindsInWords(rule.kinds) }),
    };
  }
  const names = shortNames[tool.kind];
  const name: PhraseValue = { phrase: phrase(names.named, { number: tool.number }) };
  if (!rule) return { code: 'tool_not_asked', reason: phrase('toolNotAsked', { what, tool: name }) };
  if (tool.retired) return { code: 'tool_retired', reason: phrase('toolRetired', { tool: name }) };
  if (!rule.kinds.includes(tool.kind)) {
    return {
      code: 'tool_wrong_kind',
      reason: phrase('toolWrongKind', {
        tool: name,
        kind: { phrase: kindInSentence[tool.kind] },
        what,
        kinds: kindsInWords(rule.kinds),
      }),
    };
  }
  if (day > tool.calibrationDue) {
    return {
      code: 'tool_calibration_overdue',
      reason: phrase('toolCalibrationOverdue', {
        tool: name,
        day: { day: tool.calibrationDue },
        another: { phrase: phrase(names.another) },
      }),
    };
  }
  return null;
}
