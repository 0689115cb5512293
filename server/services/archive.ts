import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import { parseMapFile } from '#shared/maps';
import { PLAN_MAP_FIELDS, teamArchiveSchema, type TeamArchive } from '#shared/schemas/archive';
import type { StudyDocument } from '#shared/schemas/study';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { maps, studies, studyRevisions, teamMembers, users } from '../db/schema';
import { HttpError, issuesOf } from '../http/errors';
import { audit } from './audit';
import { BUILTIN_PREFIX, builtinMap } from './builtin-maps';
import { validDocument } from './study-documents';
import { archiveLogsOf, checkArchiveLog, writeArchiveLogs } from './log-archive';

/** A team's archive as a download: its name says which team and when. */
export function archiveFileName(teamName: string, exportedAt: string) {
  const safeName =
    teamName
      .replace(/[^A-Za-z0-9._-]+/g, '-')
      .replace(/^-+|-+$/g, '')
      .slice(0, 60) || 'team';
  return `spoolbook-${safeName}-${exportedAt.slice(0, 10)}.json`;
}

/** Everything of a team that can leave, recorded as exported: maps with their files, studies with every revision. */
export async function exportTeam(db: Db, input: { teamId: string; teamName: string; actor: User; req: Request }): Promise<TeamArchive> {
  const archive = await teamArchive(db, input.teamId, input.teamName);
  await audit(db, {
    action: 'team.exported',
    teamId: input.teamId,
    actor: input.actor,
    details: { maps: archive.maps.length, studies: archive.studies.length },
    req: input.req,
  });
  return archive;
}

async function teamArchive(db: Db, teamId: string, teamName: string): Promise<TeamArchive> {
  const mapRows = await db.select().from(maps).where(eq(maps.teamId, teamId)).orderBy(asc(maps.createdAt), asc(maps.id));
  const studyRows = await db.select().from(studies).where(eq(studies.teamId, teamId)).orderBy(asc(studies.createdAt), asc(studies.id));
  const revisionRows = studyRows.length
    ? await db
        .select({ r: studyRevisions, author: sql<string | null>`coalesce(${users.email}, ${studyRevisions.authorName})` })
        .from(studyRevisions)
        .leftJoin(users, eq(users.id, studyRevisions.authorId))
        .where(
          inArray(
            studyRevisions.studyId,
            studyRows.map((s) => s.id),
          ),
        )
        .orderBy(asc(studyRevisions.studyId), asc(studyRevisions.revision))
    : [];
  const logs = await archiveLogsOf(db, teamId);
  return {
    format: 'spoolbook-team-archive',
    version: 1,
    exportedAt: new Date().toISOString(),
    team: { name: teamName },
    maps: mapRows.map((m) => ({
      id: m.id,
      kind: m.kind,
      name: m.name,
      notes: m.notes,
      fileName: m.fileName,
      fileText: m.fileText,
      createdAt: m.createdAt.toISOString(),
    })),
    studies: studyRows.map((s) => ({
      id: s.id,
      title: s.title,
      archived: s.archived,
      createdAt: s.createdAt.toISOString(),
      revisions: revisionRows
        .filter((x) => x.r.studyId === s.id)
        .map((x) => ({
          revision: x.r.revision,
          title: x.r.title,
          message: x.r.message,
          author: x.author,
          createdAt: x.r.createdAt.toISOString(),
          document: x.r.document,
        })),
      logs: logs.get(s.id) ?? [],
    })),
  };
}

interface ImportProblem {
  /** Which item: `maps[2] "Street wheel"`, `studies[0] "Hill-climb" revision 3`, or `archive`. */
  item: string;
  message: string;
}

function remapDocument(doc: StudyDocument, mapIds: Map<string, string>): StudyDocument {
  return {
    ...doc,
    plans: doc.plans.map((plan) => {
      const out: Record<string, unknown> = { ...plan };
      for (const field of PLAN_MAP_FIELDS) {
        const id = out[field];
        if (typeof id === 'string' && !id.startsWith(BUILTIN_PREFIX)) out[field] = mapIds.get(id) ?? id;
      }
      return out as StudyDocument['plans'][number];
    }),
  };
}

/** Imports an archive into a team (see `writeArchive`) and records it; answers what came in. */
export async function importTeam(db: Db, input: { teamId: string; importer: User; raw: unknown; req: Request }) {
  const counts = await writeArchive(db, input.teamId, input.importer.id, input.raw);
  await audit(db, { action: 'team.imported', teamId: input.teamId, actor: input.importer, details: counts, req: input.req });
  return counts;
}

/**
 * Checks a whole archive first and reports every problem by item; only a clean archive is
 * written, in one transaction, with new ids (map references inside documents follow them).
 */
