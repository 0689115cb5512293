/**
 * Logged runs of a study: reading an upload with its mapping (all or nothing), storing the packed
 * samples deflated, listing, changing the chosen segments, the CSV downloads, deleting; and the
 * team's mapping presets.
 */
import { createHash } from 'node:crypto';
import { promisify } from 'node:util';
import { deflate, inflate } from 'node:zlib';
import { and, asc, desc, eq, sql } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { z } from 'zod';
import { writeCsv } from '#shared/csv';
import { applyMapping, type MappedLog } from '#shared/logs/convert';
import { DEFAULT_FIT_SETTINGS, fitVolumetricEfficiency } from '#shared/logs/fit';
import { logMappingSchema, type LogMapping } from '#shared/logs/mapping';
import { packChannels, unpackChannels } from '#shared/logs/pack';
import { placeSamples } from '#shared/logs/place';
import { readLogTable, type ReadProblem } from '#shared/logs/read';
import { chosenSegments, detectSegments, usedRows } from '#shared/logs/segments';
import { placementContext, studyStoichiometricAfr } from '#shared/logs/study';
import type { CompressorMap } from '#shared/maps/types';
import { MAX_LOG_ROWS, type LogSummary, type logPointsQuerySchema, type updateLogSchema } from '#shared/schemas/logs';
import type { StudyDocument } from '#shared/schemas/study';
import { newId } from '../auth/tokens';
import type { Db } from '../db/client';
import { logMappingPresets, studies, studyLogs } from '../db/schema';
import { HttpError, issuesOf, notFound } from '../http/errors';
import { audit } from './audit';
import { mapsOfStudy, validDocument } from './study-documents';

const deflateAsync = promisify(deflate);
const inflateAsync = promisify(inflate);

type LogRow = typeof studyLogs.$inferSelect;

function summaryOf(row: Omit<LogRow, 'samples'> & { storedBytes: number }): LogSummary {
  return {
    id: row.id,
    studyId: row.studyId,
    name: row.name,
    loggedOn: row.loggedOn,
    notes: row.notes,
    sourceName: row.sourceName,
    sourceChecksum: row.sourceChecksum,
    sourceBytes: row.sourceBytes,
    storedBytes: row.storedBytes,
    rows: row.rowCount,
    duration: row.duration,
    channels: row.channels as LogSummary['channels'],
    skipped: row.skipped as LogSummary['skipped'],
    mapping: row.mapping as LogMapping,
    selection: (row.selection as LogSummary['selection']) ?? null,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Text of an upload: UTF-8 when it is valid UTF-8, otherwise Windows-1252, as loggers on Windows write. */
function textOf(bytes: Buffer): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

function refuse(problems: ReadProblem[], what: string): never {
  const n = problems.length;
  const first = problems[0];
  const where = first ? `line ${first.line}${first.column ? `, column ${first.column}` : ''}: ` : '';
  throw new HttpError(400, 'invalid_log', `The log ${what}; nothing was saved. ${where}${first?.message ?? ''}`.trim(), {
    problems: problems.slice(0, 50),
    problemCount: n,
  });
}

/** The mapping field of an upload: JSON text, checked by the shared schema, 400 with field paths. */
function parseMappingField(text: string): LogMapping {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'invalid_input', 'mapping: is not JSON. Send the column mapping as JSON text in the field "mapping".', {
      issues: [{ path: 'mapping', message: 'is not JSON' }],
    });
  }
  const parsed = logMappingSchema.safeParse(raw);
  if (!parsed.success) {
    const issues = issuesOf(parsed.error).map((i) => ({ ...i, path: i.path ? `mapping.${i.path}` : 'mapping' }));
    throw new HttpError(400, 'invalid_input', `Invalid mapping: ${issues[0].path}: ${issues[0].message}`, { issues });
  }
  return parsed.data;
}

