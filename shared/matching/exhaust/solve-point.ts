/**
 * The exhaust side of an operating point: the quasi-steady power balance of physics note §5.
 *
 * Per point, after the compressor side is solved at the boost target:
 *  1. gates shut: all exhaust through the turbine; the expansion ratio at which the turbine
 *     swallows it, ṁ_t(ER) = FP(ER)·ER·p4/√T3 = ṁ_ex;
 *  2. if η_m·P_t at that ratio is below the compressor's power, the target cannot be held: find
 *     the boost at which the shut-gate turbine just drives the compressor, re-solving the whole
 *     compressor side at each trial boost so that every value of the point belongs to that boost;
 *  3. otherwise the gates open: the smaller ER at which η_m·P_t = P_c; the rest of the exhaust goes
 *     through the gates, and each gate's valve must be large enough to pass its share.
 * A point that needs no compressor power (throttled) takes its gates wide open.
 *
 * Roots are found by Brent's method on brackets that hold a sign change by construction; a root
 * not found is a finding, and the point keeps the safe end of the last bracket.
 */
import type { CompressorModel } from '../compressor/model';
import type { PointOperation } from '../compressor/solve-point';
import { finding, type Finding } from '../finding';
import type { LineContext } from '../line-context';
import type { OperatingPoint, PointValues, SolvedPoint } from '../result';
import { exhaustUsable } from './context';
import { gateOpen, gatesWideOpen, shutGate } from './expansion';
import { exhaustLineFindings, exhaustNotConvergedFinding, exhaustPointFindings } from './findings';
import { exhaustGasOf } from './gas';
import { heldBalanceFinding, solveHeldBoost } from './held-boost';
import type { TurbineModel } from './model';
import type { ValueAtRpm } from './result';
import type { TurbineState } from './turbine-state';
import { clearExhaust, exhaustFinite, solvedPower, writeExhaust } from './values';

export interface ExhaustPointOptions {
  firstOfLine?: boolean;
  /** An earlier engine speed of the line held the boost target. */
  heldBefore?: boolean;
  /**
   * The boosts the turbine held at the line's previous one or two engine speeds, where it could not
   * hold the target there, oldest first: they predict this speed's, a first guess.
   */
  previousHeld?: readonly ValueAtRpm[];
}

/**
 * Adds the exhaust side to a point solved at its boost target. Returns the point itself when the
 * Plan has no exhaust side; otherwise a point whose values all belong to the boost actually held.
 */
export function solveExhaustPoint(
  ctx: LineContext,
  compressorModel: CompressorModel | null,
  turbine: TurbineModel | null,
  op: PointOperation,
  atTarget: OperatingPoint,
  options: ExhaustPointOptions = {},
): OperatingPoint {
  const ex = ctx.exhaust;
  if (!ex) return atTarget;
  const lineFindings = options.firstOfLine ? exhaustLineFindings(ctx, op.rpm) : [];
  if (!atTarget.solved || !turbine || !ex.turbine || !exhaustUsable(ex)) {
    if (lineFindings.length > 0) atTarget.findings.push(...lineFindings);
    return atTarget;
  }
  const etaM = ex.mechanicalEfficiency;
  const divisor = ex.turbine.mapFlowParameterDivisor > 0 ? ex.turbine.mapFlowParameterDivisor : 1;
  const extra: Finding[] = [];

  let point: SolvedPoint = atTarget;
  let v = point.values;
  let g = exhaustGasOf(v, ctx, ex, turbine);
  let shut = shutGate(turbine, g);
  if (!shut.ok) extra.push(exhaustNotConvergedFinding(op.rpm, 'The expansion ratio with the gates shut', shut.reason));
  const compressorPower = solvedPower(v);
  let at: TurbineState;
  let kind: NonNullable<PointValues['exhaustCase']>;
  let held = true;
  let boostIterations = 0;

  if (!(compressorPower > 0)) {
    kind = 'no-power-needed';
    const open = gatesWideOpen(g, ex, shut.value);
    if (!open.ok) extra.push(exhaustNotConvergedFinding(op.rpm, 'The flow split between turbine and open gates', open.reason));
    at = open.value;
  } else if (etaM * shut.value.power >= compressorPower) {
    kind = 'gate-open';
    const open = gateOpen(g, compressorPower / etaM, shut.value);
    if (!open.ok) extra.push(exhaustNotConvergedFinding(op.rpm, 'The expansion ratio with the gates open', open.reason));
    at = open.value;
  } else {
    // Case 2: find the boost at which the shut-gate turbine just drives the compressor.
    kind = 'target-not-held';
    held = false;
    const target = op.boost;
    const found = solveHeldBoost(ctx, compressorModel, turbine, ex, op, v, etaM * shut.value.power - compressorPower, options, extra);
    boostIterations = found.iterations;
    const final = found.point;
    if (!final.solved) {
      atTarget.findings.push(
        ...lineFindings,
        ...extra,
        exhaustNotConvergedFinding(op.rpm, 'The boost the turbine holds', final.findings[0]?.message ?? 'no physical state'),
      );
      return atTarget;
    }
    point = final;
    v = point.values;
    v.boostTarget = target;
    g = exhaustGasOf(v, ctx, ex, turbine);
    shut = shutGate(turbine, g);
    at = shut.value;
    const balance = heldBalanceFinding(v, etaM * at.power, op.rpm);
    if (balance) extra.push(balance);
  }

  writeExhaust(v, ex, divisor, g, shut.value, at, kind, held);
  v.boostIterations = boostIterations;
  if (!exhaustFinite(v)) {
    clearExhaust(v);
    point.findings.push(
      ...lineFindings,
      ...extra,
      finding('exhaust-not-converged', 'warning', 'The exhaust side gives no finite numbers at this point; it is left out.', op.rpm),
    );
    return point;
  }
  const exhaustFindings = exhaustPointFindings(v, options.heldBefore === true, at.efficiencyAssumed || shut.value.efficiencyAssumed);
  // A point the compressor cannot deliver has no exhaust results either (they are cleared with the
  // rest); whether the turbine would hold the target is still worth saying.
  const kept = v.reachable === false ? exhaustFindings.filter((f) => f.code === 'boost-target-not-held') : exhaustFindings;
  point.findings.push(...lineFindings, ...extra, ...kept);
  return point;
}
