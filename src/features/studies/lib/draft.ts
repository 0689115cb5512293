import { issuePath } from '#shared/schemas/issue-path';
import type { StudyDocument } from '#shared/schemas/study';

/**
 * A value as the editor holds it while it is being typed: the saved shape, with any field possibly
 * missing (a cleared box removes its key). The study schema checks the whole draft on every edit.
 */
export type Draft<T> = T extends readonly (infer U)[] ? Draft<U>[] : T extends object ? { [K in keyof T]?: Draft<T[K]> } : T;

/** The study document being edited. */
export type StudyDraft = Draft<StudyDocument>;
export type PlanDraft = NonNullable<StudyDraft['plans']>[number];
export type ExhaustDraft = NonNullable<PlanDraft['exhaust']>;
export type ScenarioDraft = NonNullable<StudyDraft['scenarios']>[number];
export type BoostRowDraft = NonNullable<ScenarioDraft['boostSchedule']>[number];
/** A table by rpm (volumetric efficiency, lambda, boost, exhaust gas temperature) as stored: SI values. */
export type RpmTable = StudyDocument['engine']['volumetricEfficiency'];
export type RpmTableDraft = Draft<RpmTable>;

/** A path into the study document: object keys and array indexes. */
export type DocPath = readonly (string | number)[];

/** The value at `path`, or undefined when any step is missing. */
export function getIn(root: unknown, path: DocPath): unknown {
  let here: unknown = root;
  for (const key of path) {
    if (here === null || typeof here !== 'object') return undefined;
    here = (here as Record<string | number, unknown>)[key];
  }
  return here;
}

/**
 * A copy of `root` with `value` at `path`, sharing every untouched branch (so React sees which
 * parts changed). `undefined` removes an object key, which is how optional fields are cleared.
 */
export function setIn<T>(root: T, path: DocPath, value: unknown): T {
  if (path.length === 0) return value as T;
  const [key, ...rest] = path;
  const base = root as unknown;
  if (Array.isArray(base)) {
    const copy = base.slice();
    const index = key as number;
    copy[index] = setIn(copy[index], rest, value);
    return copy as T;
  }
  const object = base !== null && typeof base === 'object' ? (base as Record<string, unknown>) : {};
  const next = setIn(object[key as string], rest, value);
  if (next === undefined) {
    const { [key as string]: _removed, ...others } = object;
    return others as T;
  }
  return { ...object, [key as string]: next } as T;
}

/** The dotted form of a path, as zod issues and the server name fields: `scenarios.0.ambient.altitude`. */
export function pathKey(path: DocPath): string {
  return issuePath(path);
}

/** Issues of a zod parse keyed by dotted path, first message per path. */
export function issuesByPath(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issuePath(issue.path);
    if (!(key in out)) out[key] = issue.message;
  }
  return out;
}

/** A fresh id for a new plan, unique within the study. */
export function newPlanId(existing: readonly { id?: string }[]): string {
  const taken = new Set(existing.map((p) => p.id));
  for (let n = existing.length + 1; ; n++) {
    const id = `plan-${n}-${Math.random().toString(36).slice(2, 7)}`;
    if (!taken.has(id)) return id;
  }
}
