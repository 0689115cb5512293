/**
 * What the log says about the engine: its volumetric efficiency per engine-speed band, backed out
 * of the measured air flow, and where full boost really arrives.
 */
import { revolutionsPerCycle, type Strokes } from '../physics/airflow';
import { AIR_GAS_CONSTANT } from '../physics/gas';
import type { LogChannels } from './convert';

/**
 * Volumetric efficiency referred to manifold density, fraction: the definition ṁ = VE·ρ_man·V_d·N/(60·n_R)
 * (Heywood, Internal Combustion Engine Fundamentals, 1988, §2.10) solved for VE, with
 * ρ_man = p_man/(R·T_man).
 */
export function volumetricEfficiencyFrom(args: {
  /** Engine air mass flow, kg/s. */
  massFlow: number;
  /** Manifold pressure, Pa absolute. */
  manifoldPressure: number;
  /** Manifold temperature, K. */
  manifoldTemperature: number;
  /** Engine speed, rpm. */
  rpm: number;
  /** Swept volume, m³. */
  displacement: number;
  strokes: Strokes;
}): number {
  const density = args.manifoldPressure / (AIR_GAS_CONSTANT * args.manifoldTemperature);
  return (args.massFlow * 60 * revolutionsPerCycle(args.strokes)) / (density * args.displacement * args.rpm);
}

/** The engine's air mass flow from fuel flow and lambda, kg/s: ṁ_air = ṁ_fuel·λ·AFR_s. */
export function airFlowFromFuel(fuelMassFlow: number, lambda: number, stoichiometricAfr: number): number {
  return fuelMassFlow * lambda * stoichiometricAfr;
}

interface VolumetricEfficiencyBand {
  /** Centre of the band, rpm. */
  rpm: number;
  /** Mean of the samples, fraction. */
  value: number;
  /** Sample standard deviation, fraction (0 for one sample). */
  spread: number;
  samples: number;
}

export interface VolumetricEfficiencyFit {
  bands: VolumetricEfficiencyBand[];
  /** Where the air flow came from; null when the log has neither mass air flow nor fuel flow with lambda. */
  flowFrom: 'mass air flow' | 'fuel flow and lambda' | null;
  /** Where the manifold temperature came from. */
  temperatureFrom: 'logged charge temperature' | 'logged inlet temperature' | null;
}

export interface FitSettings {
  /** Width of an engine-speed band, rpm. */
  bandWidth: number;
  /** Fewest samples a band needs to be shown. */
  minSamples: number;
}

export const DEFAULT_FIT_SETTINGS: FitSettings = { bandWidth: 500, minSamples: 5 };

/** Band centre of an engine speed: bands of `width` centred on its multiples. */
function bandOf(rpm: number, width: number): number {
  return Math.round(rpm / width) * width;
}

/**
 * Volumetric efficiency per band over the used rows (Welford's running mean and variance). Rows
 * without a flow, a temperature, or above idle speed are left out. `stoichiometricAfr` is the
 * study fuel's, for logs with fuel flow and lambda instead of mass air flow.
 */
export function fitVolumetricEfficiency(
  channels: LogChannels,
  used: Uint8Array,
  engine: { displacement: number; strokes: Strokes; stoichiometricAfr: number | null },
  settings: FitSettings = DEFAULT_FIT_SETTINGS,
): VolumetricEfficiencyFit {
  const maf = channels.massAirFlow;
  const fuel = channels.fuelMassFlow;
  const lambda = channels.lambda;
  const flowFrom = maf ? 'mass air flow' : fuel && lambda && engine.stoichiometricAfr ? 'fuel flow and lambda' : null;
  const temperature = channels.manifoldTemperature ?? channels.inletTemperature;
  const temperatureFrom = channels.manifoldTemperature ? 'logged charge temperature' : channels.inletTemperature ? 'logged inlet temperature' : null;
  if (!flowFrom || !temperature) return { bands: [], flowFrom, temperatureFrom };
  const rpm = channels.engineSpeed!;
  const pMan = channels.manifoldPressure!;
  const stats = new Map<number, { n: number; mean: number; m2: number }>();
  for (let i = 0; i < rpm.length; i++) {
    if (!used[i] || !(rpm[i] >= 500)) continue;
    const flow = maf ? maf[i] : airFlowFromFuel(fuel![i], lambda![i], engine.stoichiometricAfr!);
    if (!(flow > 0) || !Number.isFinite(temperature[i])) continue;
    const ve = volumetricEfficiencyFrom({
      massFlow: flow,
      manifoldPressure: pMan[i],
      manifoldTemperature: temperature[i],
      rpm: rpm[i],
      displacement: engine.displacement,
      strokes: engine.strokes,
    });
    if (!Number.isFinite(ve)) continue;
    const band = bandOf(rpm[i], settings.bandWidth);
    const s = stats.get(band) ?? { n: 0, mean: 0, m2: 0 };
    s.n++;
    const delta = ve - s.mean;
    s.mean += delta / s.n;
    s.m2 += delta * (ve - s.mean);
    stats.set(band, s);
  }
  const bands = [...stats.entries()]
    .filter(([, s]) => s.n >= settings.minSamples)
    .sort((a, b) => a[0] - b[0])
    .map(([band, s]) => ({ rpm: band, value: s.mean, spread: s.n > 1 ? Math.sqrt(s.m2 / (s.n - 1)) : 0, samples: s.n }));
  return { bands, flowFrom, temperatureFrom };
}

/** Mean of a quantity per engine-speed band over the used rows (bands with at least `minSamples`). */
export function bandMeans(rpm: Float64Array, values: Float64Array, used: Uint8Array, settings: FitSettings = DEFAULT_FIT_SETTINGS) {
  const sums = new Map<number, { n: number; sum: number }>();
  for (let i = 0; i < rpm.length; i++) {
    if (!used[i] || !Number.isFinite(values[i]) || !(rpm[i] > 0)) continue;
    const band = bandOf(rpm[i], settings.bandWidth);
    const s = sums.get(band) ?? { n: 0, sum: 0 };
    s.n++;
    s.sum += values[i];
    sums.set(band, s);
  }
  return [...sums.entries()]
    .filter(([, s]) => s.n >= settings.minSamples)
    .sort((a, b) => a[0] - b[0])
    .map(([band, s]) => ({ rpm: band, value: s.sum / s.n, samples: s.n }));
}

/** Share of the target at which boost counts as arrived (common practice, no source). */
const BOOST_ARRIVED_SHARE = 0.9;

/**
 * The measured boost threshold, rpm: the first band whose mean boost reaches 90 % of the target
 * there, or null when none does. `boost` is gauge Pa; `targetAt` gives the schedule's target (Pa
 * gauge) at an engine speed.
 */
export function measuredBoostThreshold(
  rpm: Float64Array,
  boost: Float64Array,
  used: Uint8Array,
  targetAt: (rpm: number) => number,
  settings: FitSettings = { bandWidth: 250, minSamples: 3 },
): number | null {
  for (const band of bandMeans(rpm, boost, used, settings)) {
    const target = targetAt(band.rpm);
    if (target > 0 && band.value >= BOOST_ARRIVED_SHARE * target) return band.rpm;
  }
  return null;
}
