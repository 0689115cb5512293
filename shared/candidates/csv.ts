/** The Candidates table as CSV: one row per map, the columns checks rely on (docs/api.md). */
import type { CsvCell } from '../csv';
import { VERDICT_WORDS } from '../matching/verdict';
import type { CompressorCandidate, TurbineCandidate, ValueWhere } from './types';

/** The columns of candidates.csv, exactly. */
export const CANDIDATE_CSV_FIELDS = ['Map', 'Kind', 'Verdict', 'First reason', 'Worst surge margin', 'Worst choke margin', 'Worst speed margin'] as const;

/** A margin as a fraction with four decimals (0.0123 = 1.23 %); empty where no point has one. */
const margin = (m: ValueWhere | null): CsvCell => (m === null ? '' : Math.round(m.value * 10_000) / 10_000);

/** One CSV row per candidate, in the order given. */
export function candidateCsvRows(list: ReadonlyArray<CompressorCandidate | TurbineCandidate>, kind: 'compressor' | 'turbine'): CsvCell[][] {
  return list.map((c) => [
    c.mapName,
    kind,
    VERDICT_WORDS[c.verdict.status],
    c.verdict.firstReason ?? '',
    margin(c.worstSurgeMargin),
    margin(c.worstChokeMargin),
    margin(c.worstSpeedMargin),
  ]);
}
