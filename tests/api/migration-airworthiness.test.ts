import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { QueryTypes, type Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findFreePort, startLocalMariadb } from '@server/db/local-server';
import { createSequelize } from '@server/db/connection';
import { initModels } from '@server/db/models';
import { createMigrator } from '@server/db/migrate';
import { chainEvents, lockAuditHeadSql, type AuditHead, type AuditInput } from '@server/audit/audit-trail';
import { auditEventsInsert } from '@server/db/migrations/0008-airworthiness';
import { verifyRecords } from '@server/audit/record-integrity';
import { airframeStatuses } from '@server/features/airframes/airframes.service';
import { canonicalJson, sha256 } from '@server/security/hashing';
import { demoTypes } from '@shared/demo/demo-types';

// Migration 0008 moves existing records to the tech-log model. Records keep their meaning: no row of a table that
// existed before changes, the audit trail still verifies, every hold becomes the defect of its finding (cleared by
// its release, as before), and every defect note becomes a defect that stays open until the records clear it.
// The records here are a copy, made with the schema as it stood at 0007, of the demo's kind of history: invented
// people, the demo RX-4 limits, an in-limits pre-flight, an open hold, and a hold released under the old rules
// after a passing re-check that carried a defect note.

let stop = async () => {};
let sequelize: Sequelize;

const before0008 = [
  'bases',
  'aircraft_types',
  'staff',
  'limits_versions',
  'airframes',
  'tags',
  'checks',
  'readings',
  'holds',
  'hold_corrective_actions',
  'hold_countersigns',
  'acceptances',
  'audit_events',
  'check_drafts',
  'servicing_entries',
];

async function columnsOf(table: string) {
  const rows = await sequelize.query<{ COLUMN_NAME: string }>(
    `SELECT COLUMN_NAME FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? ORDER BY ORDINAL_POSITION`,
    { replacements: [table], type: QueryTypes.SELECT },
  );
  return rows.map((r) => r.COLUMN_NAME);
}

async function snapshot(columns: Map<string, string[]>) {
  const out: Record<string, unknown[]> = {};
  for (const [table, cols] of columns) {
    out[table] = await sequelize.query(
      `SELECT ${cols.map((c) => `\`${c}\``).join(', ')} FROM \`${table}\` ORDER BY 1`,
      { type: QueryTypes.SELECT },
    );
  }
  return out;
}

const insert = (sql: string, replacements: unknown[]) =>
  sequelize.query(sql, { replacements, type: QueryTypes.INSERT });

function signedCheck(
  kind: string,
  readings: { code: string; entry: unknown; verdict: string; bandId: string }[],
  note: string | null,
  signedAt: Date,
) {
  // Every column the record check compares with what was signed, as a 0007 signature held them.
  const content = canonicalJson({
    kind,
    readings,
    note,
    context: { attitude: 'on_wheels' },
    signedAt: signedAt.toISOString(),
    airframeHours: 100,
    correctsCheckId: null,
    limitsVersion: 1,
    servicing: [],
  });
  return { content, hash: sha256(content) };
}

