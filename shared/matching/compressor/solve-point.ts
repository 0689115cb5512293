/**
 * One operating point: from ambient, boost and the engine's breathing to the compressor's
 * pressure ratio, corrected flow, outlet temperature and power, then fuel, power and injectors.
 * Each point is solved on its own (quasi-steady), as the trade does by hand. The charge is the
 * line's air (dry, or humid with its own gas constant, cp and γ); fuel and power follow the dry
 * air the cylinders trap.
 */
// Imported from the modules themselves, not the physics index: re-export chains cost on the hot path.
import { revolutionsPerCycle, trappedAirMassFlow } from '#shared/physics/airflow';
import { isentropicExponent } from '#shared/physics/gas';
import { dryAirMassFlow } from '#shared/physics/humid-air';
import { lossFollowsFlow, scaledPressureLoss } from '#shared/physics/losses';
import { unsolvableFinding, type Finding } from '../finding';
import { lineInputFindings, pointFindings } from '../findings';
import { addFuel } from '../fuel';
import type { LineContext } from '../line-context';
import { lineProblems } from '../line-problems';
import type { OperatingPoint, PointValues } from '../result';
import { fmt } from '../working';
import type { CompressorModel, CompressorReading, MapLocation } from './model';
import { assumptionCovers, isReachable, mapRegionOf } from './reach';
import type { EfficiencySource, PointMarginBasis } from './result';

/** Compressor efficiency used when neither a point, a Plan nor a map gives one, fraction (from memory: a mid-island figure). */
export const DEFAULT_COMPRESSOR_EFFICIENCY = 0.7;
/** Most passes of the manifold-temperature fixed point. */
export const MAX_ITERATIONS = 40;
/** The fixed point has settled when the efficiency changes by less than this between passes (fraction). */
const EFFICIENCY_TOLERANCE = 1e-7;
/** From this pass on, each new efficiency is averaged with the last to damp any back-and-forth at a map edge. */
const DAMPING_FROM_PASS = 10;
/** Losses that follow the flow have settled when the pressure ratio changes by less than this share between passes. */
const PRESSURE_RATIO_TOLERANCE = 1e-10;

/** The inputs of one point that vary with rpm. */
export interface PointOperation {
  /** Engine speed, rpm. */
  rpm: number;
  /** Volumetric efficiency, fraction. */
  volumetricEfficiency: number;
  /** Boost target, Pa gauge. */
  boost: number;
  /** Lambda target; null when no fuel is given. */
  lambda: number | null;
  /** Manifold temperature, K, given for this point (overrides the intercooler). */
  manifoldTemperature?: number;
  /** Compressor efficiency, fraction, given for this point (overrides map and Plan). */
  compressorEfficiency?: number;
}

const positive = (x: number | null | undefined): x is number => typeof x === 'number' && Number.isFinite(x) && x > 0;
const finiteOrNull = (x: number | null | undefined): number | null => (typeof x === 'number' && Number.isFinite(x) ? x : null);
const locations: readonly MapLocation[] = ['inside', 'left-of-surge', 'beyond-choke', 'above-top-speed', 'below-map', 'off-map'];

/** A map reading with anything non-finite or impossible turned to null, so a faulty map cannot leak NaN. */
function readMap(model: CompressorModel, correctedMassFlow: number, pressureRatio: number): CompressorReading {
  const r = model.read(correctedMassFlow, pressureRatio);
  const efficiency = finiteOrNull(r.efficiency);
  return {
    efficiency: efficiency !== null && efficiency > 0 && efficiency <= 1 ? efficiency : null,
    shaftSpeed: finiteOrNull(r.shaftSpeed),
    surgeMargin: finiteOrNull(r.surgeMargin),
    chokeMargin: finiteOrNull(r.chokeMargin),
    speedMargin: finiteOrNull(r.speedMargin),
    location: locations.includes(r.location) ? r.location : 'off-map',
    surgeMarginBasis: r.surgeMarginBasis,
    chokeMarginBasis: r.chokeMarginBasis,
    speedBasis: r.speedBasis,
  };
}

function unsolved(rpm: number, reasons: string[]): OperatingPoint {
  return { solved: false, rpm, values: null, findings: reasons.map((r) => unsolvableFinding(rpm, r)) };
}

