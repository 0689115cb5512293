/**
 * Candidates: every map of a library judged against one study and ranked (compressors on their own;
 * turbine housings with a chosen compressor), and the CSV table the server serves of it.
 */
export * from './types';
export {
  COMPRESSOR_ORDER_WORDS,
  compressorRanking,
  judgeCompressor,
  mapCapacity,
  rankCompressors,
  sortCompressorCandidates,
  type CompressorOrder,
} from './compressors';
export { judgeTurbine, rankTurbines, sortTurbineCandidates } from './turbines';
export { MAX_PLANS, templatePlan, withCandidatePlan } from './plan';
export { CANDIDATE_CSV_FIELDS, candidateCsvRows } from './csv';
