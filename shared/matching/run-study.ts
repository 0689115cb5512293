/**
 * The whole study: every Plan × Scenario × boost schedule row is one operating line, solved
 * point by point over the engine's rpm list. Pure and quick enough to rerun on every keystroke.
 */
import type { z } from 'zod';
import { efficiencyFromBsfc, fuelProperties } from '../physics';
import { STANDARD_REFERENCE, studyInputSchema } from '../schemas/compute';
import { chargeGasOf, resolveAmbient } from './ambient';
import type { CompressorModel } from './compressor-model';
import { finishExhaustLine, lineExhaustContext, solveExhaustPoint } from './exhaust';
import type { TurbineModel } from './exhaust-model';
import { pointWorking } from './explain-point';
import { unsolvableFinding, worstSeverity } from './findings';
import { rpmPointsOf, valueAtRpm } from './rpm-table';
import { clearUnreachableResults } from './reach';
import { resolveRequirements } from './requirements';
import { lineProblems, solvePoint } from './run-point';
import type { LineContext, OperatingLine, OperatingPoint, PlanInput, StudyInput, StudyResult, ValueAtRpm } from './types';
import { issuePath } from '../schemas/issue-path';

export interface RunStudyOptions {
  /** The compressor model of each Plan, by Plan index (supplied at call time, never stored in the study). */
  compressorModels?: ReadonlyArray<CompressorModel | null | undefined>;
  /**
   * The turbine model of each Plan, by Plan index (supplied at call time, like the compressor's).
   * Used only by Plans with an exhaust block; such a Plan without one gets a finding instead.
   */
  turbineModels?: ReadonlyArray<TurbineModel | null | undefined>;
  /** Check the input against the study schema first (default true); a failure throws StudyInputError. */
  validate?: boolean;
  /** "lazy" (default): build a point's Working with pointWorking() when it is shown; "eager": attach it to every point. */
  working?: 'lazy' | 'eager';
}

/** Refused study input: every issue with its dotted field path. */
export class StudyInputError extends Error {
  constructor(readonly issues: { path: string; message: string }[]) {
    super(`Invalid study input: ${issues[0]?.path}: ${issues[0]?.message}`);
    this.name = 'StudyInputError';
  }
}

function issuesOf(error: z.ZodError): { path: string; message: string }[] {
  return error.issues.map((i) => ({ path: issuePath(i.path, '(study)'), message: i.message }));
}

/** Parses a study input with the study schema, or throws StudyInputError naming each bad field. */
export function parseStudyInput(input: unknown): StudyInput {
  const result = studyInputSchema.safeParse(input);
  if (!result.success) throw new StudyInputError(issuesOf(result.error));
  return result.data;
}

/** The line context of one Plan × Scenario × boost row. */
export function lineContext(
  study: StudyInput,
  planIndex: number,
  scenarioIndex: number,
  rowIndex: number,
  model: CompressorModel | null,
  turbineModel: TurbineModel | null = null,
): LineContext {
  const plan: PlanInput = study.plans[planIndex];
  const scenario = study.scenarios[scenarioIndex];
  const row = scenario.boostSchedule[rowIndex];
  const fuel = { choice: study.fuelSystem.fuel, properties: fuelProperties(study.fuelSystem.fuel) };
  const power = study.power;
  const reference = model ? model.reference : (plan.mapReference ?? STANDARD_REFERENCE);
  const ambient = resolveAmbient(scenario.ambient);
  return {
    engine: {
      displacement: study.engine.displacement,
      cylinders: study.engine.cylinders,
      strokes: study.engine.strokes,
      limits: study.engine.limits ?? {},
      trappingEfficiency: study.engine.strokes === 2 ? (study.engine.trappingEfficiency ?? 1) : 1,
    },
    tables: { volumetricEfficiency: study.engine.volumetricEfficiency, boost: row.boost, lambda: study.fuelSystem.lambda },
    fuel,
    injectors: study.fuelSystem.injectors,
    pumpFlowAvailable: study.fuelSystem.pumpFlowAvailable ?? null,
    power:
      power.basis === 'bsfc'
        ? {
            basis: 'bsfc',
            brakeThermalEfficiency: efficiencyFromBsfc(power.bsfc, fuel.properties.lowerHeatingValue),
            bsfc: power.bsfc,
            drivetrainLoss: power.drivetrainLoss,
          }
        : { basis: 'brake-thermal-efficiency', brakeThermalEfficiency: power.brakeThermalEfficiency, bsfc: null, drivetrainLoss: power.drivetrainLoss },
    losses: { inlet: study.losses.inlet, chargeCooler: study.losses.chargeCooler, inletTemperatureRise: study.losses.inletTemperatureRise ?? 0 },
    intercooler: study.intercooler,
    ambient,
    air: chargeGasOf(ambient),
    plan,
    reference: { temperature: reference.temperature, pressure: reference.pressure },
    referenceFrom: model ? 'map' : plan.mapReference ? 'plan' : 'standard',
    hasMap: model !== null,
    requirements: resolveRequirements(study.requirements),
    exhaust: lineExhaustContext(plan, turbineModel),
  };
}

