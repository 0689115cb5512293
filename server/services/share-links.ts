import { and, desc, eq, gt, inArray, isNull, or, sql } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import { hashToken, newId, newToken } from '../auth/tokens';
import type { Db, Tx } from '../db/client';
import { shareLinks, studies, users } from '../db/schema';
import { notFound } from '../http/errors';
import { audit } from './audit';
import { loadStudy } from './studies';
import { mapsOfStudy, resultsCsv, validDocument } from './study-documents';

/**
 * Share links: read-only access to one study without signing in. Only the SHA-256 of a link's
 * token is stored; a link expires, can be revoked, and stops when its maker leaves the team unless
 * an owner keeps it.
 */

const DAY_MS = 86_400_000;

export async function listShareLinks(db: Db, teamId: string, studyId: string) {
  await loadStudy(db, teamId, studyId);
  const rows = await db
    .select({
      id: shareLinks.id,
      createdAt: shareLinks.createdAt,
      createdBy: users.name,
      expiresAt: shareLinks.expiresAt,
      revokedAt: shareLinks.revokedAt,
      kept: sql<boolean>`${shareLinks.keptBy} IS NOT NULL`,
    })
    .from(shareLinks)
    .leftJoin(users, eq(users.id, shareLinks.createdBy))
    .where(eq(shareLinks.studyId, studyId))
    .orderBy(desc(shareLinks.createdAt));
  return rows.map((r) => ({
    ...r,
    createdAt: r.createdAt.toISOString(),
    expiresAt: r.expiresAt?.toISOString() ?? null,
    revokedAt: r.revokedAt?.toISOString() ?? null,
  }));
}

/** A new link to the study; its URL (with the token) is answered once and never stored. */
export async function createShareLink(
  db: Db,
  input: { teamId: string; studyId: string; expiresInDays: number | null; publicUrl: string; actor: User; req: Request },
) {
  const { teamId, studyId, actor, req } = input;
  await loadStudy(db, teamId, studyId);
  const { token, tokenHash } = newToken();
  const id = newId();
  // 30 days unless the maker chose otherwise; null ("never") only when asked for by name.
  const expiresAt = input.expiresInDays === null ? null : new Date(Date.now() + input.expiresInDays * DAY_MS);
  const [row] = await db.insert(shareLinks).values({ id, studyId, tokenHash, createdBy: actor.id, expiresAt }).returning();
  await audit(db, {
    action: 'share-link.created',
    teamId,
    actor,
    targetType: 'share-link',
    targetId: id,
    details: { studyId, expiresAt: expiresAt?.toISOString() ?? null },
    req,
  });
  return {
    id,
    createdAt: row.createdAt.toISOString(),
    createdBy: actor.name,
    expiresAt: expiresAt?.toISOString() ?? null,
    revokedAt: null,
    kept: false,
    url: `${input.publicUrl}/share/${token}`,
  };
}

/** An owner keeps a link working after its maker leaves the team (or stops keeping it). */
export async function keepShareLink(db: Db, input: { teamId: string; studyId: string; linkId: string; kept: boolean; actor: User; req: Request }) {
  const { teamId, studyId, linkId, kept, actor, req } = input;
  await loadStudy(db, teamId, studyId);
  const rows = await db
    .update(shareLinks)
    .set({ keptBy: kept ? actor.id : null })
    .where(and(eq(shareLinks.id, linkId), eq(shareLinks.studyId, studyId), isNull(shareLinks.revokedAt)))
    .returning({ id: shareLinks.id });
  if (rows.length === 0) throw notFound('No such active share link.');
  await audit(db, {
    action: kept ? 'share-link.kept' : 'share-link.unkept',
    teamId,
    actor,
    targetType: 'share-link',
    targetId: rows[0].id,
    details: { studyId },
    req,
  });
}

export async function revokeShareLink(db: Db, input: { teamId: string; studyId: string; linkId: string; actor: User; req: Request }) {
  const { teamId, studyId, linkId, actor, req } = input;
  await loadStudy(db, teamId, studyId);
  const rows = await db
    .update(shareLinks)
    .set({ revokedAt: new Date() })
    .where(and(eq(shareLinks.id, linkId), eq(shareLinks.studyId, studyId), isNull(shareLinks.revokedAt)))
    .returning({ id: shareLinks.id });
  if (rows.length === 0) throw notFound('No such active share link.');
  await audit(db, { action: 'share-link.revoked', teamId, actor, targetType: 'share-link', targetId: rows[0].id, details: { studyId }, req });
}

/**
 * When someone leaves a team (or is removed), the share links they made for its studies stop,
 * except those an owner chose to keep. Runs in the transaction of the leaving.
 */
export async function revokeShareLinksOfLeaver(tx: Tx, teamId: string, userId: string): Promise<number> {
  const teamStudies = tx.select({ id: studies.id }).from(studies).where(eq(studies.teamId, teamId));
  const rows = await tx
    .update(shareLinks)
    .set({ revokedAt: new Date() })
    .where(and(eq(shareLinks.createdBy, userId), isNull(shareLinks.revokedAt), isNull(shareLinks.keptBy), inArray(shareLinks.studyId, teamStudies)))
    .returning({ id: shareLinks.id });
  return rows.length;
}

/** The study a live link opens; 404 for a link that never was, was revoked or expired. */
async function studyOfLink(db: Db, token: string) {
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

/** What a share link shows: the study and the maps its plans use. */
export async function sharedStudy(db: Db, token: string) {
  const study = await studyOfLink(db, token);
  const document = validDocument(study.document);
  return {
    title: study.title,
    revision: study.revision,
    updatedAt: study.updatedAt.toISOString(),
    document,
    maps: await mapsOfStudy(db, study.teamId, document),
  };
}

export async function sharedResultsCsv(db: Db, token: string) {
  const study = await studyOfLink(db, token);
  const document = validDocument(study.document);
  return { csv: resultsCsv(document, await mapsOfStudy(db, study.teamId, document)), revision: study.revision };
}
