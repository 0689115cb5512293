import type { PlanePoint } from '#shared/tracer/affine';
import type { TraceBuild } from '#shared/tracer/build';
import { pixelToData } from '#shared/tracer/calibration';
import type { AxisQuantity } from '#shared/tracer/state';

function format(value: number): string {
  return Number.isFinite(value) ? String(Number(value.toPrecision(5))) : '—';
}

/** The map values at a spot of the picture ("flow 0.12 kg/s, PR 2.1"), or null before calibration. */
export function valuesAt(build: TraceBuild, q: { x: AxisQuantity; y: AxisQuantity }, pixel: PlanePoint): string | null {
  if (!build.calibration.ok) return null;
  const data = pixelToData(build.calibration.calibration, pixel);
  const unit = (u: string | null) => (u ? ` ${u}` : '');
  return `${q.x.name} ${format(data.x)}${unit(q.x.unit)}, ${q.y.short} ${format(data.y)}${unit(q.y.unit)}`;
}
