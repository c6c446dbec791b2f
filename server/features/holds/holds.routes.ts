import { Router, type Request } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { correctiveActionSchema, countersignSchema } from '@shared/schemas/holds';
import { inspectionSchema } from '@shared/schemas/defects';
import { requireRole } from '@server/middleware/session-guard';
import type { LockoutPolicy } from '@server/security/credentials';
import { verifySigner, type SigningContext } from '@server/security/signing';
import { deskUrl, sendPdf, type PrintOptions } from '@server/pdf/print-options';
import { printWords } from '@server/pdf/print-words';
import { languageOf, translatorFor } from '@server/i18n/translator';
import { holdPdf } from './hold-pdf';
import {
  countersignHold,
  holdDetail,
  holdQueue,
  recordCorrectiveAction,
  recordHoldInspection,
  type LoadCheck,
} from './holds.service';

const idSchema = z.coerce.number().int().positive();

export function holdRoutes(
  sequelize: Sequelize,
  options: { lockout: LockoutPolicy; loadCheck: LoadCheck; onChange: () => void; print: PrintOptions },
): Router {
  const router = Router();
  const signing = (req: Request): SigningContext => ({
    signer: req.user!,
    channel: req.session.channel,
    lockout: options.lockout,
  });
  router.get('/holds', requireRole('shift_lead', 'engineering'), async (req, res) => {
    res.json(await holdQueue(options.loadCheck, translatorFor(languageOf(req))));
  });
  // The auditor's printable record, for the desk roles that read records.
  router.get('/holds/:id.pdf', requireRole('shift_lead', 'engineering'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    const { print } = options;
    const { bytes, fileName } = await holdPdf(
      id,
      { ...print, deskUrl: deskUrl(print, req, `/desk/holds/${id}`) },
      printWords(languageOf(req)),
    );
    sendPdf(res, bytes, fileName);
  });
  router.get('/holds/:id', requireRole('shift_lead', 'engineering', 'mechanic'), async (req, res) => {
    res.json(
      await holdDetail(idSchema.parse(req.params.id), options.loadCheck, translatorFor(languageOf(req))),
    );
  });
  router.post('/holds/:id/corrective-action', requireRole('shift_lead', 'mechanic'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    const input = correctiveActionSchema.parse(req.body);
    // Part of the release evidence, so signed like the rest: the PIN or password typed again.
    await verifySigner(input, signing(req), 'recordCorrectiveAction');
    const action = await recordCorrectiveAction(sequelize, id, input, req.user!);
    options.onChange();
    res.status(201).json(action);
  });
  router.post('/holds/:id/inspection', requireRole('shift_lead', 'mechanic'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    await recordHoldInspection(sequelize, id, inspectionSchema.parse(req.body), signing(req));
    options.onChange();
    res.status(201).json(await holdDetail(id, options.loadCheck, translatorFor(languageOf(req))));
  });
  router.post('/holds/:id/countersign', requireRole('shift_lead'), async (req, res) => {
    const id = idSchema.parse(req.params.id);
    await countersignHold(sequelize, id, countersignSchema.parse(req.body), signing(req));
    options.onChange();
    res.json(await holdDetail(id, options.loadCheck, translatorFor(languageOf(req))));
  });
  return router;
}
