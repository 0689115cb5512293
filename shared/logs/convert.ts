/**
 * A read table and its mapping become SI channels: each mapped column converted once as a straight
 * line (gauge pressures lifted by the barometric pressure), rows without time, engine speed or
 * manifold pressure skipped and counted, and values that cannot be the quantity in the unit given
 * refused with their line and column and, where one fits, the unit they look like.
 */
import { columnToSI, gaugeReferenceOf, type LogMapping } from './mapping';
import { LOG_QUANTITY_INFO, REQUIRED_QUANTITIES, type LogQuantity } from './quantities';
import type { LogTable, ReadProblem } from './read';

export type LogChannels = Partial<Record<LogQuantity, Float64Array>>;

/** A log in SI, rows in time order: what is stored and computed on. */
export interface MappedLog {
  channels: LogChannels;
  rowCount: number;
  /** Seconds from the first to the last sample. */
  duration: number;
  /** Rows left out and why (the reasons in words, with counts). */
  skipped: { reason: string; rows: number }[];
}

export type MapResult = { ok: true; log: MappedLog } | { ok: false; problems: ReadProblem[] };

/** Share of rows that may be skipped before the log is refused as unreadable. */
const MAX_SKIPPED_SHARE = 0.1;

function median(values: Float64Array): number {
  const finite = Array.from(values).filter(Number.isFinite);
  if (finite.length === 0) return Number.NaN;
  // A sample of at most 10 001 values is enough to tell a unit.
  const stride = Math.max(1, Math.floor(finite.length / 10_001));
  const sample = finite.filter((_, i) => i % stride === 0).sort((a, b) => a - b);
  return sample[Math.floor(sample.length / 2)];
}

function formatNumber(v: number): string {
  return Number.isInteger(v) ? String(v) : String(Number(v.toPrecision(4)));
}

/** Another unit of the quantity in which the raw median would make sense, for the message. */
function likelyUnit(quantity: LogQuantity, rawMedian: number, lift: number, unit: string): string | null {
  const info = LOG_QUANTITY_INFO[quantity];
  const [lo, hi] = info.typical ?? info.limits;
  for (const u of info.units) {
    if (u.unit === unit) continue;
    const { scale, offset } = columnToSI(quantity, u.unit);
    for (const extra of info.pressure ? [0, lift] : [0]) {
      const si = rawMedian * scale + offset + extra;
      if (si >= lo && si <= hi) return `${u.label}${info.pressure ? (extra ? ' gauge' : ' absolute') : ''}`;
    }
  }
  return null;
}

