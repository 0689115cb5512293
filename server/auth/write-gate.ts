import type { RequestHandler } from 'express';
import type { Db } from '../db/client';
import { requireTeamPermission, type TeamAccess } from './access';
import { requireUser } from './session';

/**
 * Decides write access to the team in the path before an upload is read, so a viewer's or an
 * outsider's file is never buffered; the access is left in `res.locals.access` for the handler.
 */
export function teamWriteGate(db: Db): RequestHandler {
  return (req, res, next) => {
    requireTeamPermission(db, requireUser(res), (req.params as { teamId: string }).teamId, 'content:write')
      .then((access: TeamAccess) => {
        res.locals.access = access;
        next();
      })
      .catch(next);
  };
}