async function oldRecords() {
  const t0 = new Date('2026-11-30T07:00:00Z');
  const at = (minutes: number) => new Date(t0.getTime() + minutes * 60_000);
  await insert('INSERT INTO bases (id, code, name) VALUES (1, ?, ?)', ['NP', 'North Pad']);
  await insert('INSERT INTO aircraft_types (id, code, name, created_at) VALUES (1, ?, ?, ?)', [
    'RX-4',
    'RX-4 medium twin',
    t0,
  ]);
  const person = (id: number, badge: string, name: string, roles: string) =>
    insert(
      `INSERT INTO staff (id, badge_number, name, licence_number, roles, pin_hash, failed_attempts, must_change_pin, active, created_at)
       VALUES (?, ?, ?, ?, ?, 'x', 0, 0, 1, ?)`,
      [id, badge, name, `TIA-${badge}`, roles, t0],
    );
  await person(1, '4101', 'Ines Calder', 'mechanic');
  await person(2, '5201', 'Jonah Pell', 'shift_lead,mechanic');
  await person(3, '4102', 'Tomas Reyna', 'mechanic');
  await insert(
    `INSERT INTO limits_versions (id, type_id, version, status, definition, published_at, created_at) VALUES (1, 1, 1, 'published', ?, ?, ?)`,
    [JSON.stringify(demoTypes[0]), t0, t0],
  );
  for (const [id, fleet] of [
    [1, 'T-01'],
    [2, 'T-03'],
    [3, 'T-04'],
  ] as const) {
    await insert(
      `INSERT INTO airframes (id, fleet_number, serial, type_id, base_id, hours, active, created_at) VALUES (?, ?, ?, 1, 1, 100.0, 1, ?)`,
      [id, fleet, `S-${id}`, t0],
    );
  }
  const events: AuditInput[] = [];
  const check = async (
    id: string,
    airframe: number,
    verdict: string,
    level: number,
    signedBy: number,
    minutes: number,
    note: string | null = null,
  ) => {
    const readingVerdict = verdict;
    const bandId = verdict === 'in_limits' ? 'in_limits_wheels' : 'isolated';
    const readings = [
      { code: 'sys1.level', entry: { value: level, unit: 'L' }, verdict: readingVerdict, bandId },
    ];
    const signed = signedCheck('pre_flight', readings, note, at(minutes));
    await insert(
      `INSERT INTO checks (id, airframe_id, kind, limits_version_id, context, verdict, note, airframe_hours, signed_by, signed_at,
                           content_hash, submission_hash, signed_content, created_at)
       VALUES (?, ?, 'pre_flight', 1, '{"attitude":"on_wheels"}', ?, ?, 100.0, ?, ?, ?, ?, ?, ?)`,
      [
        id,
        airframe,
        verdict,
        note,
        signedBy,
        at(minutes),
        signed.hash,
        signed.hash,
        signed.content,
        at(minutes),
      ],
    );
    await insert(
      `INSERT INTO readings (check_id, seq, checkpoint_code, entry, value, unit, verdict, band_id, message, action)
       VALUES (?, 0, 'sys1.level', ?, ?, 'L', ?, ?, 'm', 'a')`,
      [id, canonicalJson({ value: level, unit: 'L' }), level, readingVerdict, bandId],
    );
    events.push({
      actorId: signedBy,
      action: 'check.signed',
      entity: 'check',
      entityId: id,
      payload: { contentHash: signed.hash },
      at: at(minutes),
    });
  };
  const hold = async (id: number, airframe: number, checkId: string, minutes: number) => {
    await insert(`INSERT INTO holds (id, airframe_id, check_id, reason, opened_at) VALUES (?, ?, ?, ?, ?)`, [
      id,
      airframe,
      checkId,
      'System 1 reservoir level: at the low-level switch',
      at(minutes),
    ]);
    events.push({
      actorId: 1,
      action: 'hold.opened',
      entity: 'hold',
      entityId: String(id),
      payload: { checkId },
      at: at(minutes),
    });
  };
  await check('00000000-0000-4000-8000-000000000001', 1, 'in_limits', 7.0, 1, 0);
  await check('00000000-0000-4000-8000-000000000002', 2, 'out_of_limits', 2.9, 1, 10);
  await hold(1, 2, '00000000-0000-4000-8000-000000000002', 10);
  await check('00000000-0000-4000-8000-000000000003', 3, 'out_of_limits', 2.9, 1, 20);
  await hold(2, 3, '00000000-0000-4000-8000-000000000003', 20);
  await insert(
    `INSERT INTO hold_corrective_actions (id, hold_id, text, recorded_by, recorded_at) VALUES (1, 2, ?, 3, ?)`,
    ['Seal replaced, topped up to the normal mark.', at(30)],
  );
  events.push({
    actorId: 3,
    action: 'hold.corrective_action',
    entity: 'hold',
    entityId: '2',
    payload: { correctiveActionId: 1 },
    at: at(30),
  });
  await check(
    '00000000-0000-4000-8000-000000000004',
    3,
    'in_limits',
    7.0,
    3,
    40,
    'Cabin door seal worn at the lower corner.',
  );
  const countersign = canonicalJson({
    hold: 2,
    decision: 'release',
    reason: null,
    recheck: '00000000-0000-4000-8000-000000000004',
  });
  await insert(
    `INSERT INTO hold_countersigns (id, hold_id, decision, reason, recheck_check_id, signed_by, signed_at, signed_with, content_hash, signed_content)
     VALUES (1, 2, 'release', NULL, '00000000-0000-4000-8000-000000000004', 2, ?, 'password', ?, ?)`,
    [at(50), sha256(countersign), countersign],
  );
  await sequelize.query('UPDATE holds SET released_at = ?, released_by = 2 WHERE id = 2', {
    replacements: [at(50)],
  });
  events.push({
    actorId: 2,
    action: 'hold.released',
    entity: 'hold',
    entityId: '2',
    payload: { countersignId: 1, contentHash: sha256(countersign) },
    at: at(50),
  });
  await sequelize.transaction(async (transaction) => {
    const [head] = await sequelize.query<AuditHead>(lockAuditHeadSql(), {
      type: QueryTypes.SELECT,
      transaction,
    });
    const chained = chainEvents(head, events);
    for (const s of [auditEventsInsert(chained.events), chained.updateHead])
      await sequelize.query(s.sql, { replacements: s.values, transaction });
  });
}

