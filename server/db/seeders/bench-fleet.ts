import { createConnection, type Connection } from 'mariadb';
import { randomUUID } from 'node:crypto';
import { spawnSync } from 'node:child_process';
import { demoTypes } from '@shared/demo/demo-types';
import { evaluateReading } from '@shared/domain/limits';
import { storedValue } from '@shared/domain/reading-input';
import type {
  AircraftTypeDefinition,
  CheckContext,
  CheckKind,
  Checkpoint,
  ReadingEntry,
} from '@shared/schemas/limits';
import { eventHash } from '@server/audit/trail-chain';
import { canonicalJson, randomToken, sha256 } from '@server/security/hashing';
import { parseDatabaseUrl } from '@server/backup/backup';

export interface FleetSize {
  airframes: number;
  readings: number;
  days: number;
  /** Invented bases added to the demo's two (at most 8); the airframes are spread over all of them. */
  bases: number;
}

interface SeedIds {
  typeIds: Map<string, number>;
  limitsIds: Map<string, number>;
  signerIds: number[];
}

const inventedBases = [
  { code: 'WF', name: 'West Field (bench)' },
  { code: 'SR', name: 'Summit Ridge (bench)' },
  { code: 'LK', name: 'Lake Base (bench)' },
  { code: 'CS', name: 'Cedar Strip (bench)' },
  { code: 'DY', name: 'Delta Yard (bench)' },
  { code: 'FP', name: 'Fjord Point (bench)' },
  { code: 'GP', name: 'Granite Pad (bench)' },
  { code: 'OF', name: 'Orchard Field (bench)' },
];

/** The code of the bench's first invented base, whose board the bench measures. */
export const benchBoardBase = inventedBases[0]!.code;

const contexts: Record<CheckKind, CheckContext> = {
  pre_flight: { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 15 },
  after_flight: { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 18 },
  ground_run: { attitude: 'on_wheels', systemPressure: 'on', ambientTempC: 16 },
  servicing: { attitude: 'on_wheels', systemPressure: 'relieved', ambientTempC: 15 },
};

/** A reading in the middle of the checkpoint's in-limits band; levels wander a little below normal for trends. */
function goodEntry(cp: Checkpoint, jitter: number): ReadingEntry {
  if (cp.kind === 'leak_rate') return { dropsPerMinute: 0 };
  if (cp.kind === 'yes_no') return { answer: cp.bands.find((b) => b.id === 'no')?.verdict !== 'in_limits' };
  if (cp.precharge) return { value: cp.precharge.referencePressure, unit: cp.unit! };
  if (cp.kind === 'level' && cp.marks?.normal !== undefined)
    return { value: Math.round(cp.marks.normal * (1 - 0.04 * jitter) * 100) / 100, unit: cp.unit! };
  const band = cp.bands.find((b) => b.verdict === 'in_limits' && !b.when) ?? cp.bands[0]!;
  const lower = band.lower?.value ?? cp.range.min;
  const upper = band.upper?.value ?? cp.range.max;
  return { value: Math.round(((lower + upper) / 2) * 10) / 10, unit: cp.unit! };
}

function cardOf(definition: AircraftTypeDefinition, kind: CheckKind) {
  const byCode = new Map(definition.checkpoints.map((c) => [c.code, c]));
  return (definition.cards[kind] ?? []).map((code) => byCode.get(code)!);
}

async function insertRows(conn: Connection, table: string, columns: string[], rows: unknown[][]) {
  const chunk = 2_000;
  for (let i = 0; i < rows.length; i += chunk) {
    const part = rows.slice(i, i + chunk);
    const one = `(${columns.map(() => '?').join(',')})`;
    await conn.query(
      `INSERT INTO ${table} (${columns.join(',')}) VALUES ${part.map(() => one).join(',')}`,
      part.flat(),
    );
  }
}

type BenchType = { definition: AircraftTypeDefinition; typeId: number; limitsId: number };
type BenchAirframe = { id: number; fleet_number: string; type_id: number };