async function writeArchive(db: Db, teamId: string, importerId: string, raw: unknown) {
  const shape = teamArchiveSchema.safeParse(raw);
  if (!shape.success) {
    const items = issuesOf(shape.error).map((i) => ({ item: 'archive', message: `${i.path}: ${i.message}` }));
    throw new HttpError(400, 'invalid_archive', `The archive is not a Spoolbook team archive: ${items[0].message}. Nothing was imported.`, { problems: items });
  }
  const archive = shape.data;
  const problems: ImportProblem[] = [];
  const archiveMapKinds = new Map<string, string>();
  const parsedMaps = archive.maps.map((m, i) => {
    const label = `maps[${i}] "${m.name}"`;
    if (archiveMapKinds.has(m.id)) problems.push({ item: label, message: `id ${m.id} appears twice in the archive` });
    archiveMapKinds.set(m.id, m.kind);
    const result = parseMapFile(m.fileText);
    if (!result.ok) {
      for (const p of result.problems)
        problems.push({ item: label, message: `${p.line ? `line ${p.line}${p.column ? `, column ${p.column}` : ''}: ` : ''}${p.message}` });
      return null;
    }
    if (result.map.kind !== m.kind) problems.push({ item: label, message: `the file is a ${result.map.kind} map but the archive says ${m.kind}` });
    return result.map;
  });
  const documents = archive.studies.map((s, i) =>
    s.revisions.map((r, j) => {
      const label = `studies[${i}] "${s.title}" revision ${r.revision}`;
      if (j > 0 && r.revision <= s.revisions[j - 1].revision) problems.push({ item: label, message: 'revisions must be in increasing order' });
      try {
        const doc = validDocument(r.document);
        doc.plans.forEach((plan, k) => {
          for (const field of PLAN_MAP_FIELDS) {
            const id = (plan as Record<string, unknown>)[field];
            if (typeof id !== 'string') continue;
            const kind = id.startsWith(BUILTIN_PREFIX) ? builtinMap(id)?.map.kind : archiveMapKinds.get(id);
            const wanted = field === 'compressorMapId' ? 'compressor' : 'turbine';
            if (!kind) problems.push({ item: label, message: `document.plans.${k}.${field}: names map ${id}, which is neither in the archive nor built in` });
            else if (kind !== wanted)
              problems.push({ item: label, message: `document.plans.${k}.${field}: names a ${kind} map where a ${wanted} map belongs` });
          }
        });
        return doc;
      } catch (err) {
        if (!(err instanceof HttpError)) throw err;
        const issues = (err.details as { issues?: { path: string; message: string }[] } | undefined)?.issues ?? [{ path: 'document', message: err.message }];
        for (const issue of issues) problems.push({ item: label, message: `${issue.path}: ${issue.message}` });
        return null;
      }
    }),
  );
  archive.studies.forEach((s, i) =>
    (s.logs ?? []).forEach((log, j) => {
      for (const message of checkArchiveLog(log).problems) problems.push({ item: `studies[${i}] "${s.title}" logs[${j}] "${log.name}"`, message });
    }),
  );
  if (problems.length > 0) {
    throw new HttpError(400, 'invalid_archive', `The archive has ${problems.length} problem${problems.length === 1 ? '' : 's'}; nothing was imported.`, {
      problems: problems.slice(0, 500),
    });
  }

  // Authors are matched only among the members of the team the archive goes into: an archive
  // cannot name anyone else (nor find out who has an account). Others stay as plain text.
  const authorEmails = [...new Set(archive.studies.flatMap((s) => s.revisions.map((r) => r.author?.trim().toLowerCase())).filter((e): e is string => !!e))];
  const authorRows = authorEmails.length
    ? await db
        .select({ id: users.id, email: users.email })
        .from(teamMembers)
        .innerJoin(users, eq(users.id, teamMembers.userId))
        .where(and(eq(teamMembers.teamId, teamId), inArray(users.email, authorEmails)))
    : [];
  const authorIds = new Map(authorRows.map((a) => [a.email, a.id]));

  return db.transaction(async (tx) => {
    const mapIds = new Map<string, string>();
    for (const [i, m] of archive.maps.entries()) {
      const id = newId();
      mapIds.set(m.id, id);
      await tx.insert(maps).values({
        id,
        teamId,
        kind: m.kind,
        name: m.name,
        notes: m.notes,
        parsed: { ...parsedMaps[i]!, name: m.name },
        fileText: m.fileText,
        fileName: m.fileName,
        createdBy: importerId,
        createdAt: new Date(m.createdAt),
      });
    }
    for (const [i, s] of archive.studies.entries()) {
      const id = newId();
      const docs = documents[i].map((d) => remapDocument(d!, mapIds));
      const last = s.revisions[s.revisions.length - 1];
      const lastDoc = docs[docs.length - 1];
      await tx.insert(studies).values({
        id,
        teamId,
        title: s.title,
        engineLabel: lastDoc.engineLabel,
        document: lastDoc,
        revision: last.revision,
        archived: s.archived,
        createdBy: importerId,
        updatedBy: importerId,
        createdAt: new Date(s.createdAt),
        updatedAt: new Date(last.createdAt),
      });
      for (const [j, r] of s.revisions.entries()) {
        await tx.insert(studyRevisions).values({
          studyId: id,
          revision: r.revision,
          document: docs[j],
          title: r.title,
          message: r.message,
          authorId: r.author ? (authorIds.get(r.author.trim().toLowerCase()) ?? null) : null,
          authorName: r.author && !authorIds.has(r.author.trim().toLowerCase()) ? r.author : null,
          createdAt: new Date(r.createdAt),
        });
      }
      await writeArchiveLogs(tx, { teamId, studyId: id, importerId, logs: s.logs ?? [] });
    }
    return { maps: archive.maps.length, studies: archive.studies.length, revisions: archive.studies.reduce((n, s) => n + s.revisions.length, 0) };
  });
}
