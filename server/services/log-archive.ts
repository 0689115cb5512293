/** Logged runs in the team archive: written with their stored samples, checked whole before import. */
import { inflateSync } from 'node:zlib';
import { asc, eq } from 'drizzle-orm';
import type { z } from 'zod';
import { logMappingSchema } from '#shared/logs/mapping';
import { unpackChannels } from '#shared/logs/pack';
import type { archiveLogSchema } from '#shared/schemas/archive';
import type { Db, Tx } from '../db/client';
import { studyLogs } from '../db/schema';
import { insertLog } from './logs';

type ArchiveLog = z.output<typeof archiveLogSchema>;

/** Every log of the team's studies, by study id, as the archive holds them. */
export async function archiveLogsOf(db: Db, teamId: string): Promise<Map<string, ArchiveLog[]>> {
  const rows = await db.select().from(studyLogs).where(eq(studyLogs.teamId, teamId)).orderBy(asc(studyLogs.createdAt), asc(studyLogs.id));
  const out = new Map<string, ArchiveLog[]>();
  for (const r of rows) {
    const list = out.get(r.studyId) ?? [];
    list.push({
      name: r.name,
      loggedOn: r.loggedOn,
      notes: r.notes,
      mapping: r.mapping,
      sourceName: r.sourceName,
      sourceChecksum: r.sourceChecksum,
      sourceBytes: r.sourceBytes,
      selection: (r.selection as ArchiveLog['selection']) ?? null,
      skipped: r.skipped as ArchiveLog['skipped'],
      createdAt: r.createdAt.toISOString(),
      samples: r.samples.toString('base64'),
    });
    out.set(r.studyId, list);
  }
  return out;
}

/** A log of an archive checked and read: the problems (by message), or what to insert. */
export function checkArchiveLog(log: ArchiveLog) {
  const mapping = logMappingSchema.safeParse(log.mapping);
  if (!mapping.success) return { problems: [`mapping: ${mapping.error.issues[0].message}`] } as const;
  const samples = Buffer.from(log.samples, 'base64');
  try {
    const { channels, rowCount } = unpackChannels(new Uint8Array(inflateSync(samples, { maxOutputLength: 512 * 1024 * 1024 })));
    const time = channels.time;
    if (!time || !channels.engineSpeed || !channels.manifoldPressure || rowCount < 2)
      return { problems: ['samples: lack time, engine speed or manifold pressure'] } as const;
    if (log.selection?.some((s) => s.end >= rowCount)) return { problems: [`selection: goes past the log's ${rowCount} rows`] } as const;
    return { problems: [], mapping: mapping.data, samples, log: { channels, rowCount, duration: time[rowCount - 1] - time[0], skipped: log.skipped } } as const;
  } catch (err) {
    return { problems: [`samples: ${err instanceof Error ? err.message : 'do not read'}`] } as const;
  }
}

/** Inserts the checked logs of one imported study. */
export async function writeArchiveLogs(tx: Tx, input: { teamId: string; studyId: string; importerId: string; logs: ArchiveLog[] }) {
  for (const log of input.logs) {
    const checked = checkArchiveLog(log);
    if (!('log' in checked) || !checked.log) throw new Error('archive log was not checked before writing');
    await insertLog(tx, {
      teamId: input.teamId,
      studyId: input.studyId,
      name: log.name,
      loggedOn: log.loggedOn,
      notes: log.notes,
      mapping: checked.mapping,
      sourceName: log.sourceName,
      sourceChecksum: log.sourceChecksum,
      sourceBytes: log.sourceBytes,
      log: checked.log,
      samples: checked.samples,
      selection: log.selection,
      createdBy: input.importerId,
      createdAt: new Date(log.createdAt),
    });
  }
}
