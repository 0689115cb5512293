/**
 * "Write as boost by gear": a plan's usable boost turned into gear rows of a scenario's boost
 * schedule, so that the whole engine recomputes on the boost the tyres can use. Pure: returns the
 * new document, or why it cannot.
 */
import { valueAtRpm } from '../matching/rpm-table';
import type { StudyDocument } from '../schemas/study';
import type { DriveFigures } from './figures';

/** Most rows a scenario's boost schedule may have (the study schema's limit). */
const MAX_BOOST_ROWS = 20;

export const gearRowLabel = (gear: number) => `Gear ${gear} (tyres' grip)`;

/**
 * The document with one gear row per gear of the vehicle in scenario `scenarioIndex`, each the
 * usable boost of plan `planIndex` at every engine speed of the study (where it is unknown, the
 * row's own target stands). Rows of the same gear number are replaced; other rows stay.
 */
export function withUsableBoostByGear(
  doc: StudyDocument,
  figures: DriveFigures,
  planIndex: number,
  scenarioIndex: number,
): { ok: true; document: StudyDocument } | { ok: false; message: string } {
  const scenario = doc.scenarios[scenarioIndex];
  if (!scenario) return { ok: false, message: 'no such scenario' };
  const gears = figures.gears.filter((g) => g.planIndex === planIndex);
  if (gears.length === 0) return { ok: false, message: 'the plan has no drive figures' };
  const source = doc.scenarios[figures.scenarioIndex].boostSchedule;
  const rows = gears.map((g) => ({
    label: gearRowLabel(g.gear),
    kind: 'gear' as const,
    gear: g.gear,
    boost: g.points.map((p) => ({ rpm: p.rpm, value: Math.round(p.usableBoost ?? valueAtRpm(source[g.rowIndex].boost, p.rpm)) })),
  }));
  const written = new Set(rows.map((r) => r.gear));
  const kept = scenario.boostSchedule.filter((r) => !(r.kind === 'gear' && r.gear !== undefined && written.has(r.gear)));
  if (kept.length + rows.length > MAX_BOOST_ROWS)
    return { ok: false, message: `scenario "${scenario.name}" would have ${kept.length + rows.length} boost rows; at most ${MAX_BOOST_ROWS}` };
  const scenarios = doc.scenarios.map((s, i) => (i === scenarioIndex ? { ...s, boostSchedule: [...kept, ...rows] } : s));
  return { ok: true, document: { ...doc, scenarios } };
}
