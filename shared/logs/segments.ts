/**
 * Parts of a log worth comparing with the prediction: full-load pulls (throttle at or above a set
 * opening while engine speed rises) and steady holds (engine speed held within a band). Row
 * indices are of the stored (SI) log.
 */
import type { LogChannels } from './convert';

export interface LogSegment {
  kind: 'pull' | 'hold';
  /** First and last row, inclusive. */
  start: number;
  end: number;
  /** Time of the first and last row, s. */
  startTime: number;
  endTime: number;
  /** Engine speed at the first and last row, rpm. */
  rpmFrom: number;
  rpmTo: number;
}

export interface SegmentSettings {
  /** Throttle opening a pull needs, fraction (common practice: wide open is above 90 %). */
  throttleMin: number;
  /** Engine speed a pull must gain, rpm. */
  minRise: number;
  /** Drop below the pull's highest engine speed so far that ends it, rpm (sensor noise). */
  dipAllowed: number;
  /** A hold's engine speed stays within this share of its first speed, fraction. */
  holdBand: number;
  /** Shortest hold, s. */
  minHold: number;
}

const DEFAULT_SEGMENT_SETTINGS: SegmentSettings = { throttleMin: 0.9, minRise: 1000, dipAllowed: 150, holdBand: 0.03, minHold: 2 };

/** Pulls and holds in time order. Without a throttle channel a pull is any run of rising engine speed. */
export function detectSegments(channels: LogChannels, settings: SegmentSettings = DEFAULT_SEGMENT_SETTINGS): LogSegment[] {
  const time = channels.time!;
  const rpm = channels.engineSpeed!;
  const throttle = channels.throttle;
  const n = time.length;
  const segment = (kind: LogSegment['kind'], start: number, end: number): LogSegment => ({
    kind,
    start,
    end,
    startTime: time[start],
    endTime: time[end],
    rpmFrom: rpm[start],
    rpmTo: rpm[end],
  });
  const open = (i: number) => !throttle || !(throttle[i] < settings.throttleMin);
  const pulls: LogSegment[] = [];
  let i = 0;
  while (i < n) {
    if (!open(i)) {
      i++;
      continue;
    }
    // Start at the lowest speed of the open run's first stretch.
    let start = i;
    let top = rpm[i];
    let topAt = i;
    let j = i + 1;
    while (j < n && open(j) && rpm[j] >= top - settings.dipAllowed) {
      if (rpm[j] < rpm[start] && topAt === start) start = j;
      if (rpm[j] > top) {
        top = rpm[j];
        topAt = j;
      }
      j++;
    }
    if (top - rpm[start] >= settings.minRise && topAt > start) pulls.push(segment('pull', start, topAt));
    i = Math.max(j, i + 1);
  }
  const inPull = new Uint8Array(n);
  for (const p of pulls) inPull.fill(1, p.start, p.end + 1);
  const holds: LogSegment[] = [];
  i = 0;
  while (i < n) {
    if (inPull[i] || !(rpm[i] > 0)) {
      i++;
      continue;
    }
    const band = rpm[i] * settings.holdBand;
    let j = i;
    while (j + 1 < n && !inPull[j + 1] && Math.abs(rpm[j + 1] - rpm[i]) <= band) j++;
    if (time[j] - time[i] >= settings.minHold) {
      holds.push(segment('hold', i, j));
      i = j + 1;
    } else i++;
  }
  return [...pulls, ...holds].sort((a, b) => a.start - b.start);
}

/** Rows used: those inside the chosen segments; all rows when `segments` is null (nothing chosen and no pull found). */
export function usedRows(rowCount: number, segments: readonly Pick<LogSegment, 'start' | 'end'>[] | null): Uint8Array {
  const used = new Uint8Array(rowCount);
  if (segments === null) return used.fill(1);
  for (const s of segments) used.fill(1, Math.max(0, s.start), Math.min(rowCount, s.end + 1));
  return used;
}

/** The segments a log is compared on: the user's choice, else the detected pulls, else (null) every row. */
export function chosenSegments(selection: readonly { start: number; end: number }[] | null, detected: readonly LogSegment[]) {
  if (selection) return selection;
  const pulls = detected.filter((s) => s.kind === 'pull');
  return pulls.length ? pulls : null;
}
