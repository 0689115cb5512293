import { and, eq, gt, isNull, or } from 'drizzle-orm';
import { Router } from 'express';
import { hashToken } from '../auth/tokens';
import { shareLinks, studies } from '../db/schema';
import { notFound } from '../http/errors';
import { mapsOfStudy, resultsCsv, validDocument } from '../services/studies';
import type { AppDeps } from '../app-deps';

/** Read-only access to one study through a share link, without signing in. Nothing here writes. */
export function shareRouter({ db }: AppDeps): Router {
  const router = Router();

  async function sharedStudy(token: string) {
    if (token.length < 10 || token.length > 200) throw notFound('This share link is not valid.');
    const [row] = await db
      .select({ study: studies })
      .from(shareLinks)
      .innerJoin(studies, eq(studies.id, shareLinks.studyId))
      .where(
        and(eq(shareLinks.tokenHash, hashToken(token)), isNull(shareLinks.revokedAt), or(isNull(shareLinks.expiresAt), gt(shareLinks.expiresAt, new Date()))),
      );
    if (!row) throw notFound('This share link is not valid any more: it was revoked or it expired. Ask the team for a new one.');
    return row.study;
  }

  router.get('/:token', async (req, res) => {
    const study = await sharedStudy(req.params.token);
    const document = validDocument(study.document);
    res.json({
      title: study.title,
      revision: study.revision,
      updatedAt: study.updatedAt.toISOString(),
      document,
      maps: await mapsOfStudy(db, study.teamId, document),
    });
  });

  router.get('/:token/results.csv', async (req, res) => {
    const study = await sharedStudy(req.params.token);
    const document = validDocument(study.document);
    res.set('Content-Type', 'text/csv; charset=utf-8');
    res.set('Content-Disposition', `attachment; filename="study-results-r${study.revision}.csv"`);
    res.send(resultsCsv(document, await mapsOfStudy(db, study.teamId, document)));
  });

  return router;
}
