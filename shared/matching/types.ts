/**
 * The study input the engine runs (SI throughout) and what it returns. The Study screen edits
 * the input; the zod schemas in shared/schemas/compute.ts check it at every edge.
 */
import type { ChargeGas, FuelChoice, FuelProperties, FuelRegulator, PressureLossInput, Strokes } from '../physics';
export type { PressureLossInput } from '../physics';
import type { MapLocation, MapReference, MarginBasis, SpeedBasis } from './compressor-model';
import type { TurbineEfficiencyKind, TurbineHousing, TurbineLocation, TurbineSpeedBasis } from './exhaust-model';
import type { WorkingKind, WorkingStep } from './working';

/** One row of a table by engine speed: rpm and the value at that speed (unit set by the table). */
export interface RpmRow {
  rpm: number;
  value: number;
}
/**
 * A table by engine speed, rows in increasing rpm. Read by linear interpolation between rows and
 * held flat (first or last value) outside their range.
 */
export type RpmTable = RpmRow[];

/** The engine speeds to compute, rpm: an explicit list, or min to max in steps. */
export type RpmPoints = { kind: 'list'; values: number[] } | { kind: 'range'; min: number; max: number; step: number };

/** Limits the builder states for the engine; each one crossed is a finding with severity "limit". */
export interface EngineLimits {
  /** Highest allowed engine speed, rpm. */
  maxRpm?: number;
  /** Highest allowed manifold pressure, Pa absolute. */
  maxManifoldPressure?: number;
  /** Highest allowed compressor outlet temperature, K. */
  maxCompressorOutletTemperature?: number;
}

export interface EngineInput {
  /** Total swept volume of all cylinders, m³. */
  displacement: number;
  /** Number of cylinders. */
  cylinders: number;
  /** 2 or 4 stroke cycle. */
  strokes: Strokes;
  rpm: RpmPoints;
  /** Volumetric efficiency (fraction, referred to manifold density) by rpm: of a two-stroke, its delivery ratio. */
  volumetricEfficiency: RpmTable;
  /**
   * Two-strokes only: the share of the delivered air the cylinders trap, fraction (Heywood 1988
   * §6.6). Fuel and power follow the trapped air; the compressor still passes all of it. Default 1.
   */
  trappingEfficiency?: number;
  limits?: EngineLimits;
}

/** A set of identical injectors. */
export interface InjectorSetInput {
  count: number;
  /** Rated flow of ONE injector, m³/s, at `ratedPressure`. */
  ratedFlow: number;
  /** Pressure difference across the injector at which `ratedFlow` holds, Pa. */
  ratedPressure: number;
  /** Density of the fluid the rating was measured with, kg/m³; absent: rated with the fuel itself. */
  ratingFluidDensity?: number;
  /** Opening delay lost on every injection, s, and the battery voltage it was measured at, V; absent: none. */
  deadTime?: { time: number; voltage: number };
}

/** The staged secondary set: opens together with the primaries from `switchOverRpm` up. */
export interface SecondaryInjectorSetInput extends InjectorSetInput {
  /** Engine speed from which the secondaries inject too, rpm. */
  switchOverRpm: number;
}

export interface InjectorsInput {
  primary: InjectorSetInput;
  secondary?: SecondaryInjectorSetInput;
  /** Base fuel pressure, Pa gauge: above the manifold (1:1 regulator) or above the atmosphere (fixed rail). */
  fuelPressure: number;
  regulator: FuelRegulator;
}

export interface FuelSystemInput {
  fuel: FuelChoice;
  /** Lambda target (air-fuel ratio over stoichiometric, dimensionless) by rpm. */
  lambda: RpmTable;
  injectors: InjectorsInput;
  /** Flow the fuel pump delivers at the rail pressure it must hold, m³/s, when known. */
  pumpFlowAvailable?: number;
}

/** How brake power follows from air: a brake thermal efficiency, or a BSFC referred to the fuel that burns. */
export type PowerAssumptions =
  | {
      basis: 'brake-thermal-efficiency';
      /** Brake thermal efficiency, fraction. */
      brakeThermalEfficiency: number;
      /** Drivetrain loss, fraction of brake power. */
      drivetrainLoss: number;
    }
  | {
      basis: 'bsfc';
      /** Brake specific fuel consumption, kg/J, referred to the stoichiometric share of the fuel. */
      bsfc: number;
      /** Drivetrain loss, fraction of brake power. */
      drivetrainLoss: number;
    };

