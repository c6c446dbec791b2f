import type { AircraftTypeDefinition, Checkpoint, LimitBand } from '@shared/schemas/limits';
import { checkKindSchema } from '@shared/schemas/limits';
import type { CheckpointDiff, FieldChange, LimitsDiff } from '@shared/schemas/engineering-types';
import { canonicalJson } from '@server/security/hashing';

const same = (a: unknown, b: unknown) => canonicalJson(a ?? null) === canonicalJson(b ?? null);

function fieldChanges<T extends object>(from: T, to: T, skip: (keyof T)[] = []): FieldChange[] {
  const keys = [...new Set([...Object.keys(from), ...Object.keys(to)])] as (keyof T)[];
  return keys
    .filter((k) => !skip.includes(k) && !same(from[k], to[k]))
    .sort()
    .map((k) => ({ field: String(k), from: from[k] ?? null, to: to[k] ?? null }));
}

function bandChanges(from: LimitBand[], to: LimitBand[]): CheckpointDiff['bands'] {
  const before = new Map(from.map((b) => [b.id, b]));
  const after = new Map(to.map((b) => [b.id, b]));
  const changes: CheckpointDiff['bands'] = [];
  for (const band of from) {
    const next = after.get(band.id);
    if (!next) changes.push({ id: band.id, change: 'removed', fields: [] });
    else {
      const fields = fieldChanges(band, next);
      if (fields.length) changes.push({ id: band.id, change: 'changed', fields });
    }
  }
  for (const band of to) if (!before.has(band.id)) changes.push({ id: band.id, change: 'added', fields: [] });
  return changes;
}

/** What changed between two definitions of one type: checkpoints by code, bands by id, cards by kind. */
export function diffDefinitions(
  fromMeta: LimitsDiff['from'],
  from: AircraftTypeDefinition,
  toMeta: LimitsDiff['to'],
  to: AircraftTypeDefinition,
): LimitsDiff {
  const before = new Map(from.checkpoints.map((c) => [c.code, c]));
  const after = new Map(to.checkpoints.map((c) => [c.code, c]));
  const checkpoints: CheckpointDiff[] = [];
  const entry = (
    c: Checkpoint,
    change: CheckpointDiff['change'],
    prev: Checkpoint | null,
    next: Checkpoint | null,
  ) => ({
    code: c.code,
    label: c.label,
    change,
    fields: prev && next ? fieldChanges(prev, next, ['bands']) : [],
    bands: prev && next ? bandChanges(prev.bands, next.bands) : [],
    from: prev,
    to: next,
  });
  for (const c of from.checkpoints) {
    const next = after.get(c.code);
    if (!next) checkpoints.push(entry(c, 'removed', c, null));
    else {
      const e = entry(next, 'changed', c, next);
      if (e.fields.length || e.bands.length) checkpoints.push(e);
    }
  }
  for (const c of to.checkpoints) if (!before.has(c.code)) checkpoints.push(entry(c, 'added', null, c));
  const cards = checkKindSchema.options
    .filter((kind) => !same(from.cards[kind], to.cards[kind]))
    .map((kind) => ({ kind, from: from.cards[kind] ?? [], to: to.cards[kind] ?? [] }));
  return {
    from: fromMeta,
    to: toMeta,
    type: fieldChanges(from, to, ['checkpoints', 'cards', 'code']),
    cards,
    checkpoints,
  };
}
