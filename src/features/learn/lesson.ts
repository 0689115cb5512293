import type { CompressorMap } from '#shared/maps/types';
import { pointWorking } from '#shared/matching/explain-point';
import type { LineContext } from '#shared/matching/line-context';
import type { OperatingPoint } from '#shared/matching/result';
import { SOURCES, type WorkingStep } from '#shared/matching/working';
import type { StudyDocument } from '#shared/schemas/study';
import { runStudyDocument } from '#shared/study/run';
import { LEARN_MAP_ID } from './api/get-demo-map';

/** What the reader moves on the Learn page, SI. */
export interface LessonInputs {
  /** Engine speed, rpm. */
  rpm: number;
  /** Boost, Pa gauge. */
  boost: number;
  /** Altitude, m (ISA geopotential height). */
  altitude: number;
  /** Ambient temperature, K. */
  ambientTemperature: number;
}

export const DEFAULT_LESSON: LessonInputs = { rpm: 5500, boost: 120_000, altitude: 0, ambientTemperature: 293.15 };

/** The example engine, fixed so the reader watches the air, not the engine. */
export const LESSON_ENGINE = {
  /** m³ */
  displacement: 0.002,
  cylinders: 4,
  strokes: 4 as const,
  /** fraction, referred to manifold density */
  volumetricEfficiency: 0.95,
  /** Pa, filter and intake */
  inletLoss: 2000,
  /** Pa, intercooler and pipes */
  chargeCoolerLoss: 10_000,
  /** K above ambient the intercooler leaves the charge at */
  intercoolerApproach: 15,
  /** fraction, used only where the map gives none */
  fallbackEfficiency: 0.7,
};

/** The one-point study the example runs through the same engine as every Study. */
export function lessonDocument(inputs: LessonInputs, withMap: boolean): StudyDocument {
  const e = LESSON_ENGINE;
  return {
    schemaVersion: 2,
    engineLabel: '2.0 L four, Learn example',
    notes: '',
    engine: {
      displacement: e.displacement,
      cylinders: e.cylinders,
      strokes: e.strokes,
      rpm: { kind: 'list', values: [inputs.rpm] },
      volumetricEfficiency: [{ rpm: inputs.rpm, value: e.volumetricEfficiency }],
    },
    fuelSystem: {
      fuel: { kind: 'petrol' },
      lambda: [{ rpm: inputs.rpm, value: 0.85 }],
      injectors: { primary: { count: 4, ratedFlow: 1e-5, ratedPressure: 300_000 }, fuelPressure: 300_000, regulator: 'manifold-referenced' },
    },
    power: { basis: 'brake-thermal-efficiency', brakeThermalEfficiency: 0.33, drivetrainLoss: 0.15 },
    losses: { inlet: { pressureLoss: e.inletLoss }, chargeCooler: { pressureLoss: e.chargeCoolerLoss }, inletTemperatureRise: 0 },
    intercooler: { kind: 'fixed', manifoldTemperature: inputs.ambientTemperature + e.intercoolerApproach },
    scenarios: [
      {
        name: 'Your conditions',
        ambient: { altitude: inputs.altitude, temperature: inputs.ambientTemperature },
        boostSchedule: [{ label: 'Full load', kind: 'full-load', boost: [{ rpm: inputs.rpm, value: inputs.boost }] }],
      },
      {
        name: 'Standard day at sea level',
        ambient: { altitude: 0 },
        boostSchedule: [{ label: 'Full load', kind: 'full-load', boost: [{ rpm: inputs.rpm, value: inputs.boost }] }],
      },
    ],
    plans: [
      { id: 'learn', name: 'Demo compressor', turbochargers: 1, compressorEfficiency: e.fallbackEfficiency, compressorMapId: withMap ? LEARN_MAP_ID : null },
    ],
  };
}

export interface Lesson {
  context: LineContext;
  point: OperatingPoint;
  /** The same engine and boost on a standard day at sea level, for comparison. */
  standardDay: OperatingPoint;
  steps: WorkingStep[];
}

/** Runs the example and builds its Working. */
export function runLesson(inputs: LessonInputs, map: CompressorMap | null): Lesson {
  const result = runStudyDocument(lessonDocument(inputs, map !== null), map ? { [LEARN_MAP_ID]: map } : {});
  const [yours, standard] = result.lines;
  const point = yours.points[0];
  const steps = pointWorking(yours.context, point).map((step) => ({ ...step, source: lessonSource(step.source) }));
  return { context: yours.context, point, standardDay: standard.points[0], steps };
}

/** The Working's sources that speak of a Study or a Plan, as they read on this page, which has neither. */
const LESSON_SOURCES: Partial<Record<string, string>> = {
  [SOURCES.given]: 'Set in this lesson (the controls above, or the lesson’s engine)',
  [SOURCES.interpolation]: 'Linear interpolation in the lesson engine’s table by rpm, held flat outside its range',
  [SOURCES.assumption]: 'Assumption of this lesson',
  [SOURCES.map]: 'The demo compressor map shown here',
};

/** A step's source in the lesson's words. */
export function lessonSource(source: string): string {
  return LESSON_SOURCES[source] ?? source;
}

/** The steps of the Working a section of the lesson shows, in the order given (missing ones skipped). */
export function stepsById(steps: readonly WorkingStep[], ids: readonly string[]): WorkingStep[] {
  return ids.flatMap((id) => steps.filter((s) => s.id === id));
}