export function applyMapping(table: LogTable, mapping: LogMapping): MapResult {
  const problems: ReadProblem[] = [];
  const firstLine = table.rowLines[0] ?? 1;
  const indexOf = new Map(table.names.map((n, i) => [n, i]));
  const located = mapping.columns.map((c) => ({ ...c, index: indexOf.get(c.column) }));
  for (const c of located)
    if (c.index === undefined)
      problems.push({
        line: table.namesLine ?? firstLine,
        message: `The mapping names column "${c.column}", which the file does not have (its columns: ${table.names
          .slice(0, 30)
          .map((n) => `"${n}"`)
          .join(', ')}).`,
      });
  if (problems.length) return { ok: false, problems };

  const n = table.rowCount;
  const raw = new Map<LogQuantity, { values: Float64Array; column: number; unit: string; gauge: boolean }>();
  for (const c of located) raw.set(c.quantity, { values: table.columns[c.index!], column: c.index!, unit: c.unit, gauge: c.reference === 'gauge' });

  // Barometric pressure first: gauge readings are lifted by it, sample by sample.
  const si = new Map<LogQuantity, Float64Array>();
  const convert = (q: LogQuantity, lift: Float64Array | number | null) => {
    const r = raw.get(q)!;
    const { scale, offset } = columnToSI(q, r.unit);
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const extra = lift === null ? 0 : typeof lift === 'number' ? lift : lift[i];
      out[i] = r.values[i] * scale + offset + extra;
    }
    si.set(q, out);
  };
  if (raw.has('ambientPressure')) convert('ambientPressure', null);
  const baro = si.get('ambientPressure') ?? gaugeReferenceOf(mapping);
  for (const q of raw.keys()) if (q !== 'ambientPressure') convert(q, raw.get(q)!.gauge ? baro : null);

  // Limits: a value no sensor of this quantity gives means the unit (or reference) is wrong.
  for (const [q, values] of si) {
    const info = LOG_QUANTITY_INFO[q];
    const r = raw.get(q)!;
    const columnName = table.names[r.column];
    let first = -1;
    let count = 0;
    for (let i = 0; i < n; i++) {
      const v = values[i];
      if (Number.isFinite(v) && (v < info.limits[0] || v > info.limits[1])) {
        if (first === -1) first = i;
        count++;
      }
    }
    const rawMedian = median(r.values);
    const typicalMedian = median(values);
    const lift = typeof baro === 'number' ? baro : median(baro);
    const hint = (value: number) => {
      const other = likelyUnit(q, value, lift, r.unit);
      return other ? ` The values look like ${other}; check the unit${info.pressure ? ' and whether it is absolute or gauge' : ''}.` : '';
    };
    const unitLabel = info.units.find((u) => u.unit === r.unit)?.label ?? r.unit;
    if (first !== -1) {
      problems.push({
        line: table.rowLines[first],
        column: r.column + 1,
        message: `${info.label} in column "${columnName}": ${formatNumber(r.values[first])} ${unitLabel}${info.pressure ? (r.gauge ? ' gauge' : ' absolute') : ''} is outside ${info.limitWords} (${count} value${count === 1 ? '' : 's'} in all).${hint(r.values[first])}`,
      });
    } else if (info.typical && Number.isFinite(typicalMedian) && (typicalMedian < info.typical[0] || typicalMedian > info.typical[1])) {
      problems.push({
        line: firstLine,
        column: r.column + 1,
        message: `${info.label} in column "${columnName}": the middle value is ${formatNumber(rawMedian)}, outside ${info.limitWords}. Is this an air-fuel ratio rather than lambda?`,
      });
    }
  }
  if (problems.length) return { ok: false, problems };

  // Rows without the quantities every point needs are skipped and counted, by reason.
  const keep = new Uint8Array(n).fill(1);
  const skipped: { reason: string; rows: number }[] = [];
  if (table.raggedRows) skipped.push({ reason: 'the row has another number of fields than the column names', rows: table.raggedRows });
  for (const q of REQUIRED_QUANTITIES) {
    const values = si.get(q)!;
    let count = 0;
    for (let i = 0; i < n; i++)
      if (keep[i] && !Number.isFinite(values[i])) {
        keep[i] = 0;
        count++;
      }
    const ragged = q === REQUIRED_QUANTITIES[0] ? table.raggedRows : 0;
    if (count - ragged > 0) skipped.push({ reason: `no readable ${LOG_QUANTITY_INFO[q].label.toLowerCase()}`, rows: count - ragged });
  }
  let kept = 0;
  for (let i = 0; i < n; i++) kept += keep[i];
  const skippedRows = n - kept;
  if (kept < 2 || skippedRows > n * MAX_SKIPPED_SHARE) {
    const why = skipped.map((s) => `${s.rows} because ${s.reason}`).join('; ');
    return {
      ok: false,
      problems: [
        {
          line: firstLine,
          message: `${skippedRows} of ${n} rows cannot be used (${why}); at most ${MAX_SKIPPED_SHARE * 100} % may be skipped and at least 2 rows must remain.`,
        },
        ...table.problems,
      ],
    };
  }

  const channels: LogChannels = {};
  for (const [q, values] of si) {
    const out = new Float64Array(kept);
    for (let i = 0, k = 0; i < n; i++) if (keep[i]) out[k++] = values[i];
    channels[q] = out;
  }
  const time = channels.time!;
  const timeColumn = raw.get('time')!.column + 1;
  for (let i = 1, k = 1; i < n; i++) {
    if (!keep[i]) continue;
    if (time[k] < time[k - 1])
      return {
        ok: false,
        problems: [
          {
            line: table.rowLines[i],
            column: timeColumn,
            message: `Time goes backwards here (${formatNumber(time[k])} s after ${formatNumber(time[k - 1])} s): a log must be in time order; split joined logs into separate files.`,
          },
        ],
      };
    k++;
  }
  const duration = time[kept - 1] - time[0];
  if (!(duration > 0))
    return { ok: false, problems: [{ line: firstLine, column: timeColumn, message: 'Every row has the same time: the log covers no time at all.' }] };
  return { ok: true, log: { channels, rowCount: kept, duration, skipped } };
}
