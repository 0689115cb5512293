/** What the exhaust side adds to a point and to a line (physics note §5), and what it was computed with. */
import type { ExhaustInput } from '../input/exhaust';
import type { TurbineEfficiencyKind, TurbineHousing, TurbineLocation, TurbineSpeedBasis } from './model';

/** The case of the quasi-steady power balance a point falls in (physics note §5). */
type ExhaustCase = 'gate-open' | 'target-not-held' | 'no-power-needed';

/** How a point's turbine reading used the shaft speed (see TurbineSpeedBasis). */
interface TurbineSpeedReading {
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

/**
 * The exhaust side's values of a point, SI. The engine always sets these: null when the Plan has no
 * exhaust block or no turbine map. Optional in the type only so that hand-built values stay valid.
 */
export interface ExhaustValues {
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