/**
 * Solves one point. `model` is the Plan's compressor map when there is one. `firstOfLine` adds the
 * findings about the line's own inputs. `checked` skips lineProblems when the caller ran it once.
 * `findings: false` skips the findings (for inner solves that only want the numbers).
 * `startEfficiency` starts the manifold-temperature fixed point from that efficiency instead of the Plan's,
 * and `maxPasses` caps its passes (inner solves whose answer is re-solved in full afterwards).
 */
export function solvePoint(
  ctx: LineContext,
  model: CompressorModel | null,
  op: PointOperation,
  options: { firstOfLine?: boolean; lineChecked?: boolean; findings?: boolean; startEfficiency?: number; maxPasses?: number } = {},
): OperatingPoint {
  const { rpm, volumetricEfficiency: ve, boost, lambda } = op;
  const problems = options.lineChecked ? [] : lineProblems(ctx);
  if (!positive(rpm)) problems.push(`Engine speed ${fmt(rpm)} rpm is not positive.`);
  if (!positive(ve)) problems.push(`Volumetric efficiency ${fmt(ve)} is not positive.`);
  if (!Number.isFinite(boost)) problems.push('Boost is not a number.');
  if (lambda !== null && !positive(lambda)) problems.push(`Lambda ${fmt(lambda)} is not positive.`);
  if (op.manifoldTemperature !== undefined && !positive(op.manifoldTemperature)) problems.push('Manifold temperature is not positive.');
  if (op.compressorEfficiency !== undefined && !(positive(op.compressorEfficiency) && op.compressorEfficiency <= 1))
    problems.push('Compressor efficiency is not between 0 and 1.');

  const ambientPressure = ctx.ambient.pressure;
  const ambientTemperature = ctx.ambient.temperature;
  const manifoldPressure = ambientPressure + boost;
  if (problems.length === 0 && !positive(manifoldPressure))
    problems.push(`Boost ${fmt(boost / 1000)} kPa makes the manifold pressure ${fmt(manifoldPressure / 1000)} kPa, which is not positive.`);
  if (problems.length > 0) return unsolved(rpm, problems);

  const air = ctx.air;
  const R = air.gasConstant;
  const CP = air.cp;
  const exponent = isentropicExponent(air.gamma);
  const t1 = ambientTemperature + ctx.losses.inletTemperatureRise;
  const turbochargers = ctx.plan.turbochargers;
  // Volume of manifold-density air the engine swallows per second, m³/s.
  const sweptFlow = (ve * ctx.engine.displacement * rpm) / (60 * revolutionsPerCycle(ctx.engine.strokes));
  const refTemperature = ctx.reference.temperature;
  const refPressure = ctx.reference.pressure;

  // The compressor's pressures follow the losses, and losses that follow the flow follow the
  // manifold temperature (through the flow and the density): set at one manifold temperature.
  const inletLossInput = ctx.losses.inlet;
  const coolerLossInput = ctx.losses.chargeCooler;
  const lossesFollowFlow = lossFollowsFlow(inletLossInput) || lossFollowsFlow(coolerLossInput);
  // The intake's air: ambient pressure at the compressor inlet temperature.
  const upstreamDensity = ambientPressure / (R * t1);
  let inletLoss = 0;
  let chargeCoolerLoss = 0;
  let p1 = 0;
  let p2 = 0;
  let throttled = false;
  let pressureRatio = 1;
  let temperatureRatio = 1;
  let correctionFactor = 1;
  // Corrected flow per kelvin of manifold temperature: ṁc = flowPerKelvin / T_man.
  let flowPerKelvin = 0;
  const setLosses = (manifoldTemperatureNow: number): void => {
    const density = manifoldPressure / (R * manifoldTemperatureNow);
    const engineFlow = sweptFlow * density;
    inletLoss = scaledPressureLoss(inletLossInput, engineFlow, upstreamDensity);
    chargeCoolerLoss = scaledPressureLoss(coolerLossInput, engineFlow, density);
    p1 = ambientPressure - inletLoss;
    const p2Unthrottled = manifoldPressure + chargeCoolerLoss;
    // The throttle sits after the compressor: below the compressor inlet pressure it takes the drop.
    throttled = p2Unthrottled < p1;
    p2 = throttled ? p1 : p2Unthrottled;
    pressureRatio = p2 / p1;
    temperatureRatio = Math.pow(pressureRatio, exponent);
    correctionFactor = Math.sqrt(t1 / refTemperature) / (p1 / refPressure);
    flowPerKelvin = ((sweptFlow * manifoldPressure) / R / turbochargers) * correctionFactor;
  };

  const planFallback = op.compressorEfficiency ?? ctx.plan.compressorEfficiency;
  const offMapEfficiency = op.compressorEfficiency === undefined ? ctx.plan.offMapEfficiency : undefined;
  // Where the map is silent and the Plan states an off-map assumption, the assumption holds there.
  const fallbackAt = (r: CompressorReading | null): number =>
    offMapEfficiency !== undefined && r !== null && assumptionCovers(mapRegionOf(r.location, null)) ? offMapEfficiency : planFallback;
  const fallback = planFallback;
  const fallbackSource: EfficiencySource = op.compressorEfficiency !== undefined ? 'point' : 'plan';
  const efficiencyFromMap = model !== null && op.compressorEfficiency === undefined;

  let manifoldTemperature: number;
  let efficiency = fallback;
  let iterations = 1;
  let converged = true;
  let reading: CompressorReading | null = null;
  const fixedTemperature = op.manifoldTemperature ?? (ctx.intercooler.kind === 'fixed' ? ctx.intercooler.manifoldTemperature : null);
  const ic = ctx.intercooler;
  const effectiveness = ic.kind === 'effectiveness' ? ic.effectiveness : 0;
  const coolantTemperature = ic.kind === 'effectiveness' ? (ic.coolantTemperature ?? ambientTemperature) : ambientTemperature;
  // With fixed losses the argument does not matter; otherwise it is the first guess of the manifold temperature.
  setLosses(fixedTemperature ?? t1);

  if (fixedTemperature !== null) {
    manifoldTemperature = fixedTemperature;
    if (model) reading = readMap(model, flowPerKelvin / manifoldTemperature, pressureRatio);
  } else if (!efficiencyFromMap && !lossesFollowFlow) {
    manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
    if (model) reading = readMap(model, flowPerKelvin / manifoldTemperature, pressureRatio);
  } else {
    // T_man depends on T2, T2 on the efficiency and the pressure ratio, the efficiency on where the
    // flow (set by T_man) lands on the map, and losses that follow the flow on the flow itself:
    // iterate to the fixed point.
    converged = false;
    manifoldTemperature = t1;
    // A caller solving nearby boosts in turn starts from the last settled efficiency: fewer passes.
    if (efficiencyFromMap && options.startEfficiency !== undefined && options.startEfficiency > 0 && options.startEfficiency <= 1)
      efficiency = options.startEfficiency;
    const maxPasses = options.maxPasses !== undefined && options.maxPasses >= 1 ? Math.min(MAX_ITERATIONS, Math.floor(options.maxPasses)) : MAX_ITERATIONS;
    // The manifold temperature the losses were last set at, and the pass before's, with how far
    // the temperature each gave was from it: while the efficiency holds (nearly) still the losses settle
    // by secant steps, far fewer passes than plain substitution takes.
    let lossTemperature = fixedTemperature ?? t1;
    let lastLossTemperature = Number.NaN;
    let lastResidual = Number.NaN;
    let lastEfficiency = Number.NaN;
    for (iterations = 1; iterations <= maxPasses; iterations++) {
      manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
      let pressuresSettled = true;
      if (lossesFollowFlow) {
        const residual = manifoldTemperature - lossTemperature;
        let next = manifoldTemperature;
        if (Math.abs(efficiency - lastEfficiency) <= 1e-4 * efficiency && residual !== lastResidual && Number.isFinite(lastResidual)) {
          const secant = lossTemperature - (residual * (lossTemperature - lastLossTemperature)) / (residual - lastResidual);
          // A step that leaves the plausible range falls back to plain substitution.
          if (secant > 0.5 * t1 && secant < 2 * manifoldTemperature) next = secant;
        }
        lastLossTemperature = lossTemperature;
        lastResidual = residual;
        lastEfficiency = efficiency;
        const before = pressureRatio;
        setLosses(next);
        lossTemperature = next;
        pressuresSettled = Math.abs(pressureRatio - before) <= PRESSURE_RATIO_TOLERANCE * pressureRatio;
        manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
      }
      let next = efficiency;
      if (efficiencyFromMap) {
        reading = readMap(model!, flowPerKelvin / manifoldTemperature, pressureRatio);
        next = reading.efficiency ?? fallbackAt(reading);
      }
      if (Math.abs(next - efficiency) <= EFFICIENCY_TOLERANCE && pressuresSettled) {
        converged = true;
        break;
      }
      efficiency = iterations < DAMPING_FROM_PASS ? next : 0.5 * (efficiency + next);
    }
    if (!converged) {
      iterations = maxPasses;
      manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
      if (lossesFollowFlow) {
        setLosses(manifoldTemperature);
        manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
      }
      if (efficiencyFromMap) reading = readMap(model!, flowPerKelvin / manifoldTemperature, pressureRatio);
    }
    if (!efficiencyFromMap && model) reading = readMap(model, flowPerKelvin / manifoldTemperature, pressureRatio);
  }
  let efficiencySource: EfficiencySource = fallbackSource;
  if (efficiencyFromMap && reading && reading.efficiency !== null) {
    if (fixedTemperature !== null) efficiency = reading.efficiency;
    efficiencySource = 'map';
  } else if (efficiencyFromMap) {
    // Off the map at the settled point: the fallback holds, and the state must match it.
    efficiency = fallbackAt(reading);
    if (efficiency !== planFallback) efficiencySource = 'off-map-assumption';
    if (fixedTemperature === null) {
      manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
      if (lossesFollowFlow) {
        setLosses(manifoldTemperature);
        manifoldTemperature = cooledTemperature(t1, temperatureRatio, efficiency, effectiveness, coolantTemperature);
      }
    }
  }
  if (!positive(p1)) return unsolved(rpm, [`At this flow the inlet loss (${fmt(inletLoss / 1000)} kPa) leaves no pressure at the compressor inlet.`]);

  const isentropicOutletTemperature = t1 * temperatureRatio;
  const inletDensity = p1 / (R * t1);
  const airDensity = manifoldPressure / (R * manifoldTemperature);
  const engineMassFlow = sweptFlow * airDensity;
  const massFlow = engineMassFlow / turbochargers;
  const correctedMassFlow = massFlow * correctionFactor;
  const compressorOutletTemperature = t1 * (1 + (temperatureRatio - 1) / efficiency);
  const compressorPower = massFlow * CP * (compressorOutletTemperature - t1);
  const dryAirMassFlowValue = dryAirMassFlow(engineMassFlow, air.humidityRatio);
  const trappingEfficiency = ctx.engine.trappingEfficiency;
  const trapped = trappingEfficiency === 1 ? dryAirMassFlowValue : trappedAirMassFlow(dryAirMassFlowValue, trappingEfficiency);

  const planMax = positive(ctx.plan.maxShaftSpeed) ? ctx.plan.maxShaftSpeed : null;
  const mapMax = model && positive(model.maxSpeed) ? model.maxSpeed : null;
  const maxShaftSpeed = planMax !== null && mapMax !== null ? Math.min(planMax, mapMax) : (planMax ?? mapMax);
  // Speed lines are corrected speeds, N/√(T1/T_ref), as flows are corrected flows: with the inlet
  // hotter than the map's reference the wheel turns faster than the line it sits on says.
  const correctedShaftSpeed = reading?.shaftSpeed ?? null;
  const shaftSpeed = correctedShaftSpeed !== null ? correctedShaftSpeed * Math.sqrt(t1 / refTemperature) : null;
  const speedMargin = shaftSpeed !== null && maxShaftSpeed !== null ? (maxShaftSpeed - shaftSpeed) / maxShaftSpeed : (reading?.speedMargin ?? null);
  const location = reading?.location ?? null;
  const mapRegion = mapRegionOf(location, speedMargin);
  const offMapAssumed = efficiencySource === 'off-map-assumption';
  const marginBasis: PointMarginBasis | null = reading
    ? {
        surge: reading.surgeMarginBasis ?? (reading.surgeMargin === null ? 'above-map' : 'surge-line'),
        choke: reading.chokeMarginBasis ?? (reading.chokeMargin === null ? 'above-map' : 'choke-line'),
        speed: maxShaftSpeed === null ? 'no-limit' : (reading.speedBasis ?? (reading.shaftSpeed === null ? 'outside-speed-lines' : 'speed-lines')),
      }
    : null;

  const values: PointValues = {
    rpm,
    volumetricEfficiency: ve,
    boost,
    boostTarget: boost,
    lambda,
    ambientPressure,
    ambientTemperature,
    compressorInletPressure: p1,
    compressorInletTemperature: t1,
    inletDensity,
    manifoldPressure,
    manifoldTemperature,
    airDensity,
    humidityRatio: air.humidityRatio,
    engineMassFlow,
    dryAirMassFlow: dryAirMassFlowValue,
    trappedAirMassFlow: trapped,
    inletLoss,
    chargeCoolerLoss,
    massFlow,
    correctedMassFlow,
    inletVolumeFlow: massFlow / inletDensity,
    compressorOutletPressure: p2,
    pressureRatio,
    throttled,
    compressorEfficiency: efficiency,
    efficiencySource,
    isentropicOutletTemperature,
    compressorOutletTemperature,
    compressorPower,
    iterations,
    converged,
    mapLocation: location,
    mapRegion,
    reachable: isReachable(mapRegion, offMapAssumed),
    offMapAssumed,
    marginBasis,
    placementEfficiency: null,
    correctedShaftSpeed,
    shaftSpeed,
    surgeMargin: reading?.surgeMargin ?? null,
    chokeMargin: reading?.chokeMargin ?? null,
    speedMargin,
    maxShaftSpeed,
    stoichiometricAfr: null,
    lowerHeatingValue: null,
    fuelDensity: null,
    fuelMassFlow: null,
    fuelVolumeFlow: null,
    brakeThermalEfficiency: null,
    brakePower: null,
    wheelPower: null,
    torque: null,
    apparentBsfc: null,
    powerLimitedBy: null,
    injectorPressureDifference: null,
    injectorStage: null,
    injectorCapacity: null,
    injectorFlowDuty: null,
    injectorDuty: null,
    railPressure: null,
    pumpFlowRequired: null,
    // The exhaust side fills these in (shared/matching/exhaust/) when the Plan has one.
    targetHeld: null,
    exhaustCase: null,
    exhaustMassFlow: null,
    turbineInletTemperature: null,
    turbineOutletPressure: null,
    downstreamLoss: null,
    exhaustGasCp: null,
    exhaustGasGamma: null,
    exhaustGasConstant: null,
    turbineSpeedReading: null,
    turbineInletPressure: null,
    expansionRatio: null,
    drivePressureRatio: null,
    turbineFlowParameter: null,
    turbineMapFlowParameter: null,
    turbineMapLocation: null,
    turbineEfficiency: null,
    turbineMassFlow: null,
    turbinePower: null,
    shutGateExpansionRatio: null,
    shutGateTurbineEfficiency: null,
    shutGateTurbinePower: null,
    wastegateMassFlow: null,
    wastegateFraction: null,
    wastegateDiameterNeeded: null,
    wastegateDiameterFitted: null,
    wastegateMargin: null,
    wastegateChoked: null,
    boostIterations: null,
  };

  if (ctx.fuel && lambda !== null) addFuel(values, ctx, lambda);

  // Inputs inside the schema cannot get here, but a direct caller might pass extreme numbers.
  // One sum carries any NaN or Infinity; only then name the culprits.
  const sum =
    pressureRatio +
    compressorPower +
    compressorOutletTemperature +
    correctedMassFlow +
    manifoldTemperature +
    airDensity +
    inletDensity +
    trapped +
    inletLoss +
    chargeCoolerLoss +
    (values.fuelVolumeFlow ?? 0) +
    (values.brakePower ?? 0) +
    (values.torque ?? 0) +
    (values.injectorDuty ?? 0) +
    (values.apparentBsfc ?? 0) +
    (values.speedMargin ?? 0) +
    (values.surgeMargin ?? 0) +
    (values.chokeMargin ?? 0) +
    (values.shaftSpeed ?? 0);
  const bad = Number.isFinite(sum) ? NONE : nonFiniteKeys(values);
  if (bad.length > 0) return unsolved(rpm, [`The inputs lead to numbers too large to compute (${bad.join(', ')}).`]);

  // Inner solves (the boost a turbine holds) only want the numbers.
  if (options.findings === false) return { solved: true, rpm, values, findings: [] };
  const findings: Finding[] = pointFindings(values, ctx);
  if (options.firstOfLine) findings.unshift(...lineInputFindings(ctx, rpm));
  return { solved: true, rpm, values, findings };
}

function nonFiniteKeys(values: PointValues): string[] {
  let bad: string[] | null = null;
  for (const key in values) {
    const value = values[key as keyof PointValues];
    if (typeof value === 'number' && !Number.isFinite(value)) (bad ??= []).push(key);
  }
  return bad ?? NONE;
}
const NONE: string[] = [];

/** Manifold temperature after the intercooler, K, from T1 (K), the isentropic temperature ratio and the efficiency. */
function cooledTemperature(t1: number, temperatureRatio: number, efficiency: number, effectiveness: number, coolantTemperature: number): number {
  const t2 = t1 * (1 + (temperatureRatio - 1) / efficiency);
  return t2 - effectiveness * (t2 - coolantTemperature);
}
