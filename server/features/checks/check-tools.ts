import type { SubmitCheck } from '@shared/schemas/checks';
import type { SignedTool } from '@shared/schemas/tools';
import { localDay } from '@shared/domain/local-time';
import { toolRefusal, topUpToolRule, topUpWhat, type ToolRule } from '@shared/domain/tools';
import type { PhraseValue } from '@shared/i18n/phrase';
import { badRequest, refusal } from '@server/errors/app-error';
import { toolsByNumbers } from './checks.repository';
import type { CheckTarget } from './check-record';

/** The tools a check was taken with, as signed, and their register ids for the rows. */
export interface ToolsUsed {
  /** By checkpoint code: the tool each reading names. */
  readings: Map<string, SignedTool>;
  /** By index of the servicing entry. */
  servicing: (SignedTool | null)[];
  idOf: Map<string, number>;
}

/**
 * Every tool a reading or a top-up names, checked against the register on the day of signing: known, not retired,
 * of a kind the checkpoint is read with, and within its calibration. A checkpoint whose definition requires a tool
 * is refused without one. The first refusal answers; nothing is stored.
 */
export async function toolsUsed(input: SubmitCheck, target: CheckTarget, signedAt: Date): Promise<ToolsUsed> {
  const servicing = input.servicing ?? [];
  const named = [...input.readings.map((r) => r.tool), ...servicing.map((s) => s.tool)];
  const numbers = [...new Set(named.filter((n): n is string => n !== undefined))];
  const rows = await toolsByNumbers(numbers);
  const byNumber = new Map(rows.map((t) => [t.number.toUpperCase(), t]));
  const day = localDay(signedAt, target.limits.definition.timeZone);
  const checkpoints = new Map(target.card.map((c) => [c.code, c]));

  const resolve = (
    number: string | undefined,
    what: PhraseValue,
    rule: ToolRule | undefined,
    path: string,
  ) => {
    const row = number === undefined ? undefined : byNumber.get(number);
    if (number !== undefined && !row)
      throw badRequest('tool_unknown', refusal('checks.toolUnknown', { number }), { path });
    const tool: SignedTool | null = row
      ? {
          number: row.number,
          kind: row.kind,
          description: row.description,
          serial: row.serial,
          calibrationDue: row.calibrationDue,
        }
      : null;
    const refused = toolRefusal(what, rule, tool && { ...tool, retired: row!.retiredAt !== null }, day);
    if (refused) {
      throw badRequest(refused.code, refused.reason, {
        path,
      });
    }
    return tool;
  };

  const readings = new Map<string, SignedTool>();
  input.readings.forEach((r, index) => {
    const checkpoint = checkpoints.get(r.code);
    if (!checkpoint) return;
    const tool = resolve(r.tool, checkpoint.label, checkpoint.tool, `readings.${index}.tool`);
    if (tool) readings.set(r.code, tool);
  });
  const used = servicing.map((s, index) =>
    resolve(s.tool, topUpWhat, topUpToolRule, `servicing.${index}.tool`),
  );
  return { readings, servicing: used, idOf: new Map(rows.map((t) => [t.number, t.id])) };
}
