/**
 * Largest-triangle-three-buckets (Steinarsson, "Downsampling Time Series for Visual
 * Representation", University of Iceland, 2013): keeps the first and last point and, from each
 * bucket between, the point spanning the largest triangle with its neighbours, so peaks survive.
 * Answers the indices kept.
 */
export function largestTriangleThreeBuckets(x: ArrayLike<number>, y: ArrayLike<number>, threshold: number): number[] {
  const n = x.length;
  if (threshold >= n || threshold < 3) return Array.from({ length: n }, (_, i) => i);
  const kept = [0];
  const every = (n - 2) / (threshold - 2);
  let a = 0;
  for (let b = 0; b < threshold - 2; b++) {
    const nextStart = Math.floor((b + 1) * every) + 1;
    const nextEnd = Math.min(Math.floor((b + 2) * every) + 1, n);
    let avgX = 0;
    let avgY = 0;
    for (let j = nextStart; j < nextEnd; j++) {
      avgX += x[j];
      avgY += y[j];
    }
    const span = Math.max(1, nextEnd - nextStart);
    avgX /= span;
    avgY /= span;
    const start = Math.floor(b * every) + 1;
    const end = Math.floor((b + 1) * every) + 1;
    let best = start;
    let bestArea = -1;
    for (let j = start; j < end; j++) {
      const area = Math.abs((x[a] - avgX) * (y[j] - y[a]) - (x[a] - x[j]) * (avgY - y[a]));
      if (area > bestArea) {
        bestArea = area;
        best = j;
      }
    }
    kept.push(best);
    a = best;
  }
  kept.push(n - 1);
  return kept;
}

/** The finite points of a pair of arrays among the used rows, as indices. */
export function finiteIndices(x: ArrayLike<number>, y: ArrayLike<number>, used?: Uint8Array): number[] {
  const out: number[] = [];
  for (let i = 0; i < x.length; i++) if ((!used || used[i]) && Number.isFinite(x[i]) && Number.isFinite(y[i])) out.push(i);
  return out;
}
