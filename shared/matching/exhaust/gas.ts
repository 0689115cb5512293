/** The exhaust gas one turbocharger's turbine sees at a solved compressor point, and the map as that point reads it. */
import { exhaustGasAt } from '#shared/physics/exhaust-gas';
import { scaledPressureLoss } from '#shared/physics/losses';
import { TURBINE_GAS, type GasProperties } from '#shared/physics/turbine';
import type { LineContext } from '../line-context';
import type { PointValues } from '../result';
import { valueAtRpm } from '../rpm-table';
import type { TurbineAtSpeed, TurbineModel } from './model';
import type { LineExhaustContext } from './result';

/** What the exhaust side reads: the map at the shaft speed, or the mean of its lines. */
export type TurbineReader = Pick<TurbineModel, 'read' | 'expansionRatioForFlow'>;

/** The gas conditions of one point that the turbine and gates see. */
export interface ExhaustGas {
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
export function exhaustGasOf(v: PointValues, ctx: LineContext, ex: LineExhaustContext, turbine: TurbineModel): ExhaustGas {
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
