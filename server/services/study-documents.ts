import { and, eq, inArray } from 'drizzle-orm';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeCsv } from '#shared/csv';
import type { SpoolbookMap } from '#shared/maps/types';
import { runStudyDocument } from '#shared/study/run';
import { resultRecords } from '#shared/matching/results-table';
import { migrateStudyDocument, STUDY_SCHEMA_VERSION, studyDocumentSchema, type StudyDocument, type StudyStart } from '#shared/schemas/study';
import { fillItemIds } from '#shared/schemas/item-ids';
import { readStudyDocument, studyMapIds } from '#shared/study/document';
import type { Db } from '../db/client';
import { maps } from '../db/schema';
import { HttpError } from '../http/errors';
import { builtinMap, BUILTIN_PREFIX } from './builtin-maps';

const demoDir = fileURLToPath(new URL('../../data/demo/', import.meta.url));
const templatesDir = fileURLToPath(new URL('../../data/templates/', import.meta.url));

/** The invented demo study documents shipped in data/demo/, by file name. */
export const DEMO_STUDY_FILES = { compressor: 'hillclimb-study.json', turbineHousing: 'turbine-housing-study.json' } as const;

/** An invented demo study document (by default the compressor study new studies start from). */
export function demoStudyDocument(file: string = DEMO_STUDY_FILES.compressor): StudyDocument {
  return studyDocumentSchema.parse(migrateStudyDocument(JSON.parse(readFileSync(path.join(demoDir, file), 'utf8'))));
}

/** The document a new study starts from, by template. */
export function startDocument(start: StudyStart): StudyDocument {
  if (start === 'blank') return studyDocumentSchema.parse(JSON.parse(readFileSync(path.join(templatesDir, 'blank-study.json'), 'utf8')));
  return demoStudyDocument(start === 'demo-exhaust' ? DEMO_STUDY_FILES.turbineHousing : DEMO_STUDY_FILES.compressor);
}

/**
 * Checks a document from a client (or an older stored one) and returns it at the current version,
 * or throws a 400 whose issue paths start with `document.`.
 */
export function validDocument(raw: unknown): StudyDocument {
  const read = readStudyDocument(raw);
  if (read.ok) return read.document;
  const issues = read.issues.map((i) => ({ path: i.path ? `document.${i.path}` : 'document', message: i.message }));
  throw new HttpError(400, 'invalid_input', `Invalid study: ${issues[0].path}: ${issues[0].message}`, { issues });
}

/**
 * Stored documents were valid when saved; only an older version needs bringing up to date on read
 * (and one saved before scenarios and boost rows had ids gets them).
 */
export function storedDocument(raw: unknown): unknown {
  if ((raw as { schemaVersion?: unknown } | null)?.schemaVersion === STUDY_SCHEMA_VERSION) return fillItemIds(raw);
  try {
    return validDocument(raw);
  } catch {
    return raw;
  }
}

/** Where a plan names a map, and the kind of map that belongs there. */
const MAP_SLOTS = [
  { field: 'compressorMapId', kind: 'compressor', wrongKind: "is a turbine map; a plan's compressor needs a compressor map" },
  { field: 'turbineMapId', kind: 'turbine', wrongKind: "is a compressor map; a plan's exhaust side needs a turbine map" },
] as const;

/**
 * Plans may only name maps of the same team (or built-in ones): a compressor map as the
 * compressor's, a turbine map as the exhaust side's.
 */
export async function assertMapsUsable(db: Db, teamId: string, doc: StudyDocument) {
  const ids = studyMapIds(doc.plans);
  const teamIds = ids.filter((id) => !id.startsWith(BUILTIN_PREFIX));
  const found = teamIds.length
    ? await db
        .select({ id: maps.id, kind: maps.kind })
        .from(maps)
        .where(and(eq(maps.teamId, teamId), inArray(maps.id, teamIds)))
    : [];
  const kinds = new Map(found.map((m) => [m.id, m.kind]));
  const kindOf = (id: string) => (id.startsWith(BUILTIN_PREFIX) ? builtinMap(id)?.map.kind : kinds.get(id));
  const issues: { path: string; message: string }[] = [];
  doc.plans.forEach((plan, i) => {
    for (const slot of MAP_SLOTS) {
      const id = plan[slot.field];
      if (!id) continue;
      const kind = kindOf(id);
      if (!kind) issues.push({ path: `document.plans.${i}.${slot.field}`, message: "no such map in this team's library" });
      else if (kind !== slot.kind) issues.push({ path: `document.plans.${i}.${slot.field}`, message: slot.wrongKind });
    }
  });
  if (issues.length) throw new HttpError(400, 'invalid_input', `Invalid study: ${issues[0].path}: ${issues[0].message}`, { issues });
}

/** The parsed maps a study's plans use (compressor and turbine), by id. */
export async function mapsOfStudy(db: Db, teamId: string, doc: StudyDocument): Promise<Record<string, SpoolbookMap>> {
  const ids = studyMapIds(doc.plans);
  const out: Record<string, SpoolbookMap> = {};
  for (const id of ids) {
    if (id.startsWith(BUILTIN_PREFIX)) {
      const b = builtinMap(id);
      if (b) out[id] = b.map;
    }
  }
  const teamIds = ids.filter((id) => !id.startsWith(BUILTIN_PREFIX));
  if (teamIds.length) {
    const rows = await db
      .select({ id: maps.id, parsed: maps.parsed })
      .from(maps)
      .where(and(eq(maps.teamId, teamId), inArray(maps.id, teamIds)));
    for (const r of rows) out[r.id] = r.parsed as SpoolbookMap;
  }
  return out;
}

/** The results of a study as CSV (SI, units in the headers), spreadsheet formulas neutralised. */
export function resultsCsv(doc: StudyDocument, mapsById: Record<string, SpoolbookMap>): string {
  const result = runStudyDocument(doc, mapsById);
  const { fields, data } = resultRecords(result);
  return writeCsv(fields, data);
}
