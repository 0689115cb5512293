import { useMemo } from 'react';
import type { CompressorMap, SpoolbookMap, TurbineMap } from '#shared/maps/types';
import type { StudyResult } from '#shared/matching/result';
import type { StudyDocument } from '#shared/schemas/study';
import { studyLines, type StudyLine } from '#src/components/study/lines';
import { runStudyLive } from '#src/components/study/run';

/** A study as the read-only views show it: what was saved and the maps its plans use. */
export interface StudyViewData {
  title: string;
  revision: number;
  /** ISO 8601 time of the revision. */
  updatedAt: string;
  document: StudyDocument;
  mapsById: Record<string, SpoolbookMap | undefined>;
  /** Names of the maps as the library lists them, by id (the map's own name when absent). */
  mapNames?: Record<string, string>;
}

/** The plans that share one map, drawn together on it. */
interface PlanMapGroup<M> {
  key: string;
  /** null: the plans name no map, or it could not be loaded. */
  mapId: string | null;
  map: M | null;
  title: string;
  planNames: string[];
  lines: StudyLine[];
}

/** The plans that share one compressor map. */
export type MapGroup = PlanMapGroup<CompressorMap>;

/** The plans with an exhaust side that share one turbine map (map null: none named or not loaded, so the exhaust side is not computed). */
export type TurbineMapGroup = PlanMapGroup<TurbineMap>;

/** A map's name for people: the library's name, the map's own, or its id. */
export function mapName(mapId: string, mapsById: StudyViewData['mapsById'], mapNames: Record<string, string> = {}): string {
  return mapNames[mapId] ?? mapsById[mapId]?.name ?? mapId;
}

/** The lines grouped by the map `mapIdOf` names for each plan (undefined: the plan is left out), in plan order. */
function groupByMap<M extends SpoolbookMap>(
  doc: StudyDocument,
  lines: readonly StudyLine[],
  mapsById: StudyViewData['mapsById'],
  mapNames: Record<string, string>,
  kind: M['kind'],
  mapIdOf: (plan: StudyDocument['plans'][number]) => string | null | undefined,
  noMapTitle: string,
): PlanMapGroup<M>[] {
  const groups = new Map<string, PlanMapGroup<M>>();
  doc.plans.forEach((plan, planIndex) => {
    const id = mapIdOf(plan);
    if (id === undefined) return;
    const loaded = id ? mapsById[id] : undefined;
    const map = loaded && loaded.kind === kind ? (loaded as M) : null;
    const key = map && id ? id : '(no map)';
    let group = groups.get(key);
    if (!group) {
      group = { key, mapId: map ? id : null, map, title: map && id ? mapName(id, mapsById, mapNames) : noMapTitle, planNames: [], lines: [] };
      groups.set(key, group);
    }
    group.planNames.push(plan.name);
    group.lines.push(...lines.filter((l) => l.planIndex === planIndex));
  });
  return [...groups.values()];
}

/**
 * The lines grouped by the compressor map of their plan, in plan order. Plans on different maps
 * are drawn on separate maps: a point is only meaningful on the map it was read from.
 */
export function mapGroups(
  doc: StudyDocument,
  lines: readonly StudyLine[],
  mapsById: StudyViewData['mapsById'],
  mapNames: Record<string, string> = {},
): MapGroup[] {
  return groupByMap<CompressorMap>(doc, lines, mapsById, mapNames, 'compressor', (plan) => plan.compressorMapId ?? null, 'Plans without a compressor map');
}

/**
 * The lines of the plans with an exhaust side, grouped by their turbine map in plan order, like
 * `mapGroups` for the compressor. Plans without an exhaust block are left out; those with one but
 * no loaded turbine map form one group without a map.
 */
export function turbineMapGroups(
  doc: StudyDocument,
  lines: readonly StudyLine[],
  mapsById: StudyViewData['mapsById'],
  mapNames: Record<string, string> = {},
): TurbineMapGroup[] {
  return groupByMap<TurbineMap>(
    doc,
    lines,
    mapsById,
    mapNames,
    'turbine',
    (plan) => (plan.exhaust ? (plan.turbineMapId ?? null) : undefined),
    'Plans without a turbine map',
  );
}

export interface ComputedStudy {
  result: StudyResult;
  lines: StudyLine[];
  groups: MapGroup[];
  /** Turbine maps of the plans with an exhaust side; empty for a study judged on the compressor alone. */
  turbineGroups: TurbineMapGroup[];
}

/** Computes the study in the browser with the same engine as the workspace, once per document and maps. */
export function useComputedStudy(data: Pick<StudyViewData, 'document' | 'mapsById' | 'mapNames'>): ComputedStudy {
  const { document, mapsById, mapNames } = data;
  return useMemo(() => {
    const result = runStudyLive(document, mapsById);
    const lines = studyLines(result, document.plans);
    return {
      result,
      lines,
      groups: mapGroups(document, lines, mapsById, mapNames),
      turbineGroups: turbineMapGroups(document, lines, mapsById, mapNames),
    };
  }, [document, mapsById, mapNames]);
}