/** Runs a whole study. Returns one operating line per Plan × Scenario × boost row, in that nesting order. */
export function runStudy(input: StudyInput, options: RunStudyOptions = {}): StudyResult {
  const study = options.validate === false ? input : parseStudyInput(input);
  const rpms = rpmPointsOf(study.engine.rpm);
  // Tables shared by every line are read once per rpm.
  const veAt = rpms.map((n) => valueAtRpm(study.engine.volumetricEfficiency, n));
  const lambdaAt = rpms.map((n) => valueAtRpm(study.fuelSystem.lambda, n));
  const lines: OperatingLine[] = [];
  study.plans.forEach((plan, planIndex) => {
    const model = options.compressorModels?.[planIndex] ?? null;
    const turbineModel = plan.exhaust ? (options.turbineModels?.[planIndex] ?? null) : null;
    study.scenarios.forEach((scenario, scenarioIndex) => {
      scenario.boostSchedule.forEach((row, rowIndex) => {
        const ctx = lineContext(study, planIndex, scenarioIndex, rowIndex, model, turbineModel);
        const problems = lineProblems(ctx);
        let heldBefore = false;
        let previousHeld: ValueAtRpm[] = [];
        const points: OperatingPoint[] = rpms.map((rpm, i) => {
          if (problems.length > 0) return { solved: false, rpm, values: null, findings: problems.map((p) => unsolvableFinding(rpm, p)) };
          const op = { rpm, volumetricEfficiency: veAt[i], boost: valueAtRpm(row.boost, rpm), lambda: lambdaAt[i] };
          const point = solvePoint(ctx, model, op, { firstOfLine: i === 0, lineChecked: true });
          if (!ctx.exhaust) return clearUnreachableResults(point);
          const withExhaust = solveExhaustPoint(ctx, model, turbineModel, op, point, { firstOfLine: i === 0, heldBefore, previousHeld });
          if (withExhaust.values?.targetHeld === true) heldBefore = true;
          previousHeld = withExhaust.values?.targetHeld === false ? [...previousHeld.slice(-1), { value: withExhaust.values.boost, rpm }] : [];
          return clearUnreachableResults(withExhaust);
        });
        const exhaust = ctx.exhaust ? finishExhaustLine(ctx, points) : null;
        if (options.working === 'eager') for (const p of points) p.working = pointWorking(ctx, p);
        const worst = worstSeverity(points.flatMap((p) => p.findings));
        lines.push({
          planIndex,
          planName: plan.name,
          scenarioIndex,
          scenarioName: scenario.name,
          rowIndex,
          rowLabel: row.label,
          rowKind: row.kind,
          gear: row.gear ?? null,
          context: ctx,
          points,
          worstSeverity: worst,
          exhaust,
        });
      });
    });
  });
  return { lines };
}
