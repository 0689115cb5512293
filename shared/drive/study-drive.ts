/**
 * Everything the Drive view, Side by side and the CSV downloads show of a study's vehicle, from one
 * place: the force per gear beside the traction limit, the usable boost, the time to boost and the
 * acceleration run of each plan.
 */
import type { SpoolbookMap } from '../maps/types';
import type { StudyResult } from '../matching/result';
import { rpmPointsOf } from '../matching/rpm-table';
import type { StudyDocument } from '../schemas/study';
import type { PlanDriveFigures } from '../study/compare';
import { planCompressorModels, planTurbineModels, type MapModelCache } from '../study/run';
import { driveFigures, type DriveFigures } from './figures';
import { accelerationRuns, type PlanRun } from './run';
import { planSpools, type PlanSpool, type SpoolInputs } from './spool';

export interface StudyDrive {
  figures: DriveFigures;
  spools: PlanSpool[];
  runs: PlanRun[];
  /** Side by side's figures of each plan, by plan index. */
  byPlan: PlanDriveFigures[];
}

/** The drive of a study with a vehicle; null without one. */
export function studyDrive(doc: StudyDocument, result: StudyResult, inputs: SpoolInputs): StudyDrive | null {
  const figures = driveFigures(doc, result);
  if (!figures) return null;
  const spools = planSpools(doc, result, inputs);
  const runs = accelerationRuns(figures, rpmPointsOf(doc.engine.rpm)[0]);
  const byPlan = doc.plans.map((_, i): PlanDriveFigures => {
    const spool = spools.find((s) => s.planIndex === i);
    const run = runs.find((r) => r.planIndex === i);
    return {
      timeToBoost: spool?.timeTo90 ?? null,
      timeToBoostWhy: spool?.why ?? null,
      runTime: run?.time ?? null,
      runDistance: run?.distance ?? null,
      runWhy: run?.why ?? null,
    };
  });
  return { figures, spools, runs, byPlan };
}

/** The drive of a study computed with its maps (models taken from `cache` when given, as the study page does). */
export function studyDriveWithMaps(
  doc: StudyDocument,
  result: StudyResult,
  mapsById: Record<string, SpoolbookMap | undefined>,
  cache?: MapModelCache,
): StudyDrive | null {
  if (!doc.vehicle) return null;
  return studyDrive(doc, result, {
    compressorModels: planCompressorModels(doc, mapsById, cache),
    turbineModels: planTurbineModels(doc, mapsById, cache),
    mapInertias: doc.plans.map((p) => {
      const map = p.compressorMapId ? mapsById[p.compressorMapId] : undefined;
      return map?.kind === 'compressor' ? (map.rotorInertia ?? null) : null;
    }),
  });
}
