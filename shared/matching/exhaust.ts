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
import { findRoot } from '../math/root';
import { exhaustGasAt } from '../physics/exhaust-gas';
import { scaledPressureLoss } from '../physics/losses';
import { TURBINE_GAS, isentropicExpansionShare, type GasProperties } from '../physics/turbine';
import { orificeMassFlux, valveArea, wastegateDiameterFor } from '../physics/wastegate';
import type { CompressorModel } from './compressor-model';
import { exhaustFinding, exhaustNotConvergedFinding, exhaustPointFindings } from './exhaust-findings';
import { lineInputFindings, pointFindings } from './findings';
import type { TurbineAtSpeed, TurbineLocation, TurbineModel } from './exhaust-model';
import { valueAtRpm } from './rpm-table';
import { solvePoint, type PointOperation } from './run-point';
import type { ExhaustLineSummary, Finding, LineContext, LineExhaustContext, OperatingPoint, PlanInput, PointValues, SolvedPoint, ValueAtRpm } from './types';
import { fmt } from './working';

/** Turbine efficiency assumed where the map gives none, fraction (from memory: small radial turbines run about 0.6–0.75). */
export const DEFAULT_TURBINE_EFFICIENCY = 0.65;
/** Pulse-energy factor when none is set: the steady model as it is. */
export const DEFAULT_PULSE_FACTOR = 1;
/** The boost a turbine holds is found to within this, Pa (a hundredth of a kPa). */
export const HELD_BOOST_TOLERANCE = 10;
/** The power balance η_m·P_t = P_c with the gates open holds to this share of P_c. */
export const POWER_BALANCE_TOLERANCE = 1e-6;
/** …and at a held boost (each trial re-solves the whole point, so it stops a little sooner). */
export const HELD_BALANCE_TOLERANCE = 1e-5;
/** A held boost whose balance is off by more than this share of P_c carries a finding (design: ten times what a 10 Pa bracket allows). */
export const HELD_BALANCE_WARNING = 1e-3;
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
/** Expansion ratios are found to within this share. */
const RATIO_TOLERANCE = 1e-12;
/** No turbine is searched beyond this expansion ratio (a guard, far beyond any real one). */
const MAX_EXPANSION_RATIO = 1000;

/** The exhaust context of a Plan's lines, or null when the Plan has no exhaust block. */
export function lineExhaustContext(plan: PlanInput, turbine: TurbineModel | null): LineExhaustContext | null {
  const input = plan.exhaust;
  if (!input) return null;
  const efficiencyKind = turbine?.efficiencyKind ?? null;
  return {
    input: {
      ...input,
      pulseFactor: input.pulseFactor ?? DEFAULT_PULSE_FACTOR,
      turbineEfficiency: input.turbineEfficiency ?? DEFAULT_TURBINE_EFFICIENCY,
    },
    // A map whose efficiency counts the bearings' losses already holds the mechanical efficiency: applied once.
    mechanicalEfficiency: efficiencyKind === 'with-bearing-losses' ? 1 : input.mechanicalEfficiency,
    turbine: turbine
      ? {
          name: turbine.name,
          housing: turbine.housing,
          scrollFeed: turbine.scrollFeed,
          areaRatio: turbine.areaRatio,
          efficiencyKind,
          speedLines: [...(turbine.speedLines ?? [])],
          expansionRatioRange: [turbine.expansionRatioRange[0], turbine.expansionRatioRange[1]],
          mapFlowParameterDivisor: turbine.mapFlowParameterDivisor,
          capacityRule: turbine.capacityRule,
        }
      : null,
  };
}

const positive = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;

