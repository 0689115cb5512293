import { and, asc, eq } from 'drizzle-orm';
import type { Request } from 'express';
import type { User } from 'lucia';
import type { z } from 'zod';
import {
  CANDIDATE_CSV_FIELDS,
  candidateCsvRows,
  rankCompressors,
  rankTurbines,
  templatePlan,
  type CandidateMap,
  type CandidateOrigin,
} from '#shared/candidates';
import { writeCsv } from '#shared/csv';
import { familyMember } from '#shared/maps/family/similarity';
import { writeMapFile } from '#shared/maps';
import type { SpoolbookMap } from '#shared/maps/types';
import type { candidatesQuerySchema, familyRequestSchema } from '#shared/schemas/candidates';
import { mapModelCache } from '#shared/study/run';
import type { Db } from '../db/client';
import { maps } from '../db/schema';
import { HttpError } from '../http/errors';
import { builtinMaps } from './builtin-maps';
import { createMap, mapDetail } from './maps';
import { loadStudy } from './studies';
import { validDocument } from './study-documents';

/** Candidates: the library ranked against a study (candidates.csv), and new family members of a compressor map. */

// Models of the built-in maps are built once per process (their map objects never change).
const builtinModels = mapModelCache();

const originOf = (map: SpoolbookMap): CandidateOrigin => (map.kind === 'compressor' && map.estimate ? 'estimate' : 'team');

/** The team's maps of one kind by name, then the built-in ones, parsed. */
export async function libraryCandidates(db: Db, teamId: string, kind: SpoolbookMap['kind']): Promise<CandidateMap[]> {
  const rows = await db
    .select({ id: maps.id, name: maps.name, parsed: maps.parsed })
    .from(maps)
    .where(and(eq(maps.teamId, teamId), eq(maps.kind, kind)))
    .orderBy(asc(maps.name));
  const own = rows.map((r) => {
    const map = { ...(r.parsed as SpoolbookMap), name: r.name };
    return { id: r.id, name: r.name, origin: originOf(map), map };
  });
  const builtin = builtinMaps()
    .filter((b) => b.map.kind === kind)
    .map((b) => ({ id: b.id, name: b.map.name, origin: 'built-in' as const, map: b.map }));
  return [...own, ...builtin];
}

const badQuery = (path: string, message: string) => new HttpError(400, 'invalid_input', `Invalid query: ${path}: ${message}`, { issues: [{ path, message }] });

/** Every map of the library of one kind ranked against the study, as CSV (the columns of CANDIDATE_CSV_FIELDS). */
export async function candidatesCsv(db: Db, teamId: string, studyId: string, query: z.output<typeof candidatesQuerySchema>) {
  const { study } = await loadStudy(db, teamId, studyId);
  const doc = validDocument(study.document);
  if (query.kind === 'compressor') {
    const template = templatePlan(doc, 'compressor', query.planId);
    if (!template) throw badQuery('planId', 'no such plan in this study');
    const ranked = rankCompressors(doc, template, await libraryCandidates(db, teamId, 'compressor'), query.order ?? 'smallest', builtinModels);
    return { csv: writeCsv(CANDIDATE_CSV_FIELDS, candidateCsvRows(ranked, 'compressor')), revision: study.revision };
  }
  const template = templatePlan(doc, 'turbine', query.planId);
  if (!template) {
    throw badQuery(
      query.planId ? 'planId' : 'kind',
      query.planId
        ? 'no plan of this study with that id has an exhaust side'
        : 'this study has no plan with an exhaust side; turn the exhaust side on for a plan first (its gates, temperatures and losses judge every housing)',
    );
  }
  const compressors = await libraryCandidates(db, teamId, 'compressor');
  const compressor = compressors.find((c) => c.id === query.compressorMapId);
  if (!compressor) throw badQuery('compressorMapId', "no such compressor map in this team's library");
  const ranked = rankTurbines(
    { doc, template, compressor: { id: compressor.id, map: compressor.map } },
    await libraryCandidates(db, teamId, 'turbine'),
    builtinModels,
  );
  return { csv: writeCsv(CANDIDATE_CSV_FIELDS, candidateCsvRows(ranked, 'turbine')), revision: study.revision };
}

/** A new compressor map in the team's library, made from one of its maps (or a built-in one) by a family rule and marked as an estimate. */
export async function createFamilyMember(
  db: Db,
  input: { teamId: string; mapId: string; request: z.output<typeof familyRequestSchema>; actor: User; req: Request },
) {
  const parent = await mapDetail(db, input.teamId, input.mapId);
  if (parent.map.kind !== 'compressor') throw new HttpError(400, 'invalid_input', 'Only a compressor map can have a family: this is a turbine map.');
  const made = familyMember({ id: parent.id, map: { ...parent.map, name: parent.name } }, input.request.rule, input.request.name);
  if (!made.ok) throw new HttpError(400, 'invalid_input', `Invalid rule: ${made.message}`, { issues: [{ path: 'rule', message: made.message }] });
  return createMap(db, {
    teamId: input.teamId,
    map: made.map,
    fileText: writeMapFile(made.map),
    uploadedName: input.request.name,
    actor: input.actor,
    req: input.req,
  });
}
