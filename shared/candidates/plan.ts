/** The plan a candidate map is judged in, and the plan "Add as a plan" puts in the study. */
import type { StudyDocument, StudyPlan } from '../schemas/study';

/** Plans a study may hold (the study document's own limit). */
export const MAX_PLANS = 10;

/**
 * A plan for a candidate compressor, from the study's template plan: its number of turbochargers
 * and its own compressor efficiency (used only to place a point the map cannot deliver). What
 * belongs to the template's wheel stays behind: its speed limit (the candidate's map gives its own),
 * its off-map efficiency assumption (a candidate is judged on its map alone) and its exhaust side.
 */
export function compressorCandidatePlan(template: StudyPlan, mapId: string | null, name: string, id = 'candidate'): StudyPlan {
  return {
    id,
    name,
    turbochargers: template.turbochargers,
    compressorEfficiency: template.compressorEfficiency,
    ...(template.mapReference ? { mapReference: template.mapReference } : {}),
    compressorMapId: mapId,
  };
}

/**
 * A plan for a candidate turbine map: the template plan (which must have an exhaust side) with the
 * chosen compressor and this turbine, its housing taken from the map (a divided map in a divided
 * housing; the pulse factor applies to divided housings only).
 */
export function turbineCandidatePlan(
  template: StudyPlan,
  compressorMapId: string,
  turbineMapId: string,
  housing: 'single' | 'divided',
  name: string,
): StudyPlan {
  const { pulseFactor, ...rest } = template.exhaust!;
  return {
    ...compressorCandidatePlan(template, compressorMapId, name),
    turbineMapId,
    exhaust: { ...rest, housing, ...(housing === 'divided' && pulseFactor !== undefined ? { pulseFactor } : {}) },
  };
}

/** The template plan of a study for the ranking: the one named, else the first (the first with an exhaust side for turbines). */
export function templatePlan(doc: StudyDocument, kind: 'compressor' | 'turbine', planId?: string): StudyPlan | null {
  if (planId) {
    const plan = doc.plans.find((p) => p.id === planId) ?? null;
    return plan && (kind === 'compressor' || plan.exhaust) ? plan : null;
  }
  return kind === 'compressor' ? doc.plans[0] : (doc.plans.find((p) => p.exhaust) ?? null);
}

/** A plan id not yet used in the study. */
function freshPlanId(doc: StudyDocument, base: string): string {
  const used = new Set(doc.plans.map((p) => p.id));
  const stem = base.replace(/[^A-Za-z0-9-]+/g, '-').slice(0, 40) || 'plan';
  for (let i = 1; ; i++) {
    const id = `${stem}-${i}`;
    if (!used.has(id)) return id;
  }
}

/**
 * The study with a candidate compressor added as a new plan, or why it cannot be: a study holds at
 * most ten plans. The new plan copies the template plan's turbochargers and compressor efficiency.
 */
export function withCandidatePlan(
  doc: StudyDocument,
  candidate: { mapId: string; mapName: string },
  templateId?: string,
): { ok: true; document: StudyDocument; planId: string } | { ok: false; message: string } {
  if (doc.plans.length >= MAX_PLANS) return { ok: false, message: `A study holds at most ${MAX_PLANS} plans; remove one before adding ${candidate.mapName}.` };
  const template = templatePlan(doc, 'compressor', templateId) ?? doc.plans[0];
  const id = freshPlanId(doc, `candidate-${candidate.mapId}`);
  const plan = compressorCandidatePlan(template, candidate.mapId, candidate.mapName.slice(0, 80), id);
  return { ok: true, document: { ...doc, plans: [...doc.plans, plan] }, planId: id };
}
