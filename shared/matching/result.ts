/**
 * What the engine returns: the values and findings of every operating point, by operating line.
 * SI throughout.
 */
import type { MapLocation } from './compressor/model';
import type { EfficiencySource, MapRegion, PointMarginBasis } from './compressor/result';
import type { ExhaustLineSummary, ExhaustValues } from './exhaust/result';
import type { Finding, Severity } from './finding';
import type { BoostRowKind } from './input/scenario';
import type { LineContext } from './line-context';
import type { WorkingStep } from './working';

/** Every value of one solved operating point, SI. Values that do not apply are null. */
export interface PointValues extends ExhaustValues {
  /** Engine speed, rpm. */
  rpm: number;
  /** Volumetric efficiency, fraction. */
  volumetricEfficiency: number;
  /**
   * Boost the point is solved at, Pa gauge: the target, except where the Plan's turbine cannot
   * hold the target; there it is the boost the turbine holds (the predicted boost) and
   * `boostTarget` keeps the target.
   */
  boost: number;
  /** Boost target of the schedule at this speed, Pa gauge. Always set by the engine. */
  boostTarget?: number;
  /** Lambda target, dimensionless; null without a fuel. */
  lambda: number | null;
  /** Ambient pressure, Pa absolute. */
  ambientPressure: number;
  /** Ambient temperature, K. */
  ambientTemperature: number;
  /** Compressor inlet pressure p1, Pa absolute. */
  compressorInletPressure: number;
  /** Compressor inlet temperature T1, K. */
  compressorInletTemperature: number;
  /** Air density at compressor inlet, kg/m³. */
  inletDensity: number;
  /** Manifold pressure, Pa absolute. */
  manifoldPressure: number;
  /** Manifold temperature, K. */
  manifoldTemperature: number;
  /** Density of the charge (humid air) in the manifold, kg/m³. */
  airDensity: number;
  /** Humidity ratio of the air, kg of water per kg of dry air (0 for dry air). */
  humidityRatio?: number;
  /** Air mass flow of the whole engine (humid air, as delivered), kg/s. */
  engineMassFlow: number;
  /** Dry air in the engine's delivered air flow, kg/s: ṁ/(1 + W). */
  dryAirMassFlow?: number;
  /** Dry air the cylinders trap, kg/s: fuel and power follow it (all of the dry air for a four-stroke). */
  trappedAirMassFlow?: number;
  /** Filter and intake loss at this point, Pa. */
  inletLoss?: number;
  /** Charge-cooler and pipe loss at this point, Pa. */
  chargeCoolerLoss?: number;
  /** Air mass flow through ONE turbocharger, kg/s. */
  massFlow: number;
  /** Corrected mass flow of one turbocharger against the map's reference, kg/s. */
  correctedMassFlow: number;
  /** Volume flow at the inlet of one compressor, m³/s. */
  inletVolumeFlow: number;
  /** Compressor outlet pressure p2, Pa absolute. */
  compressorOutletPressure: number;
  /** Pressure ratio p2/p1. */
  pressureRatio: number;
  /** True when the manifold is below compressor inlet pressure: the throttle takes the drop, PR is 1. */
  throttled: boolean;
  /** Compressor isentropic efficiency used, fraction; null where the point is not reachable. */
  compressorEfficiency: number | null;
  efficiencySource: EfficiencySource;
  /**
   * Where the point is not reachable: the efficiency its place on the map was estimated with
   * (the Plan's), fraction. Null for reachable points.
   */
  placementEfficiency?: number | null;
  /** Isentropic outlet temperature T2s, K. */
  isentropicOutletTemperature: number;
  /** Compressor outlet temperature T2, K; null where the point is not reachable. */
  compressorOutletTemperature: number | null;
  /** Shaft power of one compressor, W; null where the point is not reachable. */
  compressorPower: number | null;
  /** Passes of the manifold-temperature fixed point (1 when no iteration was needed). */
  iterations: number;
  converged: boolean;
  /** Where the point lands against the map's edges; null without a map. */
  mapLocation: MapLocation | null;
  /** Where the point sits for the builder (edges and speed limit together); null without a map. */
  mapRegion?: MapRegion | null;
  /**
   * Whether the compressor can deliver the point, so that its results stand: true without a map
   * (nothing to judge against), on the map and below it; false left of surge, past choke, over the
   * speed limit, above the map and outside its speed lines, unless the Plan's off-map efficiency
   * assumption covers it (past choke, above the map, outside the speed lines).
   */
  reachable?: boolean;
  /** True where the point's results rest on the Plan's off-map efficiency assumption. */
  offMapAssumed?: boolean;
  /** How each margin and the shaft speed were found; null without a map. */
  marginBasis?: PointMarginBasis | null;
  /** Speed the map gives at the point (corrected speed, at the map's reference), rpm: between its speed lines, or extrapolated along its edge. */
  correctedShaftSpeed: number | null;
  /** Turbocharger shaft speed, rpm: the corrected speed at the inlet's temperature. */
  shaftSpeed: number | null;
  /** Surge margin (ṁc − ṁc,surge(PR))/ṁc, fraction. */
  surgeMargin: number | null;
  /** Choke margin (ṁc,choke(PR) − ṁc)/ṁc, fraction. */
  chokeMargin: number | null;
  /** Speed margin (Nmax − N)/Nmax, fraction. */
  speedMargin: number | null;
  /** Shaft speed limit applied (the lower of plan and map), rpm. */
  maxShaftSpeed: number | null;
  /** Stoichiometric air-fuel ratio of the fuel. */
  stoichiometricAfr: number | null;
  /** Lower heating value of the fuel, J/kg. */
  lowerHeatingValue: number | null;
  /** Fuel density, kg/m³. */
  fuelDensity: number | null;
  /** Fuel mass flow of the engine, kg/s. */
  fuelMassFlow: number | null;
  /** Fuel volume flow of the engine, m³/s. */
  fuelVolumeFlow: number | null;
  /** Brake thermal efficiency used, fraction. */
  brakeThermalEfficiency: number | null;
  /** Brake power, W. */
  brakePower: number | null;
  /** Wheel power, W. */
  wheelPower: number | null;
  /** Brake torque, N·m. */
  torque: number | null;
  /** Fuel actually injected per brake power, kg/J (higher than the burnt-fuel BSFC when rich). */
  apparentBsfc: number | null;
  /** What sets the brake power: the air (lambda at or below 1: the fuel it can burn) or the fuel (lean: all of it burns). */
  powerLimitedBy?: 'air' | 'fuel' | null;
  /** Pressure difference across the injectors, Pa. */
  injectorPressureDifference: number | null;
  /** Which injectors are open: primaries alone or both sets. */
  injectorStage: 'primary' | 'both' | null;
  /** Flow the open injectors deliver at 100 % duty, m³/s. */
  injectorCapacity: number | null;
  /** Share of the time the fuel alone needs the injectors open, fraction (the duty without dead time). */
  injectorFlowDuty?: number | null;
  /** Injector duty cycle, fraction: the fuel's share plus the dead time of every injection (the set that loses most). */
  injectorDuty: number | null;
  /** Rail pressure the pump must hold, Pa gauge. */
  railPressure: number | null;
  /** Fuel flow the pump must deliver, m³/s (the engine's fuel volume flow). */
  pumpFlowRequired: number | null;
}

export interface SolvedPoint {
  solved: true;
  rpm: number;
  values: PointValues;
  findings: Finding[];
  /** Present when runStudy was asked for eager Working; otherwise build it with pointWorking(). */
  working?: WorkingStep[];
}

/** A point whose inputs make no physical state (e.g. non-positive pressure): findings say why. */
interface UnsolvedPoint {
  solved: false;
  rpm: number;
  values: null;
  findings: Finding[];
  working?: WorkingStep[];
}

export type OperatingPoint = SolvedPoint | UnsolvedPoint;

export interface OperatingLine {
  planIndex: number;
  planName: string;
  scenarioIndex: number;
  scenarioName: string;
  rowIndex: number;
  rowLabel: string;
  rowKind: BoostRowKind;
  gear: number | null;
  context: LineContext;
  points: OperatingPoint[];
  /** The most severe finding on the line, or null when there is none. */
  worstSeverity: Severity | null;
  /** The exhaust figures of the line; null (or absent) when its Plan has no exhaust side. */
  exhaust?: ExhaustLineSummary | null;
}

export interface StudyResult {
  lines: OperatingLine[];
}
