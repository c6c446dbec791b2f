import { Router, type RequestHandler } from 'express';
import type { Sequelize } from 'sequelize';
import { checkOfAirframeInService, photoOfAirframeInService } from '../db/pilot-scope';
import { forbidden, refusal } from '../errors/app-error';

/** Roles that read any check or photo in their own work; a person with only the pilot role has none of them. */
const wideReaders = ['mechanic', 'shift_lead', 'engineering'];

const outOfScope = () => forbidden(refusal('records.pilotOutOfScope'), 'pilot_out_of_scope');

/**
 * A pilot reads a check, or a photo taken for a check, only when the check's airframe is one a pilot may accept:
 * an airframe in service (the acceptance refuses the others). A photo not yet part of a signed check is the
 * mechanic's alone. Ids of other checks are refused before the route that reads them runs.
 */
export function pilotReadScope(sequelize: Sequelize): Router {
  const router = Router();
  const onlyPilot = (req: Parameters<RequestHandler>[0]) =>
    req.user !== undefined &&
    req.user.roles.includes('pilot') &&
    !req.user.roles.some((role) => wideReaders.includes(role));
  const guard =
    (inScope: (sequelize: Sequelize, id: string) => Promise<boolean>): RequestHandler =>
    async (req, _res, next) => {
      if (!onlyPilot(req)) return next();
      next((await inScope(sequelize, String(req.params.id))) ? undefined : outOfScope());
    };
  router.get('/checks/:id', guard(checkOfAirframeInService));
  router.get('/photos/:id', guard(photoOfAirframeInService));
  return router;
}
