import { Router } from 'express';
import type { AppDeps } from '../app-deps';
import { resultsFileName, sendCsv } from '../http/csv';
import { sharedResultsCsv, sharedStudy } from '../services/share-links';

/** Read-only access to one study through a share link, without signing in. Nothing here writes. */
export function shareRouter({ db }: AppDeps): Router {
  const router = Router();

  router.get('/:token', async (req, res) => {
    res.json(await sharedStudy(db, req.params.token));
  });

  router.get('/:token/results.csv', async (req, res) => {
    const { csv, revision } = await sharedResultsCsv(db, req.params.token);
    sendCsv(res, resultsFileName(revision), csv);
  });

  return router;
}
