import { Airframe, Check, CheckDraft } from '../../db/models';
import { notFound } from '../../errors/app-error';

export async function touchDraft(
  input: { id: string; airframeId: number; kind: CheckDraft['kind'] },
  staffId: number,
  now = new Date(),
) {
  if (await Check.findByPk(input.id)) return { id: input.id, created: false, signed: true };
  const airframe = await Airframe.findByPk(input.airframeId);
  if (!airframe) throw notFound(`No airframe with id ${input.airframeId}.`);
  const existing = await CheckDraft.findByPk(input.id);
  if (existing) {
    await existing.update({ touchedAt: now });
    return { id: input.id, created: false, signed: false };
  }
  await CheckDraft.create({
    id: input.id,
    airframeId: input.airframeId,
    kind: input.kind,
    startedBy: staffId,
    startedAt: now,
    touchedAt: now,
  });
  return { id: input.id, created: true, signed: false };
}
