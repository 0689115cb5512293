import type { AxisScale } from '#shared/tracer/axes';

/**
 * Round values for a grid over a range: 1, 2 or 5 times a power of ten apart on a linear axis,
 * decades (with 2 and 5 between when there are few) on a logarithmic one. At most about `target`
 * lines, never more than 60.
 */
export function gridValues(min: number, max: number, scale: AxisScale, target = 8): number[] {
  if (!Number.isFinite(min) || !Number.isFinite(max) || max <= min) return [];
  if (scale === 'log') {
    if (max <= 0) return [];
    const low = Math.floor(Math.log10(Math.max(min, max * 1e-12)));
    const high = Math.ceil(Math.log10(max));
    const decades = high - low;
    const steps = decades <= 2 ? [1, 2, 5] : decades <= 6 ? [1] : [];
    const values: number[] = [];
    for (let e = low; e <= high && values.length < 60; e++) {
      for (const m of steps.length ? steps : [1]) {
        const v = Number((m * 10 ** e).toPrecision(12));
        if (v >= min && v <= max) values.push(v);
      }
    }
    return values;
  }
  const rough = (max - min) / target;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((m) => m * power).find((s) => s >= rough) ?? 10 * power;
  const values: number[] = [];
  for (let v = Math.ceil(min / step) * step; v <= max && values.length < 60; v += step) values.push(Number(v.toPrecision(12)));
  return values;
}

/** A grid value as a short label: 0.05, 1.5, 120000. */
export function gridLabel(value: number): string {
  return String(Number(value.toPrecision(6)));
}