/** Reads and maps a log's bytes; refuses (400) with every problem found, by line and column. */
export function readLog(bytes: Buffer, mapping: LogMapping): MappedLog {
  if (bytes.length === 0) refuse([{ line: 1, message: 'The file is empty.' }], 'is empty');
  const mapped = new Set(mapping.columns.map((c) => c.column));
  const read = readLogTable(textOf(bytes), { keep: (name) => mapped.has(name) });
  if (!read.ok) refuse(read.problems, 'could not be read');
  if (read.table.rowCount > MAX_LOG_ROWS)
    refuse(
      [{ line: read.table.rowLines[MAX_LOG_ROWS], message: `The log has ${read.table.rowCount} rows; at most ${MAX_LOG_ROWS} are accepted.` }],
      'is too long',
    );
  const result = applyMapping(read.table, mapping);
  if (!result.ok) refuse(result.problems, 'does not fit its mapping');
  return result.log;
}

async function studyOfTeam(db: Pick<Db, 'select'>, teamId: string, studyId: string) {
  const [row] = await db
    .select({ id: studies.id, title: studies.title, document: studies.document, revision: studies.revision })
    .from(studies)
    .where(and(eq(studies.id, studyId), eq(studies.teamId, teamId)));
  if (!row) throw notFound('No such study in this team.');
  return row;
}

/** Packs and deflates SI channels for storage. */
export async function storedSamples(log: Pick<MappedLog, 'channels' | 'rowCount'>): Promise<Buffer> {
  return deflateAsync(packChannels(log.channels, log.rowCount), { level: 6 });
}

interface NewLog {
  teamId: string;
  studyId: string;
  name: string;
  loggedOn: string | null;
  notes: string;
  mapping: LogMapping;
  sourceName: string;
  sourceChecksum: string;
  sourceBytes: number;
  log: Pick<MappedLog, 'channels' | 'rowCount' | 'duration' | 'skipped'>;
  samples: Buffer;
  selection?: { start: number; end: number }[] | null;
  createdBy: string | null;
  createdAt?: Date;
}

/** One insert (callers inside a transaction pass it). */
export async function insertLog(db: Pick<Db, 'insert'>, input: NewLog) {
  const id = newId();
  const channels = Object.keys(input.log.channels);
  const [row] = await db
    .insert(studyLogs)
    .values({
      id,
      teamId: input.teamId,
      studyId: input.studyId,
      name: input.name,
      loggedOn: input.loggedOn,
      notes: input.notes,
      mapping: input.mapping,
      sourceChecksum: input.sourceChecksum,
      sourceName: input.sourceName,
      sourceBytes: input.sourceBytes,
      rowCount: input.log.rowCount,
      duration: input.log.duration,
      channels,
      skipped: input.log.skipped,
      samples: input.samples,
      selection: input.selection ?? null,
      createdBy: input.createdBy,
      ...(input.createdAt ? { createdAt: input.createdAt } : {}),
    })
    .returning();
  return summaryOf({ ...row, storedBytes: input.samples.length });
}

/** Reads, checks and stores an upload in one go: a log that does not read is not stored at all. */
export async function createLog(
  db: Db,
  input: {
    teamId: string;
    studyId: string;
    actor: User;
    file: { buffer: Buffer; originalname: string };
    fields: { mapping: string; name?: string; loggedOn?: string; notes?: string };
    req: Request;
  },
) {
  await studyOfTeam(db, input.teamId, input.studyId);
  const mapping = parseMappingField(input.fields.mapping);
  const log = readLog(input.file.buffer, mapping);
  const samples = await storedSamples(log);
  const sourceName = input.file.originalname.replace(/[\u0000-\u001f]/g, '').slice(0, 200);
  return db.transaction(async (tx) => {
    const summary = await insertLog(tx, {
      teamId: input.teamId,
      studyId: input.studyId,
      name: input.fields.name ?? (sourceName.replace(/\.[^.]*$/, '') || 'Logged run'),
      loggedOn: input.fields.loggedOn ?? null,
      notes: input.fields.notes ?? '',
      mapping,
      sourceName,
      sourceChecksum: createHash('sha256').update(input.file.buffer).digest('hex'),
      sourceBytes: input.file.buffer.length,
      log,
      samples,
      createdBy: input.actor.id,
    });
    await audit(tx, {
      action: 'log.uploaded',
      teamId: input.teamId,
      actor: input.actor,
      targetType: 'log',
      targetId: summary.id,
      details: { study: input.studyId, name: summary.name, rows: summary.rows },
      req: input.req,
    });
    return summary;
  });
}