/**
 * Pressure losses, each at the engine flow it was measured at (and the gas density then), so that
 * it follows the flow as ṁ²/ρ; without a flow a loss is the same at every flow (the older form).
 */
export interface LossesInput {
  /** Filter and intake pressure loss before the compressor, at an engine air flow. */
  inlet: PressureLossInput;
  /** Pressure loss from compressor outlet to manifold (charge cooler and pipes), at an engine air flow. */
  chargeCooler: PressureLossInput;
  /** Heating of the air before the compressor (under-bonnet intake), K. Default 0. */
  inletTemperatureRise?: number;
}

/** Manifold temperature: stated, or from an intercooler's effectiveness. */
export type IntercoolerInput =
  | {
      kind: 'fixed';
      /** Manifold air temperature, K. */
      manifoldTemperature: number;
    }
  | {
      kind: 'effectiveness';
      /** Intercooler effectiveness, fraction (0 means no cooling). */
      effectiveness: number;
      /** Coolant temperature, K; when absent the scenario's ambient temperature (air-to-air). */
      coolantTemperature?: number;
    };

/** Ambient conditions: barometric pressure and temperature, or altitude with the ISA filling what is not given. */
export type AmbientInput =
  | {
      /** Barometric pressure, Pa absolute. */
      pressure: number;
      /** Air temperature, K. */
      temperature: number;
      /** Relative humidity, fraction 0–1; absent: dry air. */
      relativeHumidity?: number;
      altitude?: undefined;
    }
  | {
      /** Altitude, m, taken as geopotential height in the ISA troposphere. */
      altitude: number;
      /** Air temperature, K; ISA temperature at the altitude when absent. */
      temperature?: number;
      /** Relative humidity, fraction 0–1; absent: dry air. */
      relativeHumidity?: number;
      pressure?: undefined;
    };

export type BoostRowKind = 'full-load' | 'gear' | 'part-throttle';

/** One row of a boost schedule: its own operating line. */
export interface BoostRowInput {
  label: string;
  kind: BoostRowKind;
  /** Gear number when kind is "gear". */
  gear?: number;
  /** Boost target (manifold pressure over ambient, Pa gauge) by rpm. */
  boost: RpmTable;
}

export interface ScenarioInput {
  name: string;
  ambient: AmbientInput;
  boostSchedule: BoostRowInput[];
}

/** The wastegates of one turbocharger: one gate, or one per scroll of a divided housing. */
export interface WastegatesInput {
  /** Number of identical gates per turbocharger. */
  count: 1 | 2;
  /** Valve diameter of each gate, m (its flow area is taken as π·d²/4). */
  valveDiameter: number;
  /** Discharge coefficient of each gate, fraction (an assumption: real valves pass less than an ideal nozzle). */
  dischargeCoefficient: number;
}

/**
 * The exhaust side of a Plan (physics note §5). Absent: the Plan is judged on the compressor
 * alone. The turbine map itself is supplied at call time, like the compressor map.
 */
export interface ExhaustInput {
  /** Turbine housing: single-scroll, or divided (twin-scroll) fed by a divided manifold. */
  housing: TurbineHousing;
  wastegates: WastegatesInput;
  /** Share of turbine power that reaches the compressor after the bearings, fraction. */
  mechanicalEfficiency: number;
  /** Turbine inlet (exhaust gas) temperature T3 by rpm, K. */
  turbineInletTemperature: RpmTable;
  /** Pressure loss after the turbine (downpipe, catalyst, silencers), at an engine exhaust flow: p4 = p_amb + this. */
  downstreamLoss: PressureLossInput;
  /**
   * Pulse-energy factor of a divided housing, multiplying turbine energy (default 1.0: none).
   * A steady model sees only mean pressures; the exhaust pulses a divided manifold keeps apart
   * carry energy it cannot see. A named assumption the user sets; only for divided housings.
   */
  pulseFactor?: number;
  /** Turbine efficiency used where the turbine map gives none, fraction (default 0.65). */
  turbineEfficiency?: number;
}

export interface PlanInput {
  name: string;
  /** Number of identical turbochargers sharing the airflow in parallel. */
  turbochargers: number;
  /**
   * Compressor isentropic efficiency, fraction: used when there is no map, where the map gives no
   * efficiency at a point it can deliver (below the lowest speed line), and to place a point the
   * compressor cannot deliver on the map (its results are then not shown).
   */
  compressorEfficiency: number;
  /**
   * An explicit assumption, fraction: the compressor's efficiency past its choke line, above its map
   * or outside its speed lines. Set, such points are computed and counted on it (and the findings
   * name it); absent, they are not reachable and give no results.
   */
  offMapEfficiency?: number;
  /** The wheel's rated speed limit, rpm, when known (the lower of this and the map's applies). */
  maxShaftSpeed?: number;
  /** Reference of corrected flow when no compressor model is supplied; ISA sea level when absent. */
  mapReference?: MapReference;
  /** The exhaust side; absent judges the Plan on the compressor alone. */
  exhaust?: ExhaustInput;
}

