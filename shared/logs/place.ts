/**
 * Logged samples on the compressor map. The compressor's flow is the logged mass air flow where it
 * is logged, otherwise the study's engine model at the measured manifold pressure and temperature
 * (ṁ = VE·ρ_man·V_d·N/(60·n_R), Heywood 1988 §2.10). Pressures and the correction follow the
 * engine's own point solve: p1 = p_amb − inlet loss, p2 = p_man + charge-cooler loss (losses
 * following the flow), PR = p2/p1 (1 where the throttle takes the drop), ṁc = ṁ·√(T1/T_ref)/(p1/p_ref).
 */
import { correctedMassFlow, type FlowReference } from '../physics/compressor';
import { revolutionsPerCycle, type Strokes } from '../physics/airflow';
import { AIR_GAS_CONSTANT } from '../physics/gas';
import { scaledPressureLoss, type PressureLossInput } from '../physics/losses';
import { valueAtRpm } from '../matching/rpm-table';
import type { RpmTable } from '../matching/input/rpm';
import type { LogChannels } from './convert';

/** What the study says about the engine and the air where the log does not. */
export interface PlacementContext {
  /** Swept volume, m³. */
  displacement: number;
  strokes: Strokes;
  /** Turbochargers sharing the flow. */
  turbochargers: number;
  /** The map's reference for corrected flow. */
  reference: FlowReference;
  /** Ambient pressure (Pa absolute) and temperature (K) of the scenario, used where the log has none. */
  ambientPressure: number;
  ambientTemperature: number;
  /** Heating of the air before the compressor, K (added to the scenario's ambient, not to a logged inlet temperature). */
  inletTemperatureRise: number;
  inletLoss: PressureLossInput;
  chargeCoolerLoss: PressureLossInput;
  /** The study's volumetric efficiency by rpm, fraction. */
  volumetricEfficiency: RpmTable;
}

export interface PlacedSamples {
  /** Engine air mass flow, kg/s. */
  engineMassFlow: Float64Array;
  /** Corrected mass flow of one compressor, kg/s. */
  correctedMassFlow: Float64Array;
  pressureRatio: Float64Array;
  /** Where the flow came from. */
  flowFrom: 'logged mass air flow' | 'engine model';
  /** Where the manifold temperature came from (the model needs one). */
  manifoldTemperatureFrom: 'logged charge temperature' | 'logged inlet temperature' | 'scenario ambient';
}

export function placeSamples(channels: LogChannels, ctx: PlacementContext): PlacedSamples {
  const rpm = channels.engineSpeed!;
  const pMan = channels.manifoldPressure!;
  const n = rpm.length;
  const maf = channels.massAirFlow;
  const baro = channels.ambientPressure;
  const inletT = channels.inletTemperature;
  const chargeT = channels.manifoldTemperature;
  const engineMassFlow = new Float64Array(n);
  const corrected = new Float64Array(n);
  const ratio = new Float64Array(n);
  const perRevolution = ctx.displacement / (60 * revolutionsPerCycle(ctx.strokes));
  for (let i = 0; i < n; i++) {
    const pAmb = baro && Number.isFinite(baro[i]) ? baro[i] : ctx.ambientPressure;
    const t1 = inletT && Number.isFinite(inletT[i]) ? inletT[i] : ctx.ambientTemperature + ctx.inletTemperatureRise;
    const tMan = chargeT && Number.isFinite(chargeT[i]) ? chargeT[i] : t1;
    const density = pMan[i] / (AIR_GAS_CONSTANT * tMan);
    const flow = maf && Number.isFinite(maf[i]) ? Math.max(0, maf[i]) : valueAtRpm(ctx.volumetricEfficiency, rpm[i]) * density * perRevolution * rpm[i];
    const upstreamDensity = pAmb / (AIR_GAS_CONSTANT * t1);
    const p1 = pAmb - scaledPressureLoss(ctx.inletLoss, flow, upstreamDensity);
    const p2 = pMan[i] + scaledPressureLoss(ctx.chargeCoolerLoss, flow, density);
    engineMassFlow[i] = flow;
    ratio[i] = p1 > 0 ? Math.max(1, p2 / p1) : Number.NaN;
    corrected[i] = p1 > 0 ? correctedMassFlow(flow / ctx.turbochargers, t1, p1, ctx.reference) : Number.NaN;
  }
  return {
    engineMassFlow,
    correctedMassFlow: corrected,
    pressureRatio: ratio,
    flowFrom: maf ? 'logged mass air flow' : 'engine model',
    manifoldTemperatureFrom: chargeT ? 'logged charge temperature' : inletT ? 'logged inlet temperature' : 'scenario ambient',
  };
}