/** Reasons the exhaust inputs give no physical state (only reachable when validation is skipped). */
export function exhaustProblems(ex: LineExhaustContext): string[] {
  const i = ex.input;
  const out: string[] = [];
  if (!(positive(i.mechanicalEfficiency) && i.mechanicalEfficiency <= 1)) out.push('mechanical efficiency is not between 0 and 1');
  const ds = i.downstreamLoss;
  if (!(ds && ds.pressureLoss >= 0 && Number.isFinite(ds.pressureLoss))) out.push('the loss after the turbine is negative');
  else if ((ds.referenceMassFlow !== undefined && !positive(ds.referenceMassFlow)) || (ds.referenceDensity !== undefined && !positive(ds.referenceDensity)))
    out.push('the loss after the turbine has a reference flow or density that is not positive');
  if (!positive(i.pulseFactor)) out.push('the pulse factor is not positive');
  if (!(positive(i.turbineEfficiency) && i.turbineEfficiency <= 1)) out.push('the assumed turbine efficiency is not between 0 and 1');
  const g = i.wastegates;
  if (!(g && (g.count === 1 || g.count === 2))) out.push('the gate count is not 1 or 2');
  else {
    if (!positive(g.valveDiameter)) out.push('the gate valve diameter is not positive');
    if (!(positive(g.dischargeCoefficient) && g.dischargeCoefficient <= 1)) out.push('the gate discharge coefficient is not between 0 and 1');
  }
  if (
    !Array.isArray(i.turbineInletTemperature) ||
    i.turbineInletTemperature.length === 0 ||
    !i.turbineInletTemperature.every((r) => positive(r.value) && Number.isFinite(r.rpm))
  )
    out.push('the turbine inlet temperature table is empty or not positive');
  return out;
}

const usable = new WeakMap<LineExhaustContext, boolean>();
/** exhaustProblems is empty: checked once per line context, not at every point. */
function exhaustUsable(ex: LineExhaustContext): boolean {
  let ok = usable.get(ex);
  if (ok === undefined) {
    ok = exhaustProblems(ex).length === 0;
    usable.set(ex, ok);
  }
  return ok;
}

/** What the exhaust side reads: the map at the shaft speed, or the mean of its lines. */
type TurbineReader = Pick<TurbineModel, 'read' | 'expansionRatioForFlow'>;

/** A turbine reading with anything non-finite or impossible made safe: no flow at ER ≤ 1, efficiency null when not in (0, 1]. */
function readTurbine(turbine: TurbineReader, expansionRatio: number): { flowParameter: number; efficiency: number | null; location: TurbineLocation } {
  if (!(expansionRatio > 1)) return { flowParameter: 0, efficiency: null, location: 'below-map' };
  const r = turbine.read(expansionRatio);
  const flowParameter = typeof r.flowParameter === 'number' && Number.isFinite(r.flowParameter) && r.flowParameter > 0 ? r.flowParameter : 0;
  const efficiency = typeof r.efficiency === 'number' && Number.isFinite(r.efficiency) && r.efficiency > 0 && r.efficiency <= 1 ? r.efficiency : null;
  const location: TurbineLocation = r.location === 'inside' || r.location === 'below-map' || r.location === 'above-map' ? r.location : 'above-map';
  return { flowParameter, efficiency, location };
}

/** The turbine's state at one expansion ratio for one point's gas. */
interface TurbineState {
  expansionRatio: number;
  flowParameter: number;
  efficiency: number;
  efficiencyAssumed: boolean;
  location: TurbineLocation;
  /** Mass flow the wheel swallows at this ratio, kg/s. */
  massFlow: number;
  /** Turbine power, W (pulse factor included). */
  power: number;
}

/** The gas conditions of one point that the turbine and gates see. */
interface ExhaustGas {
  /** Exhaust mass flow of one turbocharger, kg/s. */
  flow: number;
  /** Turbine inlet temperature, K. */
  t3: number;
  /** The exhaust gas's cp, γ and R at T3. */
  gas: GasProperties;
  /** Loss after the turbine at this flow, Pa. */
  downstreamLoss: number;
  /** Turbine outlet pressure, Pa. */
  p4: number;
  /** The turbine map as this point reads it: at its shaft speed, or the mean of its lines. */
  reader: TurbineReader;
  /** The map at the shaft speed, when one is known and the map's lines carry speeds. */
  atSpeed: TurbineAtSpeed | null;
  /** p4/√T3, Pa/K^0.5: ṁ_t = FP·ER·this. */
  swallow: number;
  pulse: number;
  fallbackEfficiency: number;
}

function stateAt(g: ExhaustGas, expansionRatio: number): TurbineState {
  const r = readTurbine(g.reader, expansionRatio);
  const efficiency = r.efficiency ?? g.fallbackEfficiency;
  const massFlow = r.flowParameter * expansionRatio * g.swallow;
  return {
    expansionRatio,
    flowParameter: r.flowParameter,
    efficiency,
    efficiencyAssumed: r.efficiency === null,
    location: r.location,
    massFlow,
    power: g.pulse * massFlow * g.gas.cp * g.t3 * efficiency * isentropicExpansionShare(expansionRatio, g.gas.gamma),
  };
}

