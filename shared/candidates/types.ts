/** What the Candidates ranking takes and gives: every map of a library judged against one study. */
import type { SpoolbookMap } from '../maps/types';
import type { VerdictReason, VerdictStatus } from '../matching/verdict';

/** Where a map of the library comes from; the Candidates view filters on it. */
export type CandidateOrigin = 'built-in' | 'team' | 'estimate';

/** A map of the library offered to the ranking. */
export interface CandidateMap {
  id: string;
  name: string;
  origin: CandidateOrigin;
  map: SpoolbookMap;
}

/** A value of the study's results with the operating line and engine speed it was found at. */
export interface ValueWhere {
  value: number;
  scenarioName: string;
  rowLabel: string;
  /** Engine speed, rpm. */
  rpm: number;
}

/** The verdict of a candidate, as a plan with that map would get it. */
export interface CandidateVerdict {
  status: VerdictStatus;
  headline: string;
  /** The first reason in words ("past choke from 4,750 rpm at “1,500 m, 35 °C”"); null when the map fits. */
  firstReason: string | null;
  firstReasonDetail: VerdictReason | null;
  pointsAtLimit: number;
  pointsWithWarnings: number;
}

/** A value read at one engine speed of the reference line; null where the point is not reachable (or has none). */
export interface ValueAtSpeed {
  /** Engine speed, rpm. */
  rpm: number;
  value: number | null;
}

/** A polyline of an operating line on the candidate's map: corrected flow (kg/s) and pressure ratio, for the thumbnail. */
export interface LineTrace {
  scenarioIndex: number;
  rowIndex: number;
  flows: number[];
  ratios: number[];
  reachable: boolean[];
}

export interface CompressorCandidate {
  mapId: string;
  mapName: string;
  origin: CandidateOrigin;
  verdict: CandidateVerdict;
  /** Smallest signed margins over every solved point, fraction; null where no point has one. */
  worstSurgeMargin: ValueWhere | null;
  worstChokeMargin: ValueWhere | null;
  worstSpeedMargin: ValueWhere | null;
  /** Efficiency at the engine's peak torque and peak power speeds on the reference line. */
  efficiencyAtPeakTorque: ValueAtSpeed | null;
  efficiencyAtPeakPower: ValueAtSpeed | null;
  /** Mean compressor efficiency over the reachable points of every full-load line, fraction; null when none is reachable. */
  meanFullLoadEfficiency: number | null;
  /** Highest compressor outlet temperature over the reachable points, K. */
  peakOutletTemperature: ValueWhere | null;
  /**
   * The wheel's size as its map tells it: the largest corrected flow of its choke line, brought to
   * ISA sea-level reference, kg/s (maps carry no diameter; the flow a wheel passes grows with D²).
   */
  capacity: number;
  /** Operating lines drawn on this map (corrected to its own reference). */
  traces: LineTrace[];
}

export interface TurbineCandidate {
  mapId: string;
  mapName: string;
  origin: CandidateOrigin;
  /** Housing A/R as the map gives it; null when it does not. */
  areaRatio: number | null;
  housing: 'single' | 'divided';
  verdict: CandidateVerdict;
  /** Smallest compressor margins of the plan with this turbine (where the turbine holds less boost, the points move). */
  worstSurgeMargin: ValueWhere | null;
  worstChokeMargin: ValueWhere | null;
  worstSpeedMargin: ValueWhere | null;
  /** Latest boost threshold over the full-load lines, rpm; null when some full-load line never holds its target. */
  boostThreshold: ValueWhere | null;
  /** Whether every full-load line reaches full boost somewhere. */
  holdsEveryFullLoadLine: boolean;
  /** Highest drive pressure ratio p3/p_man at full boost over every line. */
  peakDrivePressureRatio: ValueWhere | null;
  /** Share of the exhaust through the gates at the reference line's peak power speed, fraction. */
  wastegateShareAtPeakPower: ValueAtSpeed | null;
}
