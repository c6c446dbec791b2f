import type { Sequelize } from 'sequelize';
import { stringify } from 'csv-stringify/sync';
import type { ExportCell, RecordExport, RecordExportName, RecordSearch } from '@shared/schemas/records';
import { formatDay, formatInstant } from '@shared/domain/when';
import { english } from '@shared/i18n/english';
import { sourceLanguage, type Language } from '@shared/i18n/languages';
import { say } from '@shared/i18n/translate';
import { translatorFor } from '@server/i18n/translator';
import { limitsById } from '@server/db/limits-store';
import { viewOfSigned, type SignedCheckView } from '@server/db/signed-check-view';
import { signedAuthorisationWords } from '@server/db/authorisation-records';
import { AppError, refusal } from '@server/errors/app-error';
import {
  airframeReleasesMatching,
  correctiveActionsOfHolds,
  countersignsOfHolds,
  holdsOfChecks,
  signedChecksMatching,
} from './records.repository';

// Every export is built from signed content (what each signer's PIN or password covered), never from today's
// staff rows, and each row carries the registration mark and the signature hash of the record it came from.

/** An export is bounded so one request cannot hold the database; the message says how to narrow it. */
export const CSV_MAX_ROWS = 50_000;

/**
 * A text cell a spreadsheet would take as a formula (it starts with =, +, -, @, a tab or a carriage return) gets
 * a leading apostrophe, so it shows as the text it is (OWASP, "CSV Injection"). Numbers stay numbers: they are
 * written by this code from JSON numbers, never from typed text, so "-1.5" is a number to a spreadsheet, not a
 * formula.
 */
export function spreadsheetSafe(cell: ExportCell): ExportCell {
  return typeof cell === 'string' && /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
}

const when = (at: string | Date | null | undefined) => (at ? formatInstant(at) : null);

async function matchingViews(sequelize: Sequelize, filters: RecordSearch): Promise<SignedCheckView[]> {
  const { rows, total } = await signedChecksMatching(sequelize, filters, CSV_MAX_ROWS);
  if (total > CSV_MAX_ROWS) {
    throw new AppError(
      413,
      'export_too_large',
      refusal('records.exportTooLarge', {
        total: { decimal: total, places: 0 },
        max: { decimal: CSV_MAX_ROWS, places: 0 },
      }),
    );
  }
  const views: SignedCheckView[] = [];
  for (const row of rows.filter((r) => r.signedContent)) {
    const limits = await limitsById(row.limitsVersionId);
    if (limits) views.push(viewOfSigned(row, row, limits, []));
  }
  return views;
}

const aircraft = (v: SignedCheckView): ExportCell[] => [v.registration, v.fleetNumber, v.typeCode, v.serial];
const aircraftHeaders = ['Registration mark', 'Fleet number', 'Type', 'Serial number'];
const signer = (v: SignedCheckView): ExportCell[] => [v.signer.name, v.signer.badge, v.signer.licence];
const signerHeaders = ['Signed by', 'Badge', 'Licence'];

function checksTable(views: SignedCheckView[]): Omit<RecordExport, 'name'> {
  return {
    headers: [
      'Signed',
      ...aircraftHeaders,
      'Check',
      'Verdict',
      'Hours',
      'Flights',
      'Limits version',
      ...signerHeaders,
      'Note',
      'Signature hash',
    ],
    rows: views.map((v) => [
      when(v.signedAt),
      ...aircraft(v),
      v.kindWords,
      v.verdictWords,
      v.airframeHours,
      v.airframeFlights,
      v.limitsVersion,
      ...signer(v),
      v.note,
      v.contentHash,
    ]),
  };
}

function readingsTable(views: SignedCheckView[]): Omit<RecordExport, 'name'> {
  return {
    headers: [
      'Signed',
      ...aircraftHeaders,
      'Check',
      'Checkpoint',
      'Entered',
      'Value',
      'Unit',
      'Verdict',
      'Limit',
      ...signerHeaders,
      'Check signature hash',
    ],
    rows: views.flatMap((v) =>
      v.readings.map((r) => [
        when(v.signedAt),
        ...aircraft(v),
        v.kindWords,
        r.label,
        r.entered,
        r.value,
        r.unit,
        r.verdictWords,
        r.limitText,
        ...signer(v),
        v.contentHash,
      ]),
    ),
  };
}

function fluidTable(views: SignedCheckView[]): Omit<RecordExport, 'name'> {
  return {
    headers: [
      'Added',
      ...aircraftHeaders,
      'Checkpoint',
      'Litres',
      'Entered',
      'Fluid',
      'Batch',
      'Can opened',
      'Tools',
      'Level before',
      ...signerHeaders,
      'Check signature hash',
    ],
    rows: views.flatMap((v) =>
      v.servicing.map((s) => [
        when(v.signedAt),
        ...aircraft(v),
        s.label,
        s.quantityL,
        s.quantityWords,
        s.fluidSpec,
        s.batch,
        s.canOpenedOn ? formatDay(s.canOpenedOn) : null,
        (s.tools ?? [])
          .map(
            (t) => t.name + (t.calibrationDueOn ? ` (calibration due ${formatDay(t.calibrationDueOn)})` : ''),
          )
          .join('; ') || null,
        s.levelBeforeWords,
        ...signer(v),
        v.contentHash,
      ]),
    ),
  };
}

interface SignedCountersign {
  decision: 'release' | 'keep';
  reason: string | null;
  statement: string | null;
  authorisation: unknown;
  signer: { name: string; badge: string; licence: string | null };
  signedAt: string;
}

