import { Op } from 'sequelize';
import { Base } from './models';
import { badRequest, refusal } from '@server/errors/app-error';

/**
 * The bases named by their codes, in code order. An unknown code is refused by name (400), so a typo in a board
 * link or a tablet's base never widens a screen to every base.
 */
export async function basesNamed(codes: readonly string[], path = 'bases') {
  if (codes.length === 0) return [];
  const bases = await Base.findAll({ where: { code: { [Op.in]: [...codes] } }, order: [['code', 'ASC']] });
  const unknown = codes.filter((code) => !bases.some((b) => b.code === code));
  if (unknown.length > 0)
    throw badRequest('unknown_base', refusal('bases.unknownCode', { codes: unknown.join(', ') }), { path });
  return bases.map((b) => ({ id: b.id, code: b.code, name: b.name }));
}

/** A base's code and name by id, for a list that shows where a tablet stands. */
export async function baseNames(): Promise<Map<number, { code: string; name: string }>> {
  return new Map((await Base.findAll()).map((b) => [b.id, { code: b.code, name: b.name }]));
}

const rememberedCodes = new Map<string, { id: number; until: number }>();
const rememberCodesMs = 60_000;

/**
 * The ids of the bases named, for a board read every few seconds by every screen. Codes found are remembered for a
 * minute (the app never changes a base's code); a code not found is asked again every time, so a base added behind
 * the application works at once and a typo is always refused.
 */
export async function baseIdsNamed(codes: readonly string[], path = 'bases'): Promise<number[]> {
  const now = Date.now();
  const remembered = codes.map((code) => rememberedCodes.get(code));
  if (remembered.every((r) => r !== undefined && r.until > now)) return remembered.map((r) => r!.id);
  const bases = await basesNamed(codes, path);
  if (rememberedCodes.size > 1_000) rememberedCodes.clear();
  for (const base of bases) rememberedCodes.set(base.code, { id: base.id, until: now + rememberCodesMs });
  return bases.map((base) => base.id);
}