/** Turbine power at one expansion ratio, W, without building a state (the root finder's inner loop). */
function powerAt(g: ExhaustGas, expansionRatio: number): number {
  if (!(expansionRatio > 1)) return 0;
  const r = g.reader.read(expansionRatio);
  const fp = typeof r.flowParameter === 'number' && Number.isFinite(r.flowParameter) && r.flowParameter > 0 ? r.flowParameter : 0;
  const eta = typeof r.efficiency === 'number' && Number.isFinite(r.efficiency) && r.efficiency > 0 && r.efficiency <= 1 ? r.efficiency : g.fallbackEfficiency;
  return g.pulse * fp * expansionRatio * g.swallow * g.gas.cp * g.t3 * eta * isentropicExpansionShare(expansionRatio, g.gas.gamma);
}

type Solved<T> = { ok: true; value: T; iterations: number } | { ok: false; value: T; reason: string };

/** The state with all the exhaust through the wheel: its flow taken as exactly the exhaust flow. */
function allThroughWheel(g: ExhaustGas, er: number): TurbineState {
  const state = stateAt(g, er);
  state.massFlow = g.flow;
  state.power = g.pulse * g.flow * g.gas.cp * g.t3 * state.efficiency * isentropicExpansionShare(er, g.gas.gamma);
  return state;
}

/** Case 1: the expansion ratio at which the turbine swallows all the exhaust. */
function shutGate(turbine: TurbineModel, g: ExhaustGas): Solved<TurbineState> {
  if (g.reader.expansionRatioForFlow) {
    // The map's own inverse, checked against its reading.
    const er = g.reader.expansionRatioForFlow(g.flow / g.swallow);
    if (Number.isFinite(er) && er > 1) {
      const state = allThroughWheel(g, er);
      if (Math.abs(state.flowParameter * er * g.swallow - g.flow) <= 1e-9 * g.flow) return { ok: true, value: state, iterations: 0 };
    }
  }
  return shutGateByRoot(turbine, g);
}

function shutGateByRoot(turbine: TurbineModel, g: ExhaustGas): Solved<TurbineState> {
  const excess = (er: number) => readTurbine(g.reader, er).flowParameter * er * g.swallow - g.flow;
  let hi = Math.max(2, turbine.expansionRatioRange[1]);
  let fHi = excess(hi);
  while (fHi < 0 && hi < MAX_EXPANSION_RATIO) {
    hi = Math.min(MAX_EXPANSION_RATIO, hi * 2);
    fHi = excess(hi);
  }
  const root = findRoot(excess, 1, hi, { fa: -g.flow, fb: fHi, absoluteTolerance: RATIO_TOLERANCE, relativeTolerance: RATIO_TOLERANCE });
  const er = root.ok ? root.x : hi;
  const state = allThroughWheel(g, er);
  return root.ok ? { ok: true, value: state, iterations: root.iterations } : { ok: false, value: state, reason: root.reason };
}

/** Case 3: the smaller expansion ratio at which the turbine gives exactly the power needed (W). */
function gateOpen(g: ExhaustGas, powerNeeded: number, shut: TurbineState): Solved<TurbineState> {
  const balance = (er: number) => powerAt(g, er) - powerNeeded;
  const root = findRoot(balance, 1, shut.expansionRatio, {
    fa: -powerNeeded,
    fb: shut.power - powerNeeded,
    absoluteTolerance: RATIO_TOLERANCE,
    relativeTolerance: RATIO_TOLERANCE,
    functionTolerance: 1e-3 * POWER_BALANCE_TOLERANCE * powerNeeded,
  });
  if (root.ok) return { ok: true, value: stateAt(g, root.x), iterations: root.iterations };
  // The safe end holds at least the power needed.
  const end = root.bracket ? (root.bracket.fa >= 0 ? root.bracket.a : root.bracket.b) : shut.expansionRatio;
  return { ok: false, value: end === shut.expansionRatio ? shut : stateAt(g, end), reason: root.reason };
}

