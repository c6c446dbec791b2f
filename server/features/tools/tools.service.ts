import type { Sequelize } from 'sequelize';
import type { CreateToolInput, Tool, UpdateToolInput } from '@shared/schemas/tools';
import { appendAuditEvent, updateAudited } from '@server/audit/audit-trail';
import { isDuplicateKey } from '@server/db/unique-violation';
import { conflict, notFound, refusal } from '@server/errors/app-error';
import { allTools, insertTool, lockTool, type ToolRow } from './tools.repository';
import { inTransaction } from '@server/db/retry';

const toolView = (t: ToolRow): Tool => ({
  id: t.id,
  number: t.number,
  kind: t.kind,
  description: t.description,
  serial: t.serial,
  calibrationDue: t.calibrationDue,
  retiredAt: t.retiredAt ? t.retiredAt.toISOString() : null,
});

/** The register, by tool number; retired tools stay listed (signed checks name them). */
export async function listTools(): Promise<Tool[]> {
  return (await allTools()).map((t) => toolView(t.get({ plain: true })));
}

export async function createTool(sequelize: Sequelize, input: CreateToolInput, actorId: number) {
  const now = new Date();
  try {
    return await inTransaction(sequelize, async (transaction) => {
      const tool = await insertTool({ ...input, retiredAt: null, createdAt: now }, transaction);
      await appendAuditEvent(sequelize, transaction, {
        actorId,
        action: 'tool.registered',
        entity: 'tool',
        entityId: String(tool.id),
        payload: { ...input },
        at: now,
      });
      return toolView(tool.get({ plain: true }));
    });
  } catch (err) {
    if (isDuplicateKey(err))
      throw conflict('tool_number_taken', refusal('tools.numberTaken', { number: input.number }), {
        path: 'number',
      });
    throw err;
  }
}

/** A new calibration certificate (a later due date), or a description or serial put right; audited field by field. */
export async function updateTool(sequelize: Sequelize, id: number, input: UpdateToolInput, actorId: number) {
  return inTransaction(sequelize, async (transaction) => {
    const tool = await lockTool(id, transaction);
    if (!tool) throw notFound(refusal('tools.toolGone'));
    const before = {
      description: tool.description,
      serial: tool.serial,
      calibrationDue: tool.calibrationDue,
    };
    const after = { ...before, ...input };
    const changed = await updateAudited(
      sequelize,
      transaction,
      tool,
      { before, after },
      { actorId, action: 'tool.changed', entity: 'tool', entityId: String(id) },
    );
    return { tool: toolView(tool.get({ plain: true })), changed };
  });
}

/** A tool taken out of use (lost, broken, sold): it can no longer be picked, and records keep naming it. */
export async function retireTool(sequelize: Sequelize, id: number, actorId: number) {
  const now = new Date();
  return inTransaction(sequelize, async (transaction) => {
    const tool = await lockTool(id, transaction);
    if (!tool) throw notFound(refusal('tools.toolGone'));
    if (tool.retiredAt)
      throw conflict('tool_already_retired', refusal('tools.alreadyRetired', { number: tool.number }));
    await updateAudited(
      sequelize,
      transaction,
      tool,
      { before: { retiredAt: null as Date | null }, after: { retiredAt: now } },
      { actorId, action: 'tool.retired', entity: 'tool', entityId: String(id), at: now },
    );
    return toolView(tool.get({ plain: true }));
  });
}
