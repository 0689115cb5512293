/**
 * The whole input a study runs on, SI throughout: what runStudy takes once this schema has
 * checked it. Every object is strict: an unknown key is refused by name, so a misspelt field never
 * passes silently.
 */
import { z } from 'zod';
import { fuelProperties } from '#shared/physics';
import { ambientPressureOf, manifoldPressureIssue } from './ambient';
import { studyEngineSchema } from './engine';
import { fmtKpa, isNum } from './fields';
import { fuelSystemSchema } from './fuel-system';
import { intercoolerSchema } from './intercooler';
import { lossesSchema } from './losses';
import { planSchema } from './plan';
import { powerSchema } from './power';
import { requirementsSchema } from './requirements';
import { rpmPointCount } from './rpm';
import { scenarioSchema } from './scenario';

const MAX_SCENARIOS = 20;
const MAX_PLANS = 10;
/** Most points of a whole study (plans × boost rows × rpm points). */
const MAX_STUDY_POINTS = 50_000;

export const studyInputSchema = z
  .strictObject({
    engine: studyEngineSchema,
    fuelSystem: fuelSystemSchema,
    power: powerSchema,
    losses: lossesSchema,
    intercooler: intercoolerSchema,
    scenarios: z.array(scenarioSchema).min(1, 'a study needs at least one scenario').max(MAX_SCENARIOS, `at most ${MAX_SCENARIOS} scenarios`),
    plans: z.array(planSchema).min(1, 'a study needs at least one plan').max(MAX_PLANS, `at most ${MAX_PLANS} plans`),
    /** The study's required margins and limits; absent fields take the defaults. */
    requirements: requirementsSchema.optional(),
  })
  .superRefine((study, ctx) => {
    const seen = (list: { name: string }[], key: 'scenarios' | 'plans', what: string) => {
      const names = new Set<string>();
      list.forEach((item, i) => {
        if (names.has(item.name)) ctx.addIssue({ code: 'custom', path: [key, i, 'name'], message: `two ${what} are both named "${item.name}"` });
        names.add(item.name);
      });
    };
    seen(study.scenarios, 'scenarios', 'scenarios');
    seen(study.plans, 'plans', 'plans');
    const inlet = study.losses.inlet.pressureLoss;
    study.scenarios.forEach((s, si) => {
      const pAmb = ambientPressureOf(s.ambient);
      if (pAmb === null) return;
      if (isNum(inlet) && pAmb - inlet <= 0)
        ctx.addIssue({
          code: 'custom',
          path: ['losses', 'inlet', 'pressureLoss'],
          message: `inlet loss leaves no pressure at the compressor inlet in scenario "${s.name}" (ambient ${fmtKpa(pAmb)})`,
        });
      s.boostSchedule.forEach((row, ri) =>
        row.boost.forEach((r, k) => {
          if (!isNum(r.value)) return;
          const issue = manifoldPressureIssue(pAmb, r.value);
          if (issue) ctx.addIssue({ code: 'custom', path: ['scenarios', si, 'boostSchedule', ri, 'boost', k, 'value'], message: issue });
        }),
      );
    });
    if (study.power.basis === 'bsfc' && isNum(study.power.bsfc)) {
      const eta = 1 / (study.power.bsfc * fuelProperties(study.fuelSystem.fuel).lowerHeatingValue);
      if (!(eta <= 1))
        ctx.addIssue({ code: 'custom', path: ['power', 'bsfc'], message: 'bsfc is below what burning this fuel allows (brake thermal efficiency over 1)' });
    }
    const rows = study.scenarios.reduce((n, s) => n + s.boostSchedule.length, 0);
    const total = rows * study.plans.length * rpmPointCount(study.engine.rpm);
    if (total > MAX_STUDY_POINTS)
      ctx.addIssue({
        code: 'custom',
        path: ['engine', 'rpm'],
        message: `the study would compute ${total} points; at most ${MAX_STUDY_POINTS} (fewer rpm points, rows or plans)`,
      });
  });

/** The study input the engine runs: the study schema's output, so the two cannot drift apart. */
export type StudyInput = z.output<typeof studyInputSchema>;