/** Gates wide open (no compressor power needed): the ratio at which turbine and fitted gates together pass the exhaust. */
function gatesWideOpen(g: ExhaustGas, ex: LineExhaustContext, shut: TurbineState): Solved<TurbineState> {
  const gates = ex.input.wastegates;
  const gateArea = gates.count * gates.dischargeCoefficient * valveArea(gates.valveDiameter);
  const split = (er: number) => stateAt(g, er).massFlow + gateArea * orificeMassFlux(er * g.p4, g.t3, g.p4, g.gas).massFlux - g.flow;
  const fShut = gateArea * orificeMassFlux(shut.expansionRatio * g.p4, g.t3, g.p4, g.gas).massFlux;
  const root = findRoot(split, 1, shut.expansionRatio, { fa: -g.flow, fb: fShut, absoluteTolerance: RATIO_TOLERANCE, relativeTolerance: RATIO_TOLERANCE });
  if (root.ok) return { ok: true, value: stateAt(g, root.x), iterations: root.iterations };
  return { ok: false, value: shut, reason: root.reason };
}

/**
 * Exhaust gases already worked out, by what sets them: the held-boost search asks again at one
 * speed's lambda and T3, and the lines of other plans and rows at the same speeds ask the same.
 * Bounded: emptied when full.
 */
const gasCache = new Map<string, GasProperties>();
const GAS_CACHE_SIZE = 4096;

/**
 * The exhaust gas of a point at T3: the products of the fuel burnt at the point's lambda, with the
 * humid air's water and a two-stroke's short-circuited air (physics/exhaust-gas.ts). Without a
 * fuel and lambda (no fuel system), the lean gas-turbine pair of TURBINE_GAS.
 */
function exhaustGasProperties(ctx: LineContext, lambda: number | null, t3: number): GasProperties {
  if (!ctx.fuel || lambda === null) return TURBINE_GAS;
  const fuel = ctx.fuel.choice;
  const key = `${fuel.kind}|${fuel.kind === 'ethanol-blend' ? fuel.ethanolPercent : ''}|${lambda}|${t3}|${ctx.air.humidityRatio}|${ctx.engine.trappingEfficiency}`;
  let gas = gasCache.get(key);
  if (!gas) {
    const products = exhaustGasAt({ fuel, lambda, temperature: t3, humidityRatio: ctx.air.humidityRatio, trappingEfficiency: ctx.engine.trappingEfficiency });
    gas = { cp: products.cp, gasConstant: products.gasConstant, gamma: products.gamma };
    if (gasCache.size >= GAS_CACHE_SIZE) gasCache.clear();
    gasCache.set(key, gas);
  }
  return gas;
}

/** The gas one turbocharger's turbine sees at a solved compressor point, and the map as it reads it there. */
function exhaustGasOf(v: PointValues, ctx: LineContext, ex: LineExhaustContext, turbine: TurbineModel): ExhaustGas {
  const turbochargers = ctx.plan.turbochargers;
  const t3 = valueAtRpm(ex.input.turbineInletTemperature, v.rpm);
  const gas = exhaustGasProperties(ctx, v.lambda, t3);
  const engineExhaustFlow = v.engineMassFlow + (v.fuelMassFlow ?? 0);
  // The gas after the turbine taken at ambient pressure and T3 (its cooling through the turbine is left out: docs/physics.md §8).
  const downstreamLoss = scaledPressureLoss(ex.input.downstreamLoss, engineExhaustFlow, v.ambientPressure / (gas.gasConstant * t3));
  const p4 = v.ambientPressure + downstreamLoss;
  const atSpeed = turbine.atSpeed && v.shaftSpeed !== null && v.shaftSpeed > 0 ? turbine.atSpeed(v.shaftSpeed) : null;
  return {
    flow: engineExhaustFlow / turbochargers,
    t3,
    gas,
    downstreamLoss,
    p4,
    reader: atSpeed ?? turbine,
    atSpeed,
    swallow: p4 / Math.sqrt(t3),
    pulse: ex.input.pulseFactor,
    fallbackEfficiency: ex.input.turbineEfficiency,
  };
}

