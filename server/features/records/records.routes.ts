import { Router, type Request, type Response } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  recordExportSchema,
  recordSearchSchema,
  trendsQuerySchema,
  type RecordExportName,
} from '@shared/schemas/records';
import { languageOf } from '@server/i18n/translator';
import { printWords } from '@server/pdf/print-words';
import { requireRole } from '@server/middleware/session-guard';
import { deskUrl, sendPdf, type PrintOptions } from '@server/pdf/print-options';
import { checkPdf } from './record-pdf';
import { exportCsv, recordExport } from './records-export';
import { fullRecord, recentAuditEvents, searchRecords, trends, verifyTrail } from './records.service';

const checkIdSchema = z.uuid({ message: 'A check id is a UUID.' });
const limitSchema = z.coerce.number().int().min(1).max(500).default(100);

export function recordRoutes(sequelize: Sequelize, print: PrintOptions): Router {
  const router = Router();
  const readers = requireRole('engineering', 'shift_lead');
  router.get('/records', readers, async (req, res) => {
    res.json(await searchRecords(sequelize, recordSearchSchema.parse(req.query)));
  });
  // CSV headers in the reader's language (?lang=, then Accept-Language); the cells stay as recorded.
  const csvOf = async (req: Request, name: RecordExportName) =>
    exportCsv(await recordExport(sequelize, name, recordSearchSchema.parse(req.query)), languageOf(req));
  const sendCsv = (res: Response, csv: string, name: string) => {
    const stamp = new Date().toISOString().slice(0, 10);
    res
      .type('text/csv; charset=utf-8')
      .set('Content-Disposition', `attachment; filename="gaugewalk-${name}-${stamp}.csv"`)
      .send(csv);
  };
  // One row per check; kept at its old address for bookmarks and scripts.
  router.get('/records.csv', readers, async (req, res) => {
    sendCsv(res, await csvOf(req, 'checks'), 'checks');
  });
  router.get('/records/exports/:name.csv', readers, async (req, res) => {
    const name = recordExportSchema.parse(req.params.name);
    sendCsv(res, await csvOf(req, name), name);
  });
  router.get('/records/exports/:name', readers, async (req, res) => {
    const name = recordExportSchema.parse(req.params.name);
    res.json(await recordExport(sequelize, name, recordSearchSchema.parse(req.query)));
  });
  router.get('/records/checks/:checkId.pdf', readers, async (req, res) => {
    const id = checkIdSchema.parse(req.params.checkId);
    const { bytes, fileName } = await checkPdf(
      id,
      { ...print, deskUrl: deskUrl(print, req, `/desk/records/${id}`) },
      printWords(languageOf(req)),
    );
    sendPdf(res, bytes, fileName);
  });
  router.get('/records/:checkId', readers, async (req, res) => {
    res.json(await fullRecord(sequelize, checkIdSchema.parse(req.params.checkId)));
  });
  router.get('/trends', readers, async (req, res) => {
    const { airframeId, days } = trendsQuerySchema.parse(req.query);
    res.json(await trends(airframeId, days));
  });
  router.get('/audit/verify', requireRole('engineering'), async (_req, res) => {
    res.json(await verifyTrail(sequelize));
  });
  router.get('/audit/events', requireRole('engineering'), async (req, res) => {
    res.json(await recentAuditEvents(limitSchema.parse(req.query.limit)));
  });
  return router;
}
