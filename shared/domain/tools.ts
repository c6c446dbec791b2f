import type { Checkpoint } from '../schemas/limits';
import { toolKindLabels, type SignedTool, type ToolKind } from '../schemas/tools';
import { formatDay } from './when';

export type ToolRule = NonNullable<Checkpoint['tool']>;

/** A top-up may be poured from a can or pumped from a cart; when a cart is used it is named (optional). */
export const topUpToolRule: ToolRule = { kinds: ['servicing_cart'], required: false };

export interface ToolRefusal {
  code: 'tool_required' | 'tool_not_asked' | 'tool_wrong_kind' | 'tool_retired' | 'tool_calibration_overdue';
  message: string;
}

/** The short name a mechanic uses for a tool in a sentence: "Gauge PG-014". */
const shortNames: Record<ToolKind, string> = {
  pressure_gauge: 'gauge',
  nitrogen_charging_kit: 'charging kit',
  servicing_cart: 'servicing cart',
};

const kindsInWords = (kinds: readonly ToolKind[]) =>
  kinds.map((k) => toolKindLabels[k].toLowerCase()).join(' or ');

/**
 * Why a reading (or a top-up) may not be recorded with this tool, or null when it may. A tool is usable up to and
 * including its calibration due date and not after it (common practice, no source; the duty to use calibrated
 * tools is Part-145 145.A.40, from memory). `day` is the local day of the reading, "YYYY-MM-DD".
 */
export function toolRefusal(
  what: string,
  rule: ToolRule | undefined,
  tool: (SignedTool & { retired: boolean }) | null,
  day: string,
): ToolRefusal | null {
  if (!tool) {
    if (!rule?.required) return null;
    return {
      code: 'tool_required',
      message: `${what} is read with a ${kindsInWords(rule.kinds)} from the tools register: scan its tag or pick it.`,
    };
  }
  const name = `${shortNames[tool.kind].charAt(0).toUpperCase()}${shortNames[tool.kind].slice(1)} ${tool.number}`;
  if (!rule) return { code: 'tool_not_asked', message: `${what} is not read with a tool; remove ${name}.` };
  if (tool.retired)
    return {
      code: 'tool_retired',
      message: `${name} has been retired from the tools register; use another.`,
    };
  if (!rule.kinds.includes(tool.kind)) {
    return {
      code: 'tool_wrong_kind',
      message: `${name} is a ${toolKindLabels[tool.kind].toLowerCase()}; ${what} needs a ${kindsInWords(rule.kinds)}.`,
    };
  }
  if (day > tool.calibrationDue) {
    return {
      code: 'tool_calibration_overdue',
      message: `${name} was due for calibration on ${formatDay(tool.calibrationDue)}; use another ${shortNames[tool.kind]}.`,
    };
  }
  return null;
}