const summaryColumns = {
  id: studyLogs.id,
  teamId: studyLogs.teamId,
  studyId: studyLogs.studyId,
  name: studyLogs.name,
  loggedOn: studyLogs.loggedOn,
  notes: studyLogs.notes,
  mapping: studyLogs.mapping,
  sourceChecksum: studyLogs.sourceChecksum,
  sourceName: studyLogs.sourceName,
  sourceBytes: studyLogs.sourceBytes,
  rowCount: studyLogs.rowCount,
  duration: studyLogs.duration,
  channels: studyLogs.channels,
  skipped: studyLogs.skipped,
  selection: studyLogs.selection,
  createdBy: studyLogs.createdBy,
  createdAt: studyLogs.createdAt,
};

const storedBytesColumn = sql<number>`octet_length(${studyLogs.samples})`.mapWith(Number);

export async function listLogs(db: Db, teamId: string, studyId: string): Promise<LogSummary[]> {
  await studyOfTeam(db, teamId, studyId);
  const rows = await db
    .select({ ...summaryColumns, storedBytes: storedBytesColumn })
    .from(studyLogs)
    .where(and(eq(studyLogs.teamId, teamId), eq(studyLogs.studyId, studyId)))
    .orderBy(desc(studyLogs.createdAt), asc(studyLogs.id));
  return rows.map(summaryOf);
}

async function logRow(db: Db, teamId: string, studyId: string, logId: string): Promise<LogRow> {
  const [row] = await db
    .select()
    .from(studyLogs)
    .where(and(eq(studyLogs.id, logId), eq(studyLogs.teamId, teamId), eq(studyLogs.studyId, studyId)));
  if (!row) throw notFound('No such log in this study.');
  return row;
}

/** The stored (deflated) samples as they are: the browser inflates them itself. */
export async function logSamples(db: Db, teamId: string, studyId: string, logId: string): Promise<Buffer> {
  return (await logRow(db, teamId, studyId, logId)).samples;
}

export async function updateLog(db: Db, teamId: string, studyId: string, logId: string, changes: z.output<typeof updateLogSchema>) {
  const row = await logRow(db, teamId, studyId, logId);
  if (changes.selection)
    for (const [i, r] of changes.selection.entries())
      if (r.end >= row.rowCount)
        throw new HttpError(400, 'invalid_input', `selection.${i}.end: the log has ${row.rowCount} rows (0 to ${row.rowCount - 1})`, {
          issues: [{ path: `selection.${i}.end`, message: `must be below ${row.rowCount}` }],
        });
  const [updated] = await db
    .update(studyLogs)
    .set(changes)
    .where(eq(studyLogs.id, logId))
    .returning({ ...summaryColumns, storedBytes: storedBytesColumn });
  return summaryOf(updated);
}

export async function deleteLog(db: Db, input: { teamId: string; studyId: string; logId: string; actor: User; req: Request }) {
  await db.transaction(async (tx) => {
    const deleted = await tx
      .delete(studyLogs)
      .where(and(eq(studyLogs.id, input.logId), eq(studyLogs.teamId, input.teamId), eq(studyLogs.studyId, input.studyId)))
      .returning({ id: studyLogs.id, name: studyLogs.name });
    if (deleted.length === 0) throw notFound('No such log in this study.');
    await audit(tx, {
      action: 'log.deleted',
      teamId: input.teamId,
      actor: input.actor,
      targetType: 'log',
      targetId: input.logId,
      details: { study: input.studyId, name: deleted[0].name },
      req: input.req,
    });
  });
}

/** A stored log with its study, unpacked, and the rows used (the chosen segments, else the detected pulls, else all). */
async function loadedLog(db: Db, teamId: string, studyId: string, logId: string) {
  const study = await studyOfTeam(db, teamId, studyId);
  const row = await logRow(db, teamId, studyId, logId);
  const { channels, rowCount } = unpackChannels(new Uint8Array(await inflateAsync(row.samples)));
  const chosen = chosenSegments(row.selection as { start: number; end: number }[] | null, detectSegments(channels));
  return { study, row, channels, rowCount, used: usedRows(rowCount, chosen), document: validDocument(study.document) };
}

