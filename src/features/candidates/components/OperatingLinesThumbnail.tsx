import type { LineTrace } from '#shared/candidates';
import type { CompressorMap } from '#shared/maps/types';

const W = 132;
const H = 84;
const PAD = 4;

/**
 * A small drawing of the study's operating lines on one compressor map: the map's edge (surge and
 * choke lines, speed lines) in graphite, the lines in teal, points the map cannot deliver in red.
 * Corrected flow across, pressure ratio up, both linear, each map on its own scale.
 */
export function OperatingLinesThumbnail({ map, traces, label }: { map: CompressorMap; traces: readonly LineTrace[]; label: string }) {
  const mapPoints = map.curves.filter((c) => c.kind !== 'island').flatMap((c) => c.points);
  const flows = [...mapPoints.map((p) => p.correctedMassFlow), ...traces.flatMap((t) => t.flows)];
  const ratios = [...mapPoints.map((p) => p.pressureRatio), ...traces.flatMap((t) => t.ratios)];
  const xMax = Math.max(...flows) * 1.05;
  const yMin = 1;
  const yMax = Math.max(...ratios) * 1.03;
  const x = (f: number) => PAD + (f / xMax) * (W - 2 * PAD);
  const y = (r: number) => H - PAD - ((r - yMin) / (yMax - yMin)) * (H - 2 * PAD);
  const path = (pts: ReadonlyArray<{ f: number; r: number }>) => pts.map((p, i) => `${i === 0 ? 'M' : 'L'}${x(p.f).toFixed(1)},${y(p.r).toFixed(1)}`).join('');
  const curve = (kind: 'surge' | 'choke' | 'speed') =>
    map.curves.filter((c) => c.kind === kind).map((c) => path(c.points.map((p) => ({ f: p.correctedMassFlow, r: p.pressureRatio }))));
  return (
    <svg viewBox={`0 0 ${W} ${H}`} width={W} height={H} role="img" aria-label={label} className="rounded-sm border border-paper-line bg-paper">
      {curve('speed').map((d, i) => (
        <path key={`s${i}`} d={d} fill="none" stroke="currentColor" strokeOpacity={0.25} strokeWidth={0.8} />
      ))}
      {curve('surge').map((d, i) => (
        <path key={`u${i}`} d={d} fill="none" stroke="currentColor" strokeOpacity={0.8} strokeWidth={1.2} />
      ))}
      {curve('choke').map((d, i) => (
        <path key={`c${i}`} d={d} fill="none" stroke="currentColor" strokeOpacity={0.5} strokeWidth={1} strokeDasharray="3 2" />
      ))}
      {traces.map((t, i) => (
        <g key={`t${i}`}>
          <path d={path(t.flows.map((f, k) => ({ f, r: t.ratios[k] })))} fill="none" className="stroke-teal" strokeWidth={1.2} />
          {t.flows.map((f, k) => (t.reachable[k] ? null : <circle key={k} cx={x(f)} cy={y(t.ratios[k])} r={1.6} className="fill-limit" />))}
        </g>
      ))}
    </svg>
  );
}
