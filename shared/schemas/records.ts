import { z } from 'zod';
import { checkKindSchema, verdictSchema, type CheckContext, type CheckKind, type Verdict } from './limits';
import { isCalendarDate } from './calendar-date';
import type { StoredReading, StoredServicing } from './checks';
import type { SignerRef } from './refs';
import type { Phrase } from '../i18n/phrase';
import { withValues } from '../i18n/validation';

const optionalId = z.preprocess(
  (v) => (v === '' ? undefined : v),
  z.coerce.number().int().positive().optional(),
);
const optionalDate = z.preprocess(
  (v) => (v === '' ? undefined : v),
  z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, 'words:validation.dateFormat')
    .refine(isCalendarDate, 'words:validation.noSuchDay')
    .optional(),
);

/** Search filters; dates are whole UTC days, both ends included. */
export const recordSearchSchema = z
  .object({
    airframeId: optionalId,
    staffId: optionalId,
    kind: z.preprocess((v) => (v === '' ? undefined : v), checkKindSchema.optional()),
    verdict: z.preprocess((v) => (v === '' ? undefined : v), verdictSchema.optional()),
    from: optionalDate,
    to: optionalDate,
    page: z.coerce.number().int().min(1).default(1),
    pageSize: z.coerce.number().int().min(1).max(200).default(50),
  })
  .refine((v) => !v.from || !v.to || v.from <= v.to, {
    message: 'words:validation.startAfterEnd',
    path: ['to'],
  });
export type RecordSearch = z.infer<typeof recordSearchSchema>;
export type RecordSearchInput = z.input<typeof recordSearchSchema>;

export interface RecordRow {
  id: string;
  signedAt: string;
  airframeId: number;
  fleetNumber: string;
  /** The airframe's registration mark as now recorded. */
  registration: string | null;
  kind: CheckKind;
  verdict: Verdict;
  signedBy: string;
  badgeNumber: string;
  licenceNumber: string | null;
  typeCode: string;
  limitsVersion: number;
  limitsVersionId: number;
  airframeHours: number | null;
  contentHash: string;
  correctsCheckId: string | null;
}

export interface RecordPage {
  rows: RecordRow[];
  total: number;
  page: number;
  pageSize: number;
}

/** A reading of the full record: the stored reading, with its place on the card and its chapter and reference. */
export interface FullRecordReading extends StoredReading {
  seq: number;
  ata: string | null;
  reference: string | null;
}

export interface FullRecord {
  id: string;
  airframe: { id: number; fleetNumber: string; serial: string; registration: string | null };
  type: { code: string; name: string };
  kind: CheckKind;
  verdict: Verdict;
  context: CheckContext;
  note: string | null;
  limitsVersion: { id: number; version: number; publishedAt: string | null };
  airframeHours: number | null;
  signedBy: SignerRef & { badgeNumber: string; active: boolean };
  signedAt: string;
  contentHash: string;
  signedContent: unknown;
  integrity: { ok: boolean; problem: string | null };
  correctsCheckId: string | null;
  correctedBy: { id: string; signedAt: string }[];
  readings: FullRecordReading[];
  servicing: StoredServicing[];
  hold: { id: number; reason: string; openedAt: string; releasedAt: string | null } | null;
  countersigns: {
    decision: string;
    reason: string | null;
    signedBy: string;
    licenceNumber: string | null;
    signedAt: string;
    contentHash: string;
  }[];
  auditEvent: { id: number; at: string; hash: string } | null;
}

export const trendsQuerySchema = z.object({
  airframeId: z.coerce.number().int().positive(),
  days: z.coerce.number().int().min(1).max(3650).default(90),
});

export interface TrendPoint {
  at: string;
  checkId: string;
  airframeHours: number | null;
  levelL: number;
  attitude: string | null;
}

export interface TrendSystem {
  system: string;
  label: string;
  levels: TrendPoint[];
  servicing: { at: string; checkId: string; litres: number; airframeHours: number | null }[];
  /** Fluid added per flight hour between consecutive checks with hours recorded. */
  ratePerFh: { at: string; checkId: string; litresPerFh: number }[];
  window: {
    days: number;
    litresAdded: number;
    flightHours: number;
    litresPerFlightHour: number | null;
  };
  alerts: {
    kind: 'rate_at_or_above_threshold' | 'fluid_without_flying' | 'unexplained_level_drop';
    message: Phrase;
    checkIds: string[];
  }[];
}

export interface Trends {
  airframe: { id: number; fleetNumber: string; typeCode: string };
  thresholdLPerFh: number;
  days: number;
  systems: TrendSystem[];
}

export interface TrailReport {
  ok: boolean;
  events: number;
  firstBroken: { id: number; action: string; entity: string; entityId: string; reason: string } | null;
  checkedAt: string;
}

/** The record exports: one row per check, per reading, per fluid entry, per hold and per release. */
export const recordExportNames = ['checks', 'readings', 'fluid', 'holds', 'releases'] as const;
export type RecordExportName = (typeof recordExportNames)[number];
export const recordExportSchema = z.enum(recordExportNames, {
  error: withValues('words:validation.exportName', { exports: recordExportNames.join(', ') }),
});

export const recordExportLabels: Record<RecordExportName, string> = {
  checks: 'Checks',
  readings: 'Readings',
  fluid: 'Fluid added',
  holds: 'Holds',
  releases: 'Releases',
};

/** A cell: words, or a number kept a number (a spreadsheet sums it; see DEVELOPERS.md on negative numbers). */
export type ExportCell = string | number | null;

/** An export as JSON: the same headers and cells the CSV carries, before spreadsheet-safe quoting. */
export interface RecordExport {
  name: RecordExportName;
  headers: string[];
  rows: ExportCell[][];
}