/** File names of a log's downloads: made by us from its id, never from a client's name. */
export const logFileName = (logId: string, what: 'points' | 'fit') => `log-${logId}-${what}.csv`;

function planAndScenario(document: StudyDocument, query: z.output<typeof logPointsQuerySchema>) {
  const planIndex = query.plan === undefined ? 0 : document.plans.findIndex((p) => p.id === query.plan);
  if (planIndex === -1)
    throw new HttpError(400, 'invalid_input', `plan: the study has no plan "${query.plan}"`, {
      issues: [{ path: 'plan', message: 'names no plan of the study' }],
    });
  const scenarioIndex = query.scenario ?? 0;
  if (scenarioIndex >= document.scenarios.length)
    throw new HttpError(400, 'invalid_input', `scenario: the study has ${document.scenarios.length} scenarios (0 to ${document.scenarios.length - 1})`, {
      issues: [{ path: 'scenario', message: 'is past the last scenario' }],
    });
  return { planIndex, scenarioIndex };
}

/** One row per used sample, placed on the compressor map of the plan, against the scenario. */
export async function logPointsCsv(db: Db, teamId: string, studyId: string, logId: string, query: z.output<typeof logPointsQuerySchema>) {
  const { channels, rowCount, used, document } = await loadedLog(db, teamId, studyId, logId);
  const { planIndex, scenarioIndex } = planAndScenario(document, query);
  const mapId = document.plans[planIndex].compressorMapId;
  const maps = await mapsOfStudy(db, teamId, document);
  const map = mapId && maps[mapId]?.kind === 'compressor' ? (maps[mapId] as CompressorMap) : null;
  const placed = placeSamples(channels, placementContext(document, planIndex, scenarioIndex, map));
  const rows: number[][] = [];
  for (let i = 0; i < rowCount; i++)
    if (used[i]) rows.push([channels.time![i], channels.engineSpeed![i], channels.manifoldPressure![i], placed.correctedMassFlow[i], placed.pressureRatio[i]]);
  return writeCsv(['Time (s)', 'Engine speed (rpm)', 'Manifold pressure (Pa)', 'Corrected mass flow (kg/s)', 'Pressure ratio'], rows);
}

/** Volumetric efficiency per engine-speed band backed out of the used samples. */
export async function logFitCsv(db: Db, teamId: string, studyId: string, logId: string) {
  const { channels, used, document } = await loadedLog(db, teamId, studyId, logId);
  const fit = fitVolumetricEfficiency(
    channels,
    used,
    { displacement: document.engine.displacement, strokes: document.engine.strokes, stoichiometricAfr: studyStoichiometricAfr(document) },
    DEFAULT_FIT_SETTINGS,
  );
  return writeCsv(
    ['Engine speed (rpm)', 'Volumetric efficiency (fraction)', 'Samples'],
    fit.bands.map((b) => [b.rpm, b.value, b.samples]),
  );
}

// Mapping presets

function presetOf(row: typeof logMappingPresets.$inferSelect) {
  return { id: row.id, name: row.name, mapping: row.mapping as LogMapping, updatedAt: row.updatedAt.toISOString() };
}

export async function listPresets(db: Db, teamId: string) {
  const rows = await db.select().from(logMappingPresets).where(eq(logMappingPresets.teamId, teamId)).orderBy(asc(logMappingPresets.name));
  return rows.map(presetOf);
}

/** Saves a preset under its name, replacing one of the same name. */
export async function savePreset(db: Db, input: { teamId: string; userId: string; name: string; mapping: LogMapping }) {
  const [row] = await db
    .insert(logMappingPresets)
    .values({ id: newId(), teamId: input.teamId, name: input.name, mapping: input.mapping, createdBy: input.userId })
    .onConflictDoUpdate({ target: [logMappingPresets.teamId, logMappingPresets.name], set: { mapping: input.mapping, updatedAt: new Date() } })
    .returning();
  return presetOf(row);
}

export async function deletePreset(db: Db, teamId: string, presetId: string) {
  const rows = await db
    .delete(logMappingPresets)
    .where(and(eq(logMappingPresets.id, presetId), eq(logMappingPresets.teamId, teamId)))
    .returning({ id: logMappingPresets.id });
  if (rows.length === 0) throw notFound('No such mapping preset in this team.');
}