async function holdsTable(
  sequelize: Sequelize,
  views: SignedCheckView[],
): Promise<Omit<RecordExport, 'name'>> {
  const byId = new Map(views.map((v) => [v.id, v]));
  const holds = await holdsOfChecks(sequelize, [...byId.keys()]);
  const ids = holds.map((h) => h.id);
  const [actions, countersigns] = await Promise.all([
    correctiveActionsOfHolds(sequelize, ids),
    countersignsOfHolds(sequelize, ids),
  ]);
  return {
    headers: [
      'Hold',
      ...aircraftHeaders,
      'Opened',
      'Finding',
      'Found by',
      'Corrective action',
      'State',
      'Released',
      'Released by',
      'Release licence',
      'Release signature hash',
      'Held check signature hash',
    ],
    rows: holds.map((h) => {
      const v = byId.get(h.checkId)!;
      const release = countersigns
        .filter((c) => c.holdId === h.id)
        .map((c) => ({ ...c, content: JSON.parse(c.signedContent) as SignedCountersign }))
        .find((c) => c.content.decision === 'release');
      const signed = release?.content ?? null;
      return [
        h.id,
        ...aircraft(v),
        when(v.signedAt),
        v.readings
          .filter((r) => r.verdict === 'out_of_limits')
          .map((r) => `${r.label}: ${r.entered} (limit ${r.limitText})`)
          .join('; '),
        v.signer.name,
        actions
          .filter((a) => a.holdId === h.id)
          .map((a) => `${a.text} (${a.name}, ${formatInstant(a.recordedAt)})`)
          .join('; ') || null,
        h.releasedAt ? 'Released' : 'Open',
        when(signed?.signedAt),
        signed?.signer.name ?? null,
        signed?.signer.licence ?? null,
        release?.contentHash ?? null,
        v.contentHash,
      ];
    }),
  };
}

async function releasesTable(
  sequelize: Sequelize,
  filters: RecordSearch,
  views: SignedCheckView[],
): Promise<Omit<RecordExport, 'name'>> {
  const byId = new Map(views.map((v) => [v.id, v]));
  const holds = await holdsOfChecks(sequelize, [...byId.keys()]);
  const holdReleases = (
    await countersignsOfHolds(
      sequelize,
      holds.map((h) => h.id),
    )
  )
    .map((c) => ({ ...c, content: JSON.parse(c.signedContent) as SignedCountersign }))
    .filter((c) => c.content.decision === 'release')
    .map((c) => {
      const v = byId.get(holds.find((h) => h.id === c.holdId)!.checkId)!;
      const s = c.content;
      return [
        when(s.signedAt),
        ...aircraft(v),
        `Hold ${c.holdId} released`,
        s.statement,
        s.signer.name,
        s.signer.badge,
        s.signer.licence,
        signedAuthorisationWords(s.authorisation),
        s.reason,
        c.contentHash,
      ];
    });
  const certificates = (await airframeReleasesMatching(sequelize, filters)).map((r) => {
    const s = JSON.parse(r.signedContent) as {
      airframe: { fleetNumber: string; serial: string; type: string };
      statement: string;
      certifiedBy: { name: string; badge: string; licence: string | null };
      authorisation: unknown;
      signedAt: string;
    };
    return [
      when(s.signedAt),
      r.registration,
      s.airframe.fleetNumber,
      s.airframe.type,
      s.airframe.serial,
      'Certificate of release to service',
      s.statement,
      s.certifiedBy.name,
      s.certifiedBy.badge,
      s.certifiedBy.licence,
      signedAuthorisationWords(s.authorisation),
      null,
      r.contentHash,
    ];
  });
  return {
    headers: [
      'Signed',
      ...aircraftHeaders,
      'Release',
      'Statement',
      'Certified by',
      'Badge',
      'Licence',
      'Authorisation',
      'Note',
      'Signature hash',
    ],
    rows: [...holdReleases, ...certificates],
  };
}

/** One export as JSON: the headers and the cells, taken from the signed content of the matching records. */
export async function recordExport(
  sequelize: Sequelize,
  name: RecordExportName,
  filters: RecordSearch,
): Promise<RecordExport> {
  const views = await matchingViews(sequelize, filters);
  const table =
    name === 'checks'
      ? checksTable(views)
      : name === 'readings'
        ? readingsTable(views)
        : name === 'fluid'
          ? fluidTable(views)
          : name === 'holds'
            ? await holdsTable(sequelize, views)
            : await releasesTable(sequelize, filters, views);
  return { name, ...table };
}

// The headers are written in English in the tables above; the csv catalogue names each one, so a header reads in
// the reader's language while the cells stay exactly as recorded.
const headerKeys = new Map(Object.entries(english.csv.headers).map(([key, text]) => [text, key]));

/** A column header in `language`; one the catalogue does not name stays as written. */
export function headerIn(header: string, language: Language): string {
  const key = headerKeys.get(header);
  return key && language !== sourceLanguage ? say(translatorFor(language), `csv:headers.${key}`) : header;
}

/** The same export as CSV, with a header row in `language` and every text cell made spreadsheet-safe. */
export function exportCsv(table: RecordExport, language: Language = sourceLanguage): string {
  return stringify(
    table.rows.map((row) => row.map((cell) => spreadsheetSafe(cell) ?? '')),
    {
      header: true,
      columns: table.headers.map((header) => headerIn(header, language)),
    },
  );
}
