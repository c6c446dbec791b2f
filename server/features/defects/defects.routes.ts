import { Router } from 'express';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import {
  certifySchema,
  deferDefectSchema,
  defectWorkSchema,
  inspectionSchema,
  raiseDefectSchema,
} from '@shared/schemas/defects';
import { requireRole } from '@server/middleware/session-guard';
import type { LockoutPolicy } from '@server/security/credentials';
import type { SigningContext } from '@server/security/signing';
import {
  airframeDefects,
  certifyRectification,
  deferDefect,
  defectDetail,
  raiseDefect,
  recordInspection,
  recordWork,
} from './defects.service';

const idSchema = z.coerce.number().int().positive();

export function defectRoutes(
  sequelize: Sequelize,
  options: { lockout: LockoutPolicy; onChange: () => void },
): Router {
  const router = Router();
  const signing = (req: Express.Request & { session: { channel?: 'kiosk' | 'desk' } }): SigningContext => ({
    signer: req.user!,
    channel: req.session.channel,
    lockout: options.lockout,
  });
  const anyone = requireRole('mechanic', 'shift_lead', 'engineering', 'pilot');
  const maintenance = requireRole('mechanic', 'shift_lead');
  router.get('/airframes/:id/defects', anyone, async (req, res) => {
    res.json(await airframeDefects(idSchema.parse(req.params.id)));
  });
  router.get('/defects/:id', anyone, async (req, res) => {
    res.json(await defectDetail(idSchema.parse(req.params.id)));
  });
  router.post('/airframes/:id/defects', requireRole('mechanic', 'shift_lead', 'pilot'), async (req, res) => {
    const input = raiseDefectSchema.parse(req.body);
    const defect = await raiseDefect(sequelize, idSchema.parse(req.params.id), input, signing(req));
    options.onChange();
    res.status(201).json(defect);
  });
  const act = <T>(
    path: string,
    schema: z.ZodType<T>,
    run: (sequelize: Sequelize, id: number, input: T, ctx: SigningContext) => Promise<unknown>,
  ) =>
    router.post(`/defects/:id/${path}`, maintenance, async (req, res) => {
      const result = await run(
        sequelize,
        idSchema.parse(req.params.id),
        schema.parse(req.body),
        signing(req),
      );
      options.onChange();
      res.status(201).json(result);
    });
  act('work', defectWorkSchema, recordWork);
  act('inspection', inspectionSchema, recordInspection);
  act('certify', certifySchema, certifyRectification);
  act('defer', deferDefectSchema, deferDefect);
  return router;
}