const EXHAUST_KEYS = [
  'exhaustMassFlow',
  'turbineInletTemperature',
  'turbineOutletPressure',
  'downstreamLoss',
  'exhaustGasCp',
  'exhaustGasGamma',
  'exhaustGasConstant',
  'turbineInletPressure',
  'expansionRatio',
  'drivePressureRatio',
  'turbineFlowParameter',
  'turbineMapFlowParameter',
  'turbineEfficiency',
  'turbineMassFlow',
  'turbinePower',
  'shutGateExpansionRatio',
  'shutGateTurbineEfficiency',
  'shutGateTurbinePower',
  'wastegateMassFlow',
  'wastegateFraction',
  'wastegateDiameterNeeded',
  'wastegateDiameterFitted',
  'wastegateMargin',
] as const satisfies readonly (keyof PointValues)[];

/** Writes the exhaust values of a point (in place: the point is still being built). */
function writeExhaust(
  v: PointValues,
  ex: LineExhaustContext,
  divisor: number,
  g: ExhaustGas,
  shut: TurbineState,
  at: TurbineState,
  kind: NonNullable<PointValues['exhaustCase']>,
  held: boolean,
): void {
  const p3 = at.expansionRatio * g.p4;
  const gates = ex.input.wastegates;
  const turbineFlow = Math.min(at.massFlow, g.flow);
  const gateFlow = g.flow - turbineFlow;
  v.targetHeld = held;
  v.exhaustCase = kind;
  v.exhaustMassFlow = g.flow;
  v.turbineInletTemperature = g.t3;
  v.turbineOutletPressure = g.p4;
  v.downstreamLoss = g.downstreamLoss;
  v.exhaustGasCp = g.gas.cp;
  v.exhaustGasGamma = g.gas.gamma;
  v.exhaustGasConstant = g.gas.gasConstant;
  v.turbineSpeedReading = speedReadingOf(g, at.expansionRatio, v.shaftSpeed);
  v.turbineInletPressure = p3;
  v.expansionRatio = at.expansionRatio;
  v.drivePressureRatio = p3 / v.manifoldPressure;
  v.turbineFlowParameter = at.flowParameter;
  v.turbineMapFlowParameter = at.flowParameter / divisor;
  v.turbineMapLocation = at.location;
  v.turbineEfficiency = at.efficiency;
  v.turbineMassFlow = turbineFlow;
  v.turbinePower = at.power;
  v.shutGateExpansionRatio = shut.expansionRatio;
  v.shutGateTurbineEfficiency = shut.efficiency;
  v.shutGateTurbinePower = shut.power;
  v.wastegateMassFlow = gateFlow;
  v.wastegateFraction = gateFlow / g.flow;
  v.wastegateDiameterFitted = gates.valveDiameter;
  const flux = orificeMassFlux(p3, g.t3, g.p4, g.gas);
  v.wastegateChoked = gateFlow > 0 ? flux.choked : null;
  if (kind === 'no-power-needed') {
    // The throttle sets boost; the gates are simply open, so no size is asked of them.
    v.wastegateDiameterNeeded = null;
    v.wastegateMargin = null;
  } else {
    const size = wastegateDiameterFor({
      massFlow: gateFlow,
      gates: gates.count,
      dischargeCoefficient: gates.dischargeCoefficient,
      upstreamPressure: p3,
      upstreamTemperature: g.t3,
      downstreamPressure: g.p4,
      gas: g.gas,
    });
    v.wastegateDiameterNeeded = size ? size.diameter : null;
    v.wastegateMargin = size ? (gates.valveDiameter - size.diameter) / gates.valveDiameter : null;
  }
}

/** True when every exhaust number of the point is finite (or null): one sum carries any NaN or Infinity. */
function exhaustFinite(v: PointValues): boolean {
  const sum =
    (v.exhaustMassFlow ?? 0) +
    (v.turbineInletTemperature ?? 0) +
    (v.turbineOutletPressure ?? 0) +
    (v.turbineInletPressure ?? 0) +
    (v.expansionRatio ?? 0) +
    (v.drivePressureRatio ?? 0) +
    (v.turbineFlowParameter ?? 0) +
    (v.turbineMapFlowParameter ?? 0) +
    (v.turbineEfficiency ?? 0) +
    (v.turbineMassFlow ?? 0) +
    (v.turbinePower ?? 0) +
    (v.shutGateExpansionRatio ?? 0) +
    (v.shutGateTurbineEfficiency ?? 0) +
    (v.shutGateTurbinePower ?? 0) +
    (v.wastegateMassFlow ?? 0) +
    (v.wastegateFraction ?? 0) +
    (v.wastegateDiameterNeeded ?? 0) +
    (v.wastegateDiameterFitted ?? 0) +
    (v.wastegateMargin ?? 0);
  return Number.isFinite(sum);
}

