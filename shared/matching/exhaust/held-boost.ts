/**
 * Case 2 of the power balance: the target is not held, and the boost the shut-gate turbine can hold
 * is searched for, re-solving the whole compressor side at each trial boost so that every value of
 * the point belongs to that boost.
 */
import { findRoot } from '#shared/math/root';
import type { CompressorModel } from '../compressor/model';
import { solvePoint, type PointOperation } from '../compressor/solve-point';
import { finding, type Finding } from '../finding';
import { lineInputFindings, pointFindings } from '../findings';
import type { LineContext } from '../line-context';
import type { OperatingPoint, PointValues, SolvedPoint } from '../result';
import { shutGate } from './expansion';
import { exhaustNotConvergedFinding } from './findings';
import { exhaustGasOf } from './gas';
import type { TurbineModel } from './model';
import type { LineExhaustContext, ValueAtRpm } from './result';
import { solvedPower } from './values';

/** The boost a turbine holds is found to within this, Pa (a hundredth of a kPa). */
const HELD_BOOST_TOLERANCE = 10;
/** …and at a held boost (each trial re-solves the whole point, so it stops a little sooner). */
const HELD_BALANCE_TOLERANCE = 1e-5;
/** A held boost whose balance is off by more than this share of P_c carries a finding (design: ten times what a 10 Pa bracket allows). */
const HELD_BALANCE_WARNING = 1e-3;
/**
 * Passes of the compressor's manifold-temperature fixed point in a trial of the held-boost search.
 * A trial at a map edge may not settle; the point is re-solved in full at the answer.
 */
const TRIAL_PASSES = 12;
/** Trials of the held-boost search kept for reuse as the answer. */
const KEPT_TRIALS = 3;

/** The held boost predicted from the previous speeds' (straight on from two, the same as one), Pa gauge. */
function predictHeldBoost(rpm: number, previous: readonly ValueAtRpm[] | undefined): number | null {
  if (!previous || previous.length === 0) return null;
  const last = previous[previous.length - 1];
  if (previous.length === 1) return last.value;
  const before = previous[previous.length - 2];
  if (!(last.rpm > before.rpm)) return last.value;
  return last.value + ((last.value - before.value) * (rpm - last.rpm)) / (last.rpm - before.rpm);
}

/**
 * The point re-solved at the boost the shut-gate turbine holds, and the root finder's iterations.
 * `v` is the point at its target and `targetBalance` η_m·P_t − P_c there (negative: the turbine falls
 * short). A search that does not converge adds its finding to `extra`; the point is unsolved when
 * no physical state exists at the boost found.
 */
export function solveHeldBoost(
  ctx: LineContext,
  compressorModel: CompressorModel | null,
  turbine: TurbineModel,
  ex: LineExhaustContext,
  op: PointOperation,
  v: PointValues,
  targetBalance: number,
  options: { firstOfLine?: boolean; previousHeld?: readonly ValueAtRpm[] },
  extra: Finding[],
): { point: OperatingPoint; iterations: number } {
  const etaM = ex.mechanicalEfficiency;
  const compressorPower = solvedPower(v);
  const target = op.boost;
  const p1 = v.compressorInletPressure;
  // At this boost p2 = p1: pressure ratio 1, no compressor power, so the turbine has power to spare.
  // (Losses that follow the flow are smaller at the lower flow there, which keeps p2 at or below p1.)
  let low = p1 - (v.chargeCoolerLoss ?? ctx.losses.chargeCooler.pressureLoss) - v.ambientPressure;
  if (!(v.ambientPressure + low > 0)) low = 0.5 * p1 - v.ambientPressure;
  // Each trial starts the compressor's fixed point from the last one's efficiency, and the last
  // few trials are kept: Brent's answer is always a boost it has tried.
  let startEfficiency = v.compressorEfficiency ?? undefined;
  const kept: SolvedPoint[] = [];
  const spare = (boost: number): number => {
    const trial = solvePoint(ctx, compressorModel, { ...op, boost }, { lineChecked: true, findings: false, startEfficiency, maxPasses: TRIAL_PASSES });
    if (!trial.solved) return Number.NaN;
    if (kept.length === KEPT_TRIALS) kept.shift();
    kept.push(trial);
    startEfficiency = trial.values.compressorEfficiency ?? undefined;
    const s = shutGate(turbine, exhaustGasOf(trial.values, ctx, ex, turbine));
    return etaM * s.value.power - solvedPower(trial.values);
  };
  let a = low;
  let b = target;
  let fa: number | undefined;
  let fb = targetBalance;
  // The held boosts of the line's previous speeds predict this one's: trying the prediction first
  // narrows the bracket, which otherwise runs from pressure ratio 1 to the target.
  const guess = predictHeldBoost(op.rpm, options.previousHeld);
  if (guess !== null && guess > low && guess < target) {
    const fGuess = spare(guess);
    if (fGuess >= 0) [a, fa] = [guess, fGuess];
    else if (fGuess < 0) [b, fb] = [guess, fGuess];
  }
  // Done when the power balance holds to 1e-5 of the compressor's power, or the bracket is 10 Pa wide.
  const root = findRoot(spare, a, b, {
    fa,
    fb,
    absoluteTolerance: HELD_BOOST_TOLERANCE,
    relativeTolerance: 0,
    functionTolerance: HELD_BALANCE_TOLERANCE * compressorPower,
    maxIterations: 60,
  });
  let boost: number;
  if (root.ok) {
    boost = root.x;
  } else {
    boost = root.bracket ? (root.bracket.fa >= 0 ? root.bracket.a : root.bracket.fb >= 0 ? root.bracket.b : low) : low;
    extra.push(exhaustNotConvergedFinding(op.rpm, 'The boost the turbine holds', root.reason));
  }
  const hit = kept.find((t) => t.values.boost === boost && t.values.converged);
  const final: OperatingPoint = hit
    ? {
        solved: true,
        rpm: op.rpm,
        values: hit.values,
        findings: options.firstOfLine ? [...lineInputFindings(ctx, op.rpm), ...pointFindings(hit.values, ctx)] : pointFindings(hit.values, ctx),
      }
    : solvePoint(ctx, compressorModel, { ...op, boost }, { lineChecked: true, firstOfLine: options.firstOfLine, startEfficiency });
  return { point: final, iterations: root.iterations };
}

/**
 * At a compressor-map edge the compressor's own state may not settle (its efficiency jumps between
 * the map and the Plan's figure), and then no boost balances exactly: the finding that says how
 * close the balance is at the held boost, or null when it holds. `drivePower` is η_m·P_t there, W.
 */
export function heldBalanceFinding(v: PointValues, drivePower: number, rpm: number): Finding | null {
  const mismatch = (drivePower - solvedPower(v)) / Math.max(solvedPower(v), drivePower, 1);
  if (Math.abs(mismatch) <= HELD_BALANCE_WARNING) return null;
  return finding(
    'exhaust-not-converged',
    'warning',
    `At the held boost the turbine's power and the compressor's differ by ${(mismatch * 100).toFixed(1)} %: ${v.converged ? 'the balance jumps here' : "the compressor's state does not settle at this boost"} (a compressor-map edge), so the held boost is approximate.`,
    rpm,
    { value: mismatch, threshold: HELD_BALANCE_WARNING, kind: 'fraction' },
  );
}