beforeAll(async () => {
  const db = await startLocalMariadb({
    dataDir: mkdtempSync(join(tmpdir(), 'gaugewalk-migration-')),
    port: await findFreePort(0),
    database: 'gaugewalk_migration',
    ephemeral: true,
    quiet: true,
  });
  stop = db.stop;
  sequelize = createSequelize(db.url, { pool: 3 });
  await createMigrator(sequelize).up({ to: '0007-mail-retries' });
  await oldRecords();
}, 60_000);

afterAll(async () => {
  await sequelize?.close();
  await stop();
});

describe('migration 0008: existing records into the tech-log model', () => {
  it('when the records of a 0007 database are migrated, then no existing row changes, the trail verifies, holds and defect notes become defects, and each airframe reads what the records say', async () => {
    const columns = new Map(await Promise.all(before0008.map(async (t) => [t, await columnsOf(t)] as const)));
    const before = await snapshot(columns);
    expect(before.checks).toHaveLength(4);

    await createMigrator(sequelize).up();
    initModels(sequelize);
    const after = await snapshot(columns);
    // The trail only grows: the old events are as they were, and each new one records a migrated defect.
    const appended = after.audit_events!.slice(before.audit_events!.length) as { action: string }[];
    after.audit_events = after.audit_events!.slice(0, before.audit_events!.length);
    expect(after).toEqual(before);
    expect(appended.map((e) => e.action)).toEqual(['defect.recorded', 'defect.recorded', 'defect.recorded']);
    expect(await verifyRecords(sequelize)).toMatchObject({ ok: true, firstBroken: null });

    const defects = await sequelize.query<{
      id: number;
      airframe_id: number;
      source: string;
      hold_id: number | null;
      check_id: string;
      description: string;
    }>('SELECT id, airframe_id, source, hold_id, check_id, description FROM defects ORDER BY id', {
      type: QueryTypes.SELECT,
    });
    expect(defects.map(({ id: _id, ...d }) => d)).toEqual([
      {
        airframe_id: 2,
        source: 'finding',
        hold_id: 1,
        check_id: '00000000-0000-4000-8000-000000000002',
        description: 'System 1 reservoir level: at the low-level switch',
      },
      {
        airframe_id: 3,
        source: 'finding',
        hold_id: 2,
        check_id: '00000000-0000-4000-8000-000000000003',
        description: 'System 1 reservoir level: at the low-level switch',
      },
      {
        airframe_id: 3,
        source: 'check_note',
        hold_id: null,
        check_id: '00000000-0000-4000-8000-000000000004',
        description: 'Cabin door seal worn at the lower corner.',
      },
    ]);
    const [legacy] = await sequelize.query<{ legacy: number }>(
      'SELECT legacy FROM hold_countersigns WHERE id = 1',
      { type: QueryTypes.SELECT },
    );
    expect(legacy?.legacy).toBe(1);

    // Read a day after the records: the pre-flights have run out, which says nothing about findings.
    const states = await airframeStatuses(sequelize, new Date('2026-11-30T12:00:00Z'));
    const byFleet = Object.fromEntries(states.map((s) => [s.summary.fleetNumber, s.summary]));
    expect(byFleet['T-01']).toMatchObject({ state: 'checks_in_limits', causes: [] });
    expect(byFleet['T-03']).toMatchObject({ state: 'unserviceable', causes: ['on_hold'] });
    // The hold released under the old rules stays released; the defect note was never cleared, so it counts.
    expect(byFleet['T-04']).toMatchObject({ state: 'unserviceable', causes: ['open_defect'] });
    expect(byFleet['T-04']!.openHolds).toEqual([]);
  });
});