/** The bench's bases, airframes (three RX-4 to two RL-2) and their tags. */
async function seedAirframes(conn: Connection, size: FleetSize, types: BenchType[], now: number) {
  await insertRows(
    conn,
    'bases',
    ['code', 'name'],
    inventedBases
      .slice(0, Math.min(Math.max(size.bases, 1), inventedBases.length))
      .map((b) => [b.code, b.name]),
  );
  const bases = (await conn.query('SELECT id FROM bases ORDER BY id')) as { id: number }[];
  const airframeRows = Array.from({ length: size.airframes }, (_, i) => {
    const type = types[i % 5 < 3 ? 0 : 1]!;
    return [
      `B-${String(i + 1).padStart(3, '0')}`,
      `${type.definition.code}-B${10000 + i}`,
      type.typeId,
      bases[i % bases.length]!.id,
      500 + ((i * 37) % 5000),
      1,
      new Date(now - size.days * 86_400_000),
    ];
  });
  await insertRows(
    conn,
    'airframes',
    ['fleet_number', 'serial', 'type_id', 'base_id', 'hours', 'active', 'created_at'],
    airframeRows,
  );
  const airframes = (await conn.query(
    "SELECT id, fleet_number, type_id FROM airframes WHERE fleet_number LIKE 'B-%' ORDER BY id",
  )) as BenchAirframe[];
  await insertRows(
    conn,
    'tags',
    ['airframe_id', 'token', 'issued_at'],
    airframes.map((a) => [a.id, randomToken(12), new Date()]),
  );
  return airframes;
}

interface CheckBatch {
  checkRows: unknown[][];
  readingRows: unknown[][];
  eventRows: unknown[][];
}

/** What the bench's invented check would have signed, in the product's shape. */
function signedContentOf(
  id: string,
  kind: CheckKind,
  check: { airframe: BenchAirframe; type: BenchType; signedAt: Date; hours: number },
  judged: { cp: Checkpoint; entry: object; result: { verdict: string; band: { id: string } } }[],
) {
  const { airframe, type, signedAt, hours } = check;
  const context = contexts[kind];
  return canonicalJson({
    id,
    fleetNumber: airframe.fleet_number,
    kind,
    typeCode: type.definition.code,
    limitsVersion: 1,
    context,
    readings: judged.map((j) => ({
      code: j.cp.code,
      entry: j.entry,
      verdict: j.result.verdict,
      bandId: j.result.band.id,
    })),
    servicing: [],
    photos: [],
    signer: { badge: 'bench', name: 'Bench mechanic', licence: null },
    signedAt: signedAt.toISOString(),
    airframeHours: hours,
    note: null,
    correctsCheckId: null,
  });
}

/** The card's readings, each in the middle of its in-limits band, judged by the real limits engine. */
function judgeCard(type: BenchType, kind: CheckKind, n: number) {
  const context = contexts[kind];
  return cardOf(type.definition, kind).map((cp, seq) => {
    const entry = goodEntry(cp, ((n + seq) % 10) / 10);
    return { cp, seq, entry, result: evaluateReading(cp, { ...entry, context }) };
  });
}

function readingRowsOf(id: string, judged: ReturnType<typeof judgeCard>) {
  return judged.map(({ cp, seq, entry, result }) => [
    id,
    seq,
    cp.code,
    canonicalJson(entry),
    storedValue(entry),
    'value' in entry ? entry.unit : null,
    result.verdict,
    result.band.id,
    result.message,
    result.action,
    result.expected ?? null,
  ]);
}

/** The rows of one invented signed check, its readings judged by the real limits engine, appended to `batch`. */
function inventCheck(
  batch: CheckBatch,
  check: {
    n: number;
    airframe: BenchAirframe;
    type: BenchType;
    signedAt: Date;
    signer: number;
    hours: number;
  },
  chain: { prevHash: string; eventId: number },
) {
  const { n, airframe, type, signedAt, signer, hours } = check;
  const roll = (n * 7919) % 10;
  const kind: CheckKind = roll < 7 ? 'pre_flight' : roll < 9 ? 'after_flight' : 'ground_run';
  const context = contexts[kind];
  const id = randomUUID();
  const judged = judgeCard(type, kind, n);
  const verdict = judged.some((j) => j.result.verdict === 'out_of_limits')
    ? 'out_of_limits'
    : judged.some((j) => j.result.verdict === 'service')
      ? 'service'
      : 'in_limits';
  const signedContent = signedContentOf(id, kind, check, judged);
  const contentHash = sha256(signedContent);
  batch.checkRows.push([
    id,
    airframe.id,
    kind,
    type.limitsId,
    canonicalJson(context),
    verdict,
    hours,
    signer,
    signedAt,
    contentHash,
    signedContent,
    sha256(id),
    signedAt,
  ]);
  batch.readingRows.push(...readingRowsOf(id, judged));
  const payload = canonicalJson({ contentHash, verdict, limitsVersionId: type.limitsId });
  const fields = {
    at: signedAt,
    actorId: signer,
    action: 'check.signed',
    entity: 'check',
    entityId: id,
    payload,
  };
  const hash = eventHash(chain.prevHash, fields);
  chain.eventId += 1;
  batch.eventRows.push([
    chain.eventId,
    signedAt,
    signer,
    'check.signed',
    'check',
    id,
    payload,
    chain.prevHash,
    hash,
  ]);
  chain.prevHash = hash;
  return { kind, readings: judged.length };
}