/**
 * What a team requires of a plan: the verdict applies these. Every field has a default from common
 * practice (REQUIREMENT_DEFAULTS in requirements.ts).
 */
export interface RequirementsInput {
  /** Smallest surge margin accepted, fraction of corrected flow. */
  minSurgeMargin?: number;
  /** Smallest choke margin accepted, fraction of corrected flow. */
  minChokeMargin?: number;
  /** Smallest speed margin accepted, fraction of the speed limit. */
  minSpeedMargin?: number;
  /** Highest compressor outlet temperature accepted, K (above it: a warning; the engine's stated limit stays a hard limit). */
  maxCompressorOutletTemperature?: number;
  /** Lambda above which a point under boost raises a warning. */
  lambdaWarningUnderBoost?: number;
  /** Lambda above which a point under boost is at a limit (lean under boost burns pistons and valves). */
  lambdaLimitUnderBoost?: number;
  /** Boost from which a point counts as under boost, Pa gauge. */
  underBoostFrom?: number;
}

export interface StudyInput {
  engine: EngineInput;
  fuelSystem: FuelSystemInput;
  power: PowerAssumptions;
  losses: LossesInput;
  intercooler: IntercoolerInput;
  scenarios: ScenarioInput[];
  plans: PlanInput[];
  /** The study's required margins and limits; absent fields take the defaults. */
  requirements?: RequirementsInput;
}

// ——— results ———

export type Severity = 'info' | 'warning' | 'limit';

export type FindingCode =
  | 'unsolvable'
  | 'input-out-of-range'
  | 'injector-duty-high'
  | 'injector-duty-limit'
  | 'injector-saturated'
  | 'injector-no-flow'
  | 'fuel-pump-short'
  | 'fuel-pump-near-limit'
  | 'compressor-outlet-temperature-high'
  | 'compressor-outlet-temperature-limit'
  | 'efficiency-off-map'
  | 'map-left-of-surge'
  | 'map-beyond-choke'
  | 'map-above-top-speed'
  | 'map-below-map'
  | 'map-off-map'
  | 'overspeed'
  | 'throttled'
  | 'not-converged'
  | 'rpm-limit'
  | 'manifold-pressure-limit'
  | 'boost-target-not-held'
  | 'wastegate-too-small'
  | 'drive-pressure-ratio-high'
  | 'turbine-off-map'
  | 'turbine-efficiency-assumed'
  | 'turbine-map-missing'
  | 'turbine-housing-mismatch'
  | 'exhaust-not-converged'
  | 'throttle-sets-boost'
  | 'surge-margin-thin'
  | 'choke-margin-thin'
  | 'speed-margin-thin'
  | 'lean-under-boost'
  | 'lean-under-boost-limit'
  | 'off-map-assumption'
  | 'turbine-speed-outside-lines'
  | 'mechanical-efficiency-in-map';

/**
 * Where a point sits for the builder: on the map, or where the compressor cannot deliver it (left
 * of surge, past choke, over the speed limit, above the map, outside the speed lines), or below the
 * map (a light load the compressor meets turning slower than its lowest line).
 */
export type MapRegion = 'on-map' | 'below-map' | 'left-of-surge' | 'past-choke' | 'over-speed' | 'above-map' | 'outside-speed-lines';

/** How a margin or speed of a point was found (see MarginBasis, SpeedBasis); 'no-limit' when no speed limit is given. */
export interface PointMarginBasis {
  surge: MarginBasis;
  choke: MarginBasis;
  speed: SpeedBasis | 'no-limit';
}

export interface Finding {
  code: FindingCode;
  severity: Severity;
  /** Plain words, SI values; `value`, `threshold` and `kind` let a screen re-word it in the user's units. */
  message: string;
  /** Engine speed of the point, rpm. */
  rpm: number;
  value?: number;
  threshold?: number;
  kind?: WorkingKind;
}

/** Where the compressor efficiency of a point came from. */
/** Where the compressor efficiency of a point came from; 'off-map-assumption' is the Plan's explicit off-map figure. */
export type EfficiencySource = 'map' | 'plan' | 'point' | 'off-map-assumption';

