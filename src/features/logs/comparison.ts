/**
 * A stored log set against one plan and scenario of the study: the samples used, their places on
 * the map, measured against predicted values per engine-speed band, the fitted volumetric
 * efficiency and the boost threshold. Pure: the screen draws what this returns.
 */
import type { LogChannels } from '#shared/logs/convert';
import { bandMeans, DEFAULT_FIT_SETTINGS, fitVolumetricEfficiency, measuredBoostThreshold, type VolumetricEfficiencyFit } from '#shared/logs/fit';
import { placeSamples, type PlacedSamples } from '#shared/logs/place';
import { chosenSegments, detectSegments, usedRows, type LogSegment } from '#shared/logs/segments';
import { boostTargetAt, comparedRowIndex, placementContext, studyStoichiometricAfr } from '#shared/logs/study';
import type { CompressorMap, SpoolbookMap } from '#shared/maps/types';
import type { SolvedPoint } from '#shared/matching/result';
import { valueAtRpm } from '#shared/matching/rpm-table';
import type { StudyDocument } from '#shared/schemas/study';
import { studyLines, type StudyLine } from '#src/components/study/lines';
import { runStudyLive } from '#src/components/study/run';

interface BandRow {
  rpm: number;
  samples: number;
  measured: { boost: number | null; correctedMassFlow: number | null; pressureRatio: number | null; shaftSpeed: number | null; exhaustPressure: number | null };
  predicted: {
    boost: number | null;
    correctedMassFlow: number | null;
    pressureRatio: number | null;
    shaftSpeed: number | null;
    exhaustPressure: number | null;
  };
}

export interface LogComparisonResult {
  segments: LogSegment[];
  used: Uint8Array;
  placed: PlacedSamples;
  /** Measured boost of every sample, Pa gauge. */
  boost: Float64Array;
  line: StudyLine | null;
  map: CompressorMap | null;
  bands: BandRow[];
  fit: VolumetricEfficiencyFit;
  threshold: { measured: number | null; predicted: number | null; predictedNote: string };
}

/** A value of the predicted line at an engine speed, linear between its solved points; null outside them. */
function lineValueAt(points: readonly SolvedPoint[], rpm: number, pick: (p: SolvedPoint) => number | null | undefined): number | null {
  const withValue = points.filter((p) => typeof pick(p) === 'number' && Number.isFinite(pick(p)));
  for (let i = 0; i < withValue.length; i++) {
    const a = withValue[i];
    if (a.rpm === rpm) return pick(a) as number;
    const b = withValue[i + 1];
    if (b && a.rpm < rpm && rpm < b.rpm) {
      const t = (rpm - a.rpm) / (b.rpm - a.rpm);
      return (pick(a) as number) + ((pick(b) as number) - (pick(a) as number)) * t;
    }
  }
  return null;
}

export function compareLog(args: {
  doc: StudyDocument;
  mapsById: Record<string, SpoolbookMap | undefined>;
  channels: LogChannels;
  rowCount: number;
  /** The chosen row ranges; null: the detected pulls. */
  selection: readonly { start: number; end: number }[] | null;
  planIndex: number;
  scenarioIndex: number;
}): LogComparisonResult {
  const { doc, mapsById, channels, rowCount, planIndex, scenarioIndex } = args;
  const segments = detectSegments(channels);
  const used = usedRows(rowCount, chosenSegments(args.selection, segments));
  const mapId = doc.plans[planIndex]?.compressorMapId;
  const candidate = mapId ? mapsById[mapId] : undefined;
  const map = candidate?.kind === 'compressor' ? candidate : null;
  const ctx = placementContext(doc, planIndex, scenarioIndex, map);
  const placed = placeSamples(channels, ctx);
  const pMan = channels.manifoldPressure!;
  const baro = channels.ambientPressure;
  const boost = Float64Array.from(pMan, (p, i) => p - (baro && Number.isFinite(baro[i]) ? baro[i] : ctx.ambientPressure));

  const rowIndex = comparedRowIndex(doc, scenarioIndex);
  const line =
    studyLines(runStudyLive(doc, mapsById), doc.plans).find((l) => l.planIndex === planIndex && l.scenarioIndex === scenarioIndex && l.rowIndex === rowIndex) ??
    null;
  const points = line ? line.line.points.filter((p): p is SolvedPoint => p.solved) : [];

  const rpm = channels.engineSpeed!;
  const means = (values: Float64Array | undefined) => new Map(values ? bandMeans(rpm, values, used).map((b) => [b.rpm, b]) : []);
  const boostBands = means(boost);
  const flowBands = means(placed.correctedMassFlow);
  const ratioBands = means(placed.pressureRatio);
  const shaftBands = means(channels.shaftSpeed);
  const exhaustBands = means(channels.exhaustPressure);
  const bands: BandRow[] = [...boostBands.values()].map((b) => ({
    rpm: b.rpm,
    samples: b.samples,
    measured: {
      boost: b.value,
      correctedMassFlow: flowBands.get(b.rpm)?.value ?? null,
      pressureRatio: ratioBands.get(b.rpm)?.value ?? null,
      shaftSpeed: shaftBands.get(b.rpm)?.value ?? null,
      exhaustPressure: exhaustBands.get(b.rpm)?.value ?? null,
    },
    predicted: {
      boost: lineValueAt(points, b.rpm, (p) => p.values.boost),
      correctedMassFlow: lineValueAt(points, b.rpm, (p) => p.values.correctedMassFlow),
      pressureRatio: lineValueAt(points, b.rpm, (p) => p.values.pressureRatio),
      shaftSpeed: lineValueAt(points, b.rpm, (p) => p.values.shaftSpeed),
      exhaustPressure: lineValueAt(points, b.rpm, (p) => p.values.turbineInletPressure),
    },
  }));

  const fit = fitVolumetricEfficiency(
    channels,
    used,
    { displacement: doc.engine.displacement, strokes: doc.engine.strokes, stoichiometricAfr: studyStoichiometricAfr(doc) },
    DEFAULT_FIT_SETTINGS,
  );
  const measured = measuredBoostThreshold(rpm, boost, used, boostTargetAt(doc, scenarioIndex));
  const exhaust = line?.line.exhaust ?? null;
  const threshold = exhaust
    ? {
        measured,
        predicted: exhaust.boostThresholdRpm,
        predictedNote: exhaust.boostThresholdRpm === null ? 'the turbine holds the target at no engine speed of the line' : 'from the plan’s turbine',
      }
    : { measured, predicted: null, predictedNote: 'the plan has no turbine map, so the prediction takes every boost target as held' };
  return { segments, used, placed, boost, line, map, bands, fit, threshold };
}

/** The study's VE at each fitted band, for the table beside the fit. */
export function studyVeAt(doc: StudyDocument, rpm: number): number {
  return valueAtRpm(doc.engine.volumetricEfficiency, rpm);
}