/** How the point read the turbine map against its shaft speed, with each line's efficiency at the point's ratio (for the Working). */
function speedReadingOf(g: ExhaustGas, expansionRatio: number, shaftSpeed: number | null): PointValues['turbineSpeedReading'] {
  const at = g.atSpeed;
  if (!at) return { basis: 'mean-of-lines', shaftSpeed: shaftSpeed ?? null, lowerSpeed: null, upperSpeed: null, lowerEfficiency: null, upperEfficiency: null };
  const lines = at.linesAt(expansionRatio);
  return { basis: at.speedBasis, shaftSpeed: at.shaftSpeed, lowerSpeed: at.lowerSpeed, upperSpeed: at.upperSpeed, ...lines };
}

function clearExhaust(v: PointValues): void {
  for (const key of EXHAUST_KEYS) v[key] = null;
  v.turbineSpeedReading = null;
  v.targetHeld = null;
  v.exhaustCase = null;
  v.turbineMapLocation = null;
  v.wastegateChoked = null;
}

/**
 * Compressor power of a point fresh from solvePoint, W. It is always set there; only a point found
 * unreachable loses it, and that happens after the exhaust side is solved. NaN, never a silent 0, if not.
 */
const solvedPower = (v: PointValues): number => v.compressorPower ?? Number.NaN;

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

