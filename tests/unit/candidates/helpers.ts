import type { CandidateMap } from '#shared/candidates';
import type { CompressorCurve, CompressorMap } from '#shared/maps/types';
import { studyDocumentSchema, type StudyDocument } from '#shared/schemas/study';
import { baseStudy } from '../matching/fixtures';

/**
 * A hand-made, invented compressor map wide enough for the base study: four speed lines from
 * 0.02 to 1.0 kg/s (× `flowFactor`), each falling gently in pressure ratio, one efficiency all over.
 * Scaling the flows makes an obvious family: too small (everything past choke), right, too large
 * (everything left of surge).
 */
export function boxMap(name: string, flowFactor: number, efficiency = 0.75): CompressorMap {
  const lines: Array<[number, number]> = [
    [60_000, 1.2],
    [100_000, 1.8],
    [140_000, 2.6],
    [180_000, 3.4],
  ];
  const flows = [0.02, 0.1, 0.3, 0.6, 1.0];
  const speed: CompressorCurve[] = lines.map(([n, top]) => ({
    kind: 'speed',
    label: String(n),
    points: flows.map((f) => ({ correctedMassFlow: f * flowFactor, pressureRatio: top - 0.1 * f, efficiency, speed: n })),
  }));
  const edge = (i: number): CompressorCurve['points'] => speed.map((l) => ({ ...l.points[i], efficiency: null, speed: null }));
  return {
    kind: 'compressor',
    formatVersion: 1,
    name,
    notes: [],
    reference: { temperature: 298.15, pressure: 100_000 },
    maxSpeed: 200_000,
    curves: [{ kind: 'surge', label: '', points: edge(0) }, { kind: 'choke', label: '', points: edge(flows.length - 1) }, ...speed],
    fileUnits: {
      flowAxis: 'corrected-mass',
      flowUnit: 'kg/s',
      referenceTemperatureUnit: 'K',
      referencePressureUnit: 'Pa',
      efficiency: 'fraction',
      speedUnit: 'rpm',
      maxSpeedUnit: 'rpm',
    },
  };
}

export const candidate = (map: CompressorMap, origin: CandidateMap['origin'] = 'team'): CandidateMap => ({
  id: `map-${map.name}`,
  name: map.name,
  origin,
  map,
});

/** The base study as a saved document with one plan and no map. */
export function baseDocument(): StudyDocument {
  const study = baseStudy();
  return studyDocumentSchema.parse({
    schemaVersion: 2,
    engineLabel: 'test engine',
    notes: '',
    ...study,
    plans: study.plans.map((p, i) => ({ ...p, id: `plan-${i + 1}`, compressorMapId: null })),
  });
}
