import type { StudyDocument } from '#shared/schemas/study';
import { lineKeyOf } from '#src/components/study/lines';

/** Side by side compares at least two and at most four combinations. */
export const MIN_COMBINATIONS = 2;
export const MAX_COMBINATIONS = 4;

/** One plan × scenario × boost row the reader may pick, with its line key. */
export interface Combination {
  key: string;
  planId: string;
  planIndex: number;
  planName: string;
  scenarioIndex: number;
  scenarioName: string;
  rowIndex: number;
  rowLabel: string;
}

/** Every combination of the study, plan by plan, then scenario, then boost row. */
export function allCombinations(doc: StudyDocument): Combination[] {
  return doc.plans.flatMap((plan, planIndex) =>
    doc.scenarios.flatMap((scenario, scenarioIndex) =>
      scenario.boostSchedule.map((row, rowIndex) => ({
        key: lineKeyOf(plan.id, scenarioIndex, rowIndex),
        planId: plan.id,
        planIndex,
        planName: plan.name,
        scenarioIndex,
        scenarioName: scenario.name,
        rowIndex,
        rowLabel: row.label,
      })),
    ),
  );
}

/** Each plan at the first scenario's first boost row (the first four plans when there are more). */
export function defaultSelection(doc: StudyDocument): string[] {
  if (doc.scenarios.length === 0) return [];
  return doc.plans.slice(0, MAX_COMBINATIONS).map((plan) => lineKeyOf(plan.id, 0, 0));
}

/**
 * The combinations named in the address (`?lines=a,b`), kept when they still exist, in the order
 * given, without repeats, at most four. Fewer than one valid name gives the default.
 */
export function selectionFromParam(param: string | null, doc: StudyDocument): string[] {
  if (!param) return defaultSelection(doc);
  const known = new Set(allCombinations(doc).map((c) => c.key));
  const keys = [...new Set(param.split(',').map((k) => k.trim()))].filter((k) => known.has(k)).slice(0, MAX_COMBINATIONS);
  return keys.length > 0 ? keys : defaultSelection(doc);
}

export function selectionParam(keys: readonly string[]): string {
  return keys.join(',');
}

/** The selection with one combination switched on or off (never above the maximum). */
export function toggleCombination(keys: readonly string[], key: string): string[] {
  if (keys.includes(key)) return keys.filter((k) => k !== key);
  if (keys.length >= MAX_COMBINATIONS) return [...keys];
  return [...keys, key];
}
