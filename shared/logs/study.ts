/**
 * A log set against one plan and scenario of a study: the placement context from the study, the
 * predicted line to compare with, and the rows the comparison uses.
 */
import type { CompressorMap } from '../maps/types';
import { ambientConditions } from '../physics/atmosphere';
import { fuelProperties } from '../physics/fuel';
import { valueAtRpm } from '../matching/rpm-table';
import type { StudyDocument } from '../schemas/study';
import type { PlacementContext } from './place';

/** The standard day a map without a plan falls back to: ISO 2533 sea level (288.15 K, 101 325 Pa). */
const STANDARD_REFERENCE = { temperature: 288.15, pressure: 101_325 };

/** The full-load row of a scenario, else its first. */
export function comparedRowIndex(doc: StudyDocument, scenarioIndex: number): number {
  const rows = doc.scenarios[scenarioIndex]?.boostSchedule ?? [];
  const full = rows.findIndex((r) => r.kind === 'full-load');
  return full === -1 ? 0 : full;
}

export function placementContext(doc: StudyDocument, planIndex: number, scenarioIndex: number, map: CompressorMap | null): PlacementContext {
  const scenario = doc.scenarios[scenarioIndex];
  const plan = doc.plans[planIndex];
  const ambient = ambientConditions(scenario.ambient);
  return {
    displacement: doc.engine.displacement,
    strokes: doc.engine.strokes,
    turbochargers: plan.turbochargers,
    reference: map?.reference ?? STANDARD_REFERENCE,
    ambientPressure: ambient.pressure,
    ambientTemperature: ambient.temperature,
    inletTemperatureRise: doc.losses.inletTemperatureRise ?? 0,
    inletLoss: doc.losses.inlet,
    chargeCoolerLoss: doc.losses.chargeCooler,
    volumetricEfficiency: doc.engine.volumetricEfficiency,
  };
}

/** The boost target of the compared row at an engine speed, Pa gauge. */
export function boostTargetAt(doc: StudyDocument, scenarioIndex: number): (rpm: number) => number {
  const row = doc.scenarios[scenarioIndex].boostSchedule[comparedRowIndex(doc, scenarioIndex)];
  return (rpm) => valueAtRpm(row.boost, rpm);
}

/** Stoichiometric air-fuel ratio of the study's fuel, for logs with fuel flow and lambda. */
export function studyStoichiometricAfr(doc: StudyDocument): number | null {
  return doc.fuelSystem ? fuelProperties(doc.fuelSystem.fuel).stoichiometricAfr : null;
}

/**
 * The study's VE table with the fitted bands written in: rows inside the fitted speed range are
 * replaced by the bands, rows outside it kept. Values rounded to 4 places.
 */
export function volumetricEfficiencyWithFit(current: readonly { rpm: number; value: number }[], bands: readonly { rpm: number; value: number }[]) {
  if (bands.length === 0) return current.map((r) => ({ ...r }));
  const lo = bands[0].rpm;
  const hi = bands[bands.length - 1].rpm;
  const kept = current.filter((r) => r.rpm < lo || r.rpm > hi);
  return [...kept, ...bands.map((b) => ({ rpm: b.rpm, value: Math.round(b.value * 1e4) / 1e4 }))].sort((a, b) => a.rpm - b.rpm);
}