/** Every value of one solved operating point, SI. Values that do not apply are null. */
export interface PointValues {
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

  // ——— the exhaust side (physics note §5). The engine always sets these: null when the Plan has no
  // exhaust block or no turbine map. Optional in the type only so that hand-built values stay valid.
  /** Whether the turbine holds the boost target here; null without the exhaust side. */
  targetHeld?: boolean | null;
  /**
   * Which case of the power balance the point is: the gate open with the target held, the target
   * not held (gate shut, boost below target), or no compressor power needed (the throttle sets boost).
   */
  exhaustCase?: ExhaustCase | null;
  /** Exhaust mass flow through ONE turbocharger's turbine and gates, kg/s (air plus fuel). */
  exhaustMassFlow?: number | null;
  /** Turbine inlet temperature T3, K. */
  turbineInletTemperature?: number | null;
  /** Turbine outlet pressure p4, Pa absolute. */
  turbineOutletPressure?: number | null;
  /** Pressure loss after the turbine at this point, Pa: p4 − p_amb. */
  downstreamLoss?: number | null;
  /** Specific heat of the exhaust gas at T3, J/(kg·K): from the fuel burnt, lambda and humidity. */
  exhaustGasCp?: number | null;
  /** Ratio of specific heats of the exhaust gas at T3. */
  exhaustGasGamma?: number | null;
  /** Gas constant of the exhaust gas, J/(kg·K). */
  exhaustGasConstant?: number | null;
  /** How the turbine map was read at the shaft speed (the two lines and their efficiencies at the point's ER). */
  turbineSpeedReading?: TurbineSpeedReading | null;
  /** Turbine inlet (exhaust manifold) pressure p3, Pa absolute. */
  turbineInletPressure?: number | null;
  /** Expansion ratio p3/p4. */
  expansionRatio?: number | null;
  /** Drive pressure ratio p3/p_man: exhaust manifold over intake manifold pressure. */
  drivePressureRatio?: number | null;
  /** Flow parameter of the whole turbine at the point, ṁ_t·√T3/p3, kg·K^0.5/(s·Pa). */
  turbineFlowParameter?: number | null;
  /** The same as the map draws it (per scroll for a per-scroll map), kg·K^0.5/(s·Pa): plot against expansionRatio. */
  turbineMapFlowParameter?: number | null;
  /** Where the expansion ratio lies on the turbine map. */
  turbineMapLocation?: TurbineLocation | null;
  /** Turbine isentropic efficiency used, fraction. */
  turbineEfficiency?: number | null;
  /** Mass flow through the turbine wheel of one turbocharger, kg/s. */
  turbineMassFlow?: number | null;
  /** Turbine power of one turbocharger, W (η_m of it reaches the compressor). */
  turbinePower?: number | null;
  /** Expansion ratio with the gates shut (all exhaust through the turbine) at this point's boost. */
  shutGateExpansionRatio?: number | null;
  /** Turbine efficiency at the shut-gate expansion ratio, fraction. */
  shutGateTurbineEfficiency?: number | null;
  /** Turbine power with the gates shut at this point's boost, W: what the turbine could give. */
  shutGateTurbinePower?: number | null;
  /** Mass flow through all the gates of one turbocharger, kg/s. */
  wastegateMassFlow?: number | null;
  /** Wastegate flow over exhaust flow, fraction. */
  wastegateFraction?: number | null;
  /** Valve diameter EACH gate needs to pass its share here, m (0 with the gates shut); null when not applicable. */
  wastegateDiameterNeeded?: number | null;
  /** Valve diameter of each gate fitted, m. */
  wastegateDiameterFitted?: number | null;
  /** (d_fitted − d_needed)/d_fitted, fraction: negative means the gates are too small. */
  wastegateMargin?: number | null;
  /** Whether the gate flow is choked (p4/p3 at or below the critical ratio). */
  wastegateChoked?: boolean | null;
  /** Iterations of the root finder that solved the boost the turbine holds (0 when not needed). */
  boostIterations?: number | null;
}

/** How a point's turbine reading used the shaft speed (see TurbineSpeedBasis). */
export interface TurbineSpeedReading {
  basis: TurbineSpeedBasis;
  /** The turbocharger's shaft speed read at, rpm; null where none is known (the mean of the lines). */
  shaftSpeed: number | null;
  /** The speed lines read, rpm (the same line twice when one is held); null for the mean of the lines. */
  lowerSpeed: number | null;
  upperSpeed: number | null;
  /** Each line's efficiency at the point's expansion ratio, fraction; null where the line gives none. */
  lowerEfficiency: number | null;
  upperEfficiency: number | null;
}