const checkColumns = [
  'id',
  'airframe_id',
  'kind',
  'limits_version_id',
  'context',
  'verdict',
  'airframe_hours',
  'signed_by',
  'signed_at',
  'content_hash',
  'signed_content',
  'submission_hash',
  'created_at',
];
const readingColumns = [
  'check_id',
  'seq',
  'checkpoint_code',
  'entry',
  'value',
  'unit',
  'verdict',
  'band_id',
  'message',
  'action',
  'expected',
];
const eventColumns = [
  'id',
  'at',
  'actor_id',
  'action',
  'entity',
  'entity_id',
  'payload',
  'prev_hash',
  'hash',
];

async function writeBatch(conn: Connection, batch: CheckBatch, chain: { prevHash: string; eventId: number }) {
  await conn.beginTransaction();
  await insertRows(conn, 'checks', checkColumns, batch.checkRows);
  await insertRows(conn, 'readings', readingColumns, batch.readingRows);
  await insertRows(conn, 'audit_events', eventColumns, batch.eventRows);
  await conn.query('UPDATE audit_head SET hash = ?, last_event_id = ? WHERE id = 1', [
    chain.prevHash,
    chain.eventId,
  ]);
  await conn.commit();
}

/** Signed checks spread evenly over `days` up to now, round the fleet, in batches of 2,000. */
async function seedChecks(
  conn: Connection,
  size: FleetSize,
  ids: SeedIds,
  types: BenchType[],
  airframes: BenchAirframe[],
  now: number,
) {
  const avgPerCheck =
    types.reduce((sum, t, i) => sum + (i === 0 ? 0.6 : 0.4) * cardOf(t.definition, 'pre_flight').length, 0) ||
    6;
  const plannedChecks = Math.ceil((size.readings / avgPerCheck) * 1.02);
  const stepMs = (size.days * 86_400_000) / plannedChecks;
  const [head] = (await conn.query('SELECT hash FROM audit_head WHERE id = 1')) as { hash: string }[];
  const [maxEvent] = (await conn.query('SELECT COALESCE(MAX(id), 0) AS id FROM audit_events')) as {
    id: number;
  }[];
  const chain = { prevHash: head!.hash, eventId: Number(maxEvent!.id) };
  let readings = 0;
  let checks = 0;
  const hoursByAirframe = new Map(airframes.map((a) => [a.id, 500]));
  while (readings < size.readings) {
    const batch: CheckBatch = { checkRows: [], readingRows: [], eventRows: [] };
    for (let n = 0; n < 2_000 && readings < size.readings; n++) {
      const airframe = airframes[checks % airframes.length]!;
      const roll = (checks * 7919) % 10;
      const hours = hoursByAirframe.get(airframe.id)! + (roll >= 7 && roll < 9 ? 1.3 : 0);
      hoursByAirframe.set(airframe.id, hours);
      const made = inventCheck(
        batch,
        {
          n: checks,
          airframe,
          type: types.find((t) => t.typeId === airframe.type_id)!,
          signedAt: new Date(now - size.days * 86_400_000 + checks * stepMs),
          signer: ids.signerIds[checks % ids.signerIds.length]!,
          hours,
        },
        chain,
      );
      readings += made.readings;
      checks += 1;
    }
    await writeBatch(conn, batch, chain);
  }
  return { checks, readings };
}

/**
 * Seeds an invented fleet in bulk with multi-row INSERTs through the bare connector: the checks, their readings
 * judged by the real limits engine, and a hash-chained audit event for each, spread over `days` up to now.
 */
export async function seedFleet(databaseUrl: string, socket: string, size: FleetSize, ids: SeedIds) {
  const target = parseDatabaseUrl(databaseUrl);
  // Bulk load only: the log is flushed about once a second; the benchmarks run with the default (1) again.
  const root = (sql: string) =>
    spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-e', sql], { encoding: 'utf8' });
  root('SET GLOBAL innodb_flush_log_at_trx_commit = 2');
  const conn = await createConnection({
    ...target,
    permitSetMultiParamEntries: false,
    maxAllowedPacket: 64 << 20,
  });
  try {
    await conn.query('SET foreign_key_checks = 0, unique_checks = 0');
    const types = demoTypes.map((d) => ({
      definition: d,
      typeId: ids.typeIds.get(d.code)!,
      limitsId: ids.limitsIds.get(d.code)!,
    }));
    const now = Date.now();
    const airframes = await seedAirframes(conn, size, types, now);
    const { checks, readings } = await seedChecks(conn, size, ids, types, airframes, now);
    await conn.query('ANALYZE TABLE checks, readings, audit_events, airframes');
    return { airframes: airframes.length, checks, readings };
  } finally {
    await conn.end();
    root('SET GLOBAL innodb_flush_log_at_trx_commit = 1');
  }
}
