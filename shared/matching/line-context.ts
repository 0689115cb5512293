/**
 * What an operating line is computed with: one Plan × Scenario × boost row of a study, as plain
 * data, enough to rebuild any point's Working.
 */
import { efficiencyFromBsfc, fuelProperties, type ChargeGas, type FuelChoice, type FuelProperties, type Strokes } from '../physics';
import { chargeGasOf, resolveAmbient, type ResolvedAmbient } from './ambient';
import { STANDARD_REFERENCE, type CompressorModel, type MapReference } from './compressor/model';
import { lineExhaustContext } from './exhaust/context';
import type { TurbineModel } from './exhaust/model';
import type { LineExhaustContext } from './exhaust/result';
import type { EngineLimits } from './input/engine';
import type { InjectorsInput } from './input/fuel-system';
import type { IntercoolerInput } from './input/intercooler';
import type { LossesInput } from './input/losses';
import type { PlanInput } from './input/plan';
import type { PowerAssumptions } from './input/power';
import { resolveRequirements, type Requirements } from './input/requirements';
import type { RpmTable } from './input/rpm';
import type { StudyInput } from './input/study';

/** What an operating line was computed with: plain data, enough to rebuild any point's Working. */
export interface LineContext {
  engine: {
    /** Total swept volume, m³. */
    displacement: number;
    cylinders: number;
    strokes: Strokes;
    limits: EngineLimits;
    /** Share of the delivered air the cylinders trap, fraction (1 for a four-stroke). */
    trappingEfficiency: number;
  };
  /** The Study tables the point inputs were read from; null where the value was given per point. */
  tables: {
    volumetricEfficiency: RpmTable | null;
    boost: RpmTable | null;
    lambda: RpmTable | null;
  };
  fuel: { choice: FuelChoice; properties: FuelProperties } | null;
  injectors: InjectorsInput | null;
  /** Pump flow available, m³/s. */
  pumpFlowAvailable: number | null;
  power: {
    basis: PowerAssumptions['basis'];
    /** Brake thermal efficiency used, fraction (from the BSFC when that is the basis). */
    brakeThermalEfficiency: number;
    /** The BSFC given, kg/J, when that is the basis. */
    bsfc: number | null;
    /** Drivetrain loss, fraction; null when wheel power is not wanted. */
    drivetrainLoss: number | null;
  } | null;
  losses: Required<LossesInput>;
  intercooler: IntercoolerInput;
  ambient: ResolvedAmbient;
  /** The charge's gas: dry air, or humid air with its humidity ratio, gas constant, cp and γ. */
  air: ChargeGas;
  plan: PlanInput;
  /** Reference of corrected flow used, and where it came from. */
  reference: MapReference;
  referenceFrom: 'map' | 'plan' | 'standard';
  hasMap: boolean;
  /** The study's required margins and limits, defaults filled in (absent: the defaults). */
  requirements?: Requirements;
  /** The exhaust side of the line; absent or null when the Plan has none. */
  exhaust?: LineExhaustContext | null;
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
