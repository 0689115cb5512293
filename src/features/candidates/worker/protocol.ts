/** What the main thread and the ranking worker say to each other. */
import type { CandidateMap, CompressorCandidate, TurbineCandidate } from '#shared/candidates';
import type { StudyDocument } from '#shared/schemas/study';

export type RankRequest =
  | { id: number; kind: 'compressor'; doc: StudyDocument; templateId: string; maps: CandidateMap[] }
  | { id: number; kind: 'turbine'; doc: StudyDocument; templateId: string; compressor: { id: string; map: CandidateMap['map'] }; maps: CandidateMap[] };

export type RankMessage =
  | { id: number; type: 'progress'; done: number; total: number }
  | { id: number; type: 'done'; compressors: CompressorCandidate[]; turbines: TurbineCandidate[] }
  | { id: number; type: 'error'; message: string };
