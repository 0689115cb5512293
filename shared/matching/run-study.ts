/**
 * The whole study: every Plan × Scenario × boost schedule row is one operating line, solved
 * point by point over the engine's rpm list. Pure and quick enough to rerun on every keystroke.
 */
import type { CompressorModel } from './compressor/model';
import { clearUnreachableResults } from './compressor/reach';
import { solvePoint } from './compressor/solve-point';
import { finishExhaustLine } from './exhaust/line';
import type { TurbineModel } from './exhaust/model';
import type { ValueAtRpm } from './exhaust/result';
import { solveExhaustPoint } from './exhaust/solve-point';
import { pointWorking } from './explain-point';
import { unsolvableFinding, worstSeverity } from './finding';
import type { StudyInput } from './input/study';
import { lineContext } from './line-context';
import { lineProblems } from './line-problems';
import type { OperatingLine, OperatingPoint, StudyResult } from './result';
import { rpmPointsOf, valueAtRpm } from './rpm-table';

export interface RunStudyOptions {
  /** The compressor model of each Plan, by Plan index (supplied at call time, never stored in the study). */
  compressorModels?: ReadonlyArray<CompressorModel | null | undefined>;
  /**
   * The turbine model of each Plan, by Plan index (supplied at call time, like the compressor's).
   * Used only by Plans with an exhaust block; such a Plan without one gets a finding instead.
   */
  turbineModels?: ReadonlyArray<TurbineModel | null | undefined>;
  /** "lazy" (default): build a point's Working with pointWorking() when it is shown; "eager": attach it to every point. */
  working?: 'lazy' | 'eager';
}

/**
 * Runs a whole study. Returns one operating line per Plan × Scenario × boost row, in that nesting
 * order. The input must have passed the study schema (parseStudyInput, or a parsed study
 * document): the engine checks no more than a line's physical state.
 */
export function runStudy(study: StudyInput, options: RunStudyOptions = {}): StudyResult {
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