/** The case of the quasi-steady power balance a point falls in (physics note §5). */
export type ExhaustCase = 'gate-open' | 'target-not-held' | 'no-power-needed';

export interface SolvedPoint {
  solved: true;
  rpm: number;
  values: PointValues;
  findings: Finding[];
  /** Present when runStudy was asked for eager Working; otherwise build it with pointWorking(). */
  working?: WorkingStep[];
}

/** A point whose inputs make no physical state (e.g. non-positive pressure): findings say why. */
export interface UnsolvedPoint {
  solved: false;
  rpm: number;
  values: null;
  findings: Finding[];
  working?: WorkingStep[];
}

export type OperatingPoint = SolvedPoint | UnsolvedPoint;

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
  ambient: {
    input: AmbientInput;
    /** Ambient pressure, Pa absolute. */
    pressure: number;
    /** Ambient temperature, K. */
    temperature: number;
    pressureFrom: 'given' | 'isa';
    temperatureFrom: 'given' | 'isa';
    /** Relative humidity, fraction (0 when not given). */
    relativeHumidity: number;
  };
  /** The charge's gas: dry air, or humid air with its humidity ratio, gas constant, cp and γ. */
  air: ChargeGas;
  plan: PlanInput;
  /** Reference of corrected flow used, and where it came from. */
  reference: MapReference;
  referenceFrom: 'map' | 'plan' | 'standard';
  hasMap: boolean;
  /** The study's required margins and limits, defaults filled in (absent: the defaults). */
  requirements?: Required<RequirementsInput>;
  /** The exhaust side of the line; absent or null when the Plan has none. */
  exhaust?: LineExhaustContext | null;
}

/** What the exhaust side of a line was computed with: plain data (the turbine model itself is not kept). */
export interface LineExhaustContext {
  /** The Plan's exhaust block with its defaults filled in. */
  input: ExhaustInput & { pulseFactor: number; turbineEfficiency: number };
  /**
   * The mechanical efficiency the power balance applies, fraction: the Plan's, or 1 where the
   * turbine map's efficiency already counts the bearings' losses.
   */
  mechanicalEfficiency: number;
  /** The turbine map used; null when the Plan names none (then the exhaust side is not computed). */
  turbine: {
    name: string | null;
    housing: TurbineHousing;
    scrollFeed: 'both' | 'per-scroll' | null;
    areaRatio: number | null;
    /** What the map's efficiency counts; null when the map does not say (read as aerodynamic only). */
    efficiencyKind: TurbineEfficiencyKind | null;
    /** Speeds of the lines it is read between, rpm (empty: read as the mean of its lines). */
    speedLines: readonly number[];
    expansionRatioRange: readonly [number, number];
    mapFlowParameterDivisor: number;
    capacityRule: string;
  } | null;
}

/** A value of a line with the engine speed it was found at. */
export interface ValueAtRpm {
  value: number;
  /** Engine speed, rpm. */
  rpm: number;
}

/** The exhaust figures of a whole operating line (for Side by side and the line's headline). */
export interface ExhaustLineSummary {
  /**
   * Boost threshold: the first engine speed of the line that holds the boost target at a point the
   * compressor can deliver, rpm; null when none does or none asks for boost.
   */
  boostThresholdRpm: number | null;
  /** The first engine speed whose turbine holds the target, reachable or not (earlier than the threshold where the compressor surges there), rpm. */
  turbineHoldsFromRpm?: number | null;
  /** Whether any point of the line asks for boost (a target above ambient); a line that never does has no threshold. */
  boostAsked?: boolean;
  /** Highest drive pressure ratio p3/p_man of the line, over the points that hold their boost target. */
  peakDrivePressureRatio: ValueAtRpm | null;
  /** Largest valve diameter each gate needs on the line, m (the worst point). */
  wastegateDiameterNeeded: ValueAtRpm | null;
  /** Valve diameter of each gate fitted, m. */
  wastegateDiameterFitted: number;
  /** Turbine inlet pressure p3 at the point of peak crank power, Pa absolute. */
  turbineInletPressureAtPeakPower: ValueAtRpm | null;
  /** Highest turbine inlet pressure p3 of the line, Pa absolute. */
  peakTurbineInletPressure: ValueAtRpm | null;
}

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