/** Findings about the line's exhaust inputs: raised once, at the line's first point. */
export function exhaustLineFindings(ctx: LineContext, rpm: number): Finding[] {
  const ex = ctx.exhaust;
  if (!ex) return [];
  const out: Finding[] = [];
  const problems = exhaustProblems(ex);
  if (problems.length > 0) {
    out.push(exhaustFinding('input-out-of-range', 'warning', `The exhaust side is not computed: ${problems.join('; ')}.`, rpm));
    return out;
  }
  if (!ex.turbine) {
    out.push(exhaustFinding('turbine-map-missing', 'warning', 'The Plan has an exhaust side but no turbine map: the exhaust side is not computed.', rpm));
    return out;
  }
  const t = ex.turbine;
  if (t.housing !== ex.input.housing) {
    const mapWords =
      t.housing === 'divided' ? `a divided housing${t.scrollFeed === 'per-scroll' ? ' (flow per scroll, doubled)' : ''}` : 'a single-scroll housing';
    out.push(
      exhaustFinding(
        'turbine-housing-mismatch',
        'warning',
        `The turbine map is for ${mapWords}, the Plan's housing is ${ex.input.housing === 'divided' ? 'divided' : 'single-scroll'}: the map's capacity is used as it is.`,
        rpm,
      ),
    );
  }
  if (t.efficiencyKind === 'with-bearing-losses' && ex.input.mechanicalEfficiency !== 1) {
    out.push(
      exhaustFinding(
        'mechanical-efficiency-in-map',
        'info',
        `The turbine map's efficiency is total-to-static with the bearings' losses in it, so the Plan's mechanical efficiency of ${fmt(ex.input.mechanicalEfficiency * 100, 3)} % is not applied again.`,
        rpm,
        { value: ex.input.mechanicalEfficiency, kind: 'fraction' },
      ),
    );
  }
  if (ex.input.pulseFactor !== 1) {
    out.push(
      exhaustFinding(
        'input-out-of-range',
        'info',
        `A pulse-energy factor of ${fmt(ex.input.pulseFactor, 3)} multiplies the turbine's energy: an assumption for what the steady model cannot see of a divided manifold's pulses.`,
        rpm,
        { value: ex.input.pulseFactor, kind: 'ratio' },
      ),
    );
  }
  return out;
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
    let fb = etaM * shut.value.power - compressorPower;
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
      boostIterations = root.iterations;
    } else {
      boost = root.bracket ? (root.bracket.fa >= 0 ? root.bracket.a : root.bracket.fb >= 0 ? root.bracket.b : low) : low;
      boostIterations = root.iterations;
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
    // At a compressor-map edge the compressor's own state may not settle (its efficiency jumps
    // between the map and the Plan's figure), and then no boost balances exactly: say how close.
    const mismatch = (etaM * at.power - solvedPower(v)) / Math.max(solvedPower(v), etaM * at.power, 1);
    if (!(Math.abs(mismatch) <= HELD_BALANCE_WARNING)) {
      extra.push(
        exhaustFinding(
          'exhaust-not-converged',
          'warning',
          `At the held boost the turbine's power and the compressor's differ by ${(mismatch * 100).toFixed(1)} %: ${v.converged ? 'the balance jumps here' : "the compressor's state does not settle at this boost"} (a compressor-map edge), so the held boost is approximate.`,
          op.rpm,
          { value: mismatch, threshold: HELD_BALANCE_WARNING, kind: 'fraction' },
        ),
      );
    }
  }

  writeExhaust(v, ex, divisor, g, shut.value, at, kind, held);
  v.boostIterations = boostIterations;
  if (!exhaustFinite(v)) {
    clearExhaust(v);
    point.findings.push(
      ...lineFindings,
      ...extra,
      exhaustFinding('exhaust-not-converged', 'warning', 'The exhaust side gives no finite numbers at this point; it is left out.', op.rpm),
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

/** Whether a point's target is above ambient: a line of such points asks the turbine for boost. */
function asksForBoost(v: PointValues): boolean {
  return (v.boostTarget ?? v.boost) > 0;
}

function extreme(points: readonly OperatingPoint[], value: (v: PointValues) => number | null | undefined): ValueAtRpm | null {
  let best: ValueAtRpm | null = null;
  for (const p of points) {
    if (!p.values) continue;
    const x = value(p.values);
    if (typeof x === 'number' && Number.isFinite(x) && (best === null || x > best.value)) best = { value: x, rpm: p.rpm };
  }
  return best;
}

/** The exhaust figures of a line; null when its Plan has no exhaust side or no turbine map. */
export function exhaustLineSummary(ctx: LineContext, points: readonly OperatingPoint[]): ExhaustLineSummary | null {
  const ex = ctx.exhaust;
  if (!ex || !ex.turbine) return null;
  const boostAsked = points.some((p) => p.values !== null && asksForBoost(p.values));
  let threshold: number | null = null;
  for (const p of points) {
    // Full boost counts only where the compressor can deliver it: a target held at a point left of
    // surge is boost the engine cannot use.
    if (boostAsked && p.values && p.values.targetHeld === true && asksForBoost(p.values) && p.values.reachable !== false) {
      threshold = p.rpm;
      break;
    }
  }
  const peakPower = extreme(points, (v) => v.brakePower);
  const atPeak = peakPower ? points.find((p) => p.rpm === peakPower.rpm)?.values?.turbineInletPressure : null;
  return {
    boostThresholdRpm: threshold,
    turbineHoldsFromRpm: boostAsked ? (points.find((p) => p.values?.targetHeld === true && asksForBoost(p.values))?.rpm ?? null) : null,
    boostAsked,
    // Below the threshold the manifold is barely boosted and p3/p_man says little: the peak that
    // matters is at the boost the builder asked for.
    peakDrivePressureRatio: extreme(points, (v) => (v.targetHeld === true ? v.drivePressureRatio : null)),
    wastegateDiameterNeeded: extreme(points, (v) => v.wastegateDiameterNeeded),
    wastegateDiameterFitted: ex.input.wastegates.valveDiameter,
    turbineInletPressureAtPeakPower: peakPower && typeof atPeak === 'number' ? { value: atPeak, rpm: peakPower.rpm } : null,
    peakTurbineInletPressure: extreme(points, (v) => v.turbineInletPressure),
  };
}

/** The line-level finding when the turbine holds the target nowhere on the line (at its first solved point). */
export function finishExhaustLine(ctx: LineContext, points: OperatingPoint[]): ExhaustLineSummary | null {
  const summary = exhaustLineSummary(ctx, points);
  if (!summary) return null;
  const computed = points.filter((p) => p.values && p.values.targetHeld !== null && p.values.targetHeld !== undefined);
  if (computed.length > 0 && summary.boostThresholdRpm === null && summary.boostAsked) {
    computed[0].findings.push(
      exhaustFinding(
        'boost-target-not-held',
        'warning',
        'The turbine holds the boost target at no engine speed of this line: there is no boost threshold.',
        computed[0].rpm,
      ),
    );
  }
  return summary;
}
