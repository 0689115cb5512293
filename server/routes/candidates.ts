import { Router } from 'express';
import { candidateMapsQuerySchema, candidatesQuerySchema, familyRequestSchema } from '#shared/schemas/candidates';
import type { AppDeps } from '../app-deps';
import { requireTeamPermission } from '../auth/access';
import { requireUser } from '../auth/session';
import { sendCsv } from '../http/csv';
import { parseOr400 } from '../http/errors';
import { candidatesCsv, createFamilyMember, libraryCandidates } from '../services/candidates';

function params(req: { params: unknown }) {
  return req.params as { teamId: string; studyId: string; mapId: string };
}

/** Candidates of a study (`/teams/:teamId/studies/:studyId/candidates.csv`). */
export function candidatesRouter({ db }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.get('/candidates.csv', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const query = parseOr400(candidatesQuerySchema, { ...req.query }, 'query');
    const { csv, revision } = await candidatesCsv(db, access.teamId, params(req).studyId, query);
    sendCsv(res, `candidates-${query.kind}-r${revision}.csv`, csv);
  });
  return router;
}

/** The parsed maps the Candidates view ranks (`/teams/:teamId/candidate-maps?kind=`), and new family members (`/teams/:teamId/maps/:mapId/family`). */
export function candidateMapsRouter({ db }: AppDeps): Router {
  const router = Router({ mergeParams: true });
  router.get('/candidate-maps', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:read');
    const { kind } = parseOr400(candidateMapsQuerySchema, { ...req.query }, 'query');
    res.json({ maps: await libraryCandidates(db, access.teamId, kind) });
  });
  router.post('/maps/:mapId/family', async (req, res) => {
    const user = requireUser(res);
    const access = await requireTeamPermission(db, user, params(req).teamId, 'content:write');
    const request = parseOr400(familyRequestSchema, req.body);
    res.status(201).json({ map: await createFamilyMember(db, { teamId: access.teamId, mapId: params(req).mapId, request, actor: user, req }) });
  });
  return router;
}
