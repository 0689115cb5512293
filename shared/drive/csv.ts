/** The drive downloads: their columns are a contract (the API documents them) and must not change. */
import { writeCsv } from '../csv';
import type { StudyDrive } from './study-drive';

const DRIVE_CSV_COLUMNS = [
  'Plan',
  'Gear',
  'Road speed (m/s)',
  'Engine speed (rpm)',
  'Wheel force (N)',
  'Traction limit (N)',
  'Usable boost (Pa gauge)',
] as const;

const SPOOL_CSV_COLUMNS = ['Plan', 'Time (s)', 'Boost (Pa gauge)', 'Shaft speed (rpm)'] as const;

/** One row per plan, gear and road speed; a point that gives no force leaves its force and usable boost empty. */
export function driveCsv(drive: StudyDrive): string {
  const rows = drive.figures.gears.flatMap((g) => g.points.map((p) => [g.planName, g.gear, p.roadSpeed, p.rpm, p.wheelForce, p.tractionLimit, p.usableBoost]));
  return writeCsv(DRIVE_CSV_COLUMNS, rows);
}

/** Boost and shaft speed against time from the spool start, per plan (a plan with no estimate has no rows). */
export function spoolCsv(drive: StudyDrive): string {
  const rows = drive.spools.flatMap((s) => s.samples.map((x) => [s.planName, x.time, x.boost, x.shaftSpeed]));
  return writeCsv(SPOOL_CSV_COLUMNS, rows);
}
