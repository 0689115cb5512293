import { useMemo } from 'react';
import type { Finding, FindingCode, Severity } from '#shared/matching/finding';
import { planColour } from '../plots/style';
import { sameRpm, type PointRef, type StudyLine } from './lines';
import { formatNumber, formatStudyValue, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

/** One finding of one line, at every rpm where it was raised. */
export interface FindingGroup {
  id: string;
  severity: Severity;
  code: FindingCode;
  line: StudyLine;
  /** The first point's finding (its message is the one shown). */
  finding: Finding;
  rpms: number[];
}

const ORDER: Severity[] = ['limit', 'warning', 'info'];

const SEVERITY_TEXT: Record<Severity, { title: string; hint: string }> = {
  limit: {
    title: 'Limits crossed',
    hint: 'Hard limits: points the compressor cannot deliver (surge, choke, overspeed, off the map), saturated injectors, lean under boost, stated limits.',
  },
  warning: { title: 'Warnings', hint: 'Margins thinner than the study requires, close to a limit, or outside what the map or common practice covers.' },
  info: { title: 'Notes', hint: 'Worth knowing; usually expected (part throttle, light load).' },
};

/** The findings of the lines, one group per line and kind of finding, most severe first. */
export function groupFindings(lines: readonly StudyLine[]): FindingGroup[] {
  const groups = new Map<string, FindingGroup>();
  for (const line of lines) {
    for (const point of line.line.points) {
      for (const f of point.findings) {
        // Input findings repeat the same words on every line; key by message too so different ones stay apart.
        const id = `${line.key}|${f.code}|${f.severity}${f.code === 'input-out-of-range' ? `|${f.message.replace(/[\d.,−-]+/g, '#')}` : ''}`;
        const group = groups.get(id);
        if (group) {
          if (!group.rpms.some((r) => sameRpm(r, point.rpm))) group.rpms.push(point.rpm);
        } else groups.set(id, { id, severity: f.severity, code: f.code, line, finding: f, rpms: [point.rpm] });
      }
    }
  }
  return [...groups.values()].sort((a, b) => ORDER.indexOf(a.severity) - ORDER.indexOf(b.severity));
}

/**
 * A finding's words in the user's units. The engine words its messages in SI ("478 K (205 °C)",
 * "250 kPa", "38.0 mm"); for US customary those amounts are rewritten, the rest of the sentence stays.
 */
export function localizeMessage(message: string, system: UnitSystem): string {
  if (system === 'si') return message;
  return message
    .replace(/(-?[\d.]+(?:e[-+]?\d+)?) K \(−?-?[\d.]+ °C\)/g, (_m, kelvin: string) => formatStudyValue(Number(kelvin), 'temperature', system))
    .replace(/(−|-)?([\d.]+(?:e[-+]?\d+)?) kPa/g, (_m, minus: string | undefined, kpa: string) =>
      formatStudyValue((minus ? -1 : 1) * Number(kpa) * 1000, 'pressure', system),
    )
    .replace(/([\d.]+) mm\b/g, (_m, mm: string) => formatStudyValue(Number(mm) / 1000, 'diameter', system));
}

function rpmSpan(rpms: number[]): string {
  const sorted = [...rpms].sort((a, b) => a - b);
  const first = formatNumber(sorted[0], 21);
  return sorted.length === 1 ? `at ${first} rpm` : `at ${sorted.length} speeds, ${first}–${formatNumber(sorted[sorted.length - 1], 21)} rpm`;
}

const SEVERITY_STYLE: Record<Severity, { mark: string; box: string }> = {
  limit: { mark: 'bg-limit text-white', box: 'border-limit/40' },
  warning: { mark: 'bg-copper-ink text-white', box: 'border-copper/40' },
  info: { mark: 'bg-teal-light text-teal-dark', box: 'border-paper-line' },
};

/** A short name for each kind of finding, to head its list of lines (kinds added later read from their code). */
export const FINDING_TITLES: Partial<Record<string, string>> = {
  unsolvable: 'No solution at these inputs',
  'map-estimate': 'Compressor map is an estimate',
  'input-out-of-range': 'Input outside the usual range',
  'injector-duty-high': 'Injector duty above the usual ceiling',
  'injector-duty-limit': 'Injector duty over the limit',
  'injector-saturated': 'Injectors saturated',
  'injector-no-flow': 'No pressure left across the injectors',
  'fuel-pump-short': 'Fuel pump too small',
  'fuel-pump-near-limit': 'Fuel pump close to its limit',
  'compressor-outlet-temperature-high': 'Compressor outlet temperature high',
  'compressor-outlet-temperature-limit': 'Compressor outlet temperature over the stated limit',
  'efficiency-off-map': 'No efficiency from the map (the plan’s default is used)',
  'map-left-of-surge': 'Left of the surge line: not reachable',
  'map-beyond-choke': 'Past choke: not reachable',
  'map-above-top-speed': 'Above the top speed line: not reachable',
  'map-below-map': 'Below the map',
  'map-off-map': 'Outside the map’s speed lines: not reachable',
  overspeed: 'Shaft speed over the limit',
  throttled: 'Throttled: manifold below compressor inlet pressure',
  'not-converged': 'Manifold temperature did not settle',
  'rpm-limit': 'Above the rpm limit',
  'manifold-pressure-limit': 'Manifold pressure over the stated limit',
  'boost-target-not-held': 'Boost target not reached',
  'wastegate-too-small': 'Wastegate too small',
  'drive-pressure-ratio-high': 'Drive pressure ratio high',
  'turbine-off-map': 'Turbine point off its map',
  'turbine-efficiency-assumed': 'Turbine efficiency assumed',
  'turbine-map-missing': 'No turbine map',
  'turbine-housing-mismatch': 'Turbine housing does not match its map',
  'exhaust-not-converged': 'Exhaust side did not settle',
  'throttle-sets-boost': 'The throttle sets the boost',
  'surge-margin-thin': 'Surge margin thinner than required',
  'choke-margin-thin': 'Choke margin thinner than required',
  'speed-margin-thin': 'Speed margin thinner than required',
  'lean-under-boost': 'Leaner under boost than the study accepts',
  'lean-under-boost-limit': 'Lean under boost: past the limit',
  'off-map-assumption': 'Computed on the off-map efficiency assumption',
};

export function findingTitle(code: FindingCode): string {
  const title = FINDING_TITLES[code];
  if (title) return title;
  const words = code.replace(/-/g, ' ');
  return words.charAt(0).toUpperCase() + words.slice(1);
}

function LineFinding({ group, selected, onSelect }: { group: FindingGroup; selected: PointRef | null; onSelect: (point: PointRef) => void }) {
  const unitSystem = useUnitSystem();
  const rpms = [...group.rpms].sort((a, b) => a - b);
  const isSelected = selected !== null && selected.lineKey === group.line.key && rpms.some((r) => sameRpm(r, selected.rpm));
  const message = localizeMessage(group.finding.message, unitSystem);
  return (
    <li className={`rounded-md border bg-white/70 text-sm ${SEVERITY_STYLE[group.severity].box} ${isSelected ? 'ring-2 ring-teal' : ''}`}>
      <button
        type="button"
        onClick={() => onSelect({ lineKey: group.line.key, rpm: rpms[0] })}
        className="block w-full rounded-md px-3 py-1.5 text-left hover:bg-paper-deep/40"
      >
        {/* The name read out is the visible text with the finding's title before it (WCAG 2.5.3). */}
        <span className="sr-only">{findingTitle(group.code)}: </span>
        <span className="flex items-start gap-2">
          <span aria-hidden="true" className="mt-1.5 inline-block size-2.5 shrink-0 rounded-full" style={{ background: planColour(group.line.planIndex) }} />
          <span className="min-w-0">
            <span className="text-ink">{group.line.label}</span>
            <span className="text-ink-soft"> · {rpmSpan(rpms)}</span>
            <span className="block text-xs text-ink-soft">{message}</span>
            <span className="sr-only"> Show on the plots.</span>
          </span>
        </span>
      </button>
      {rpms.length > 1 && (
        <div className="flex flex-wrap gap-1 px-3 pb-2 pl-7" role="group" aria-label={`Speeds of ${group.line.label}`}>
          {rpms.map((rpm) => {
            const here = selected !== null && selected.lineKey === group.line.key && sameRpm(selected.rpm, rpm);
            return (
              <button
                key={rpm}
                type="button"
                aria-pressed={here}
                aria-label={`${formatNumber(rpm, 21)} rpm`}
                onClick={() => onSelect({ lineKey: group.line.key, rpm })}
                className={`numeric min-h-6 min-w-6 rounded border px-1.5 py-0.5 text-xs ${here ? 'border-teal bg-teal text-white' : 'border-ink/15 bg-white text-ink-soft hover:border-teal hover:text-teal-dark'}`}
              >
                {formatNumber(rpm, 21)}
              </button>
            );
          })}
        </div>
      )}
    </li>
  );
}

/**
 * The findings of a study by severity (red only for limits), then by kind, one entry per line
 * with the speeds where it was raised. Clicking a line or a speed selects that point: the map,
 * the curves and the table highlight it and the Working shows it.
 */
export function FindingsList({ lines, selected, onSelect }: { lines: readonly StudyLine[]; selected: PointRef | null; onSelect: (point: PointRef) => void }) {
  const groups = useMemo(() => groupFindings(lines), [lines]);
  if (groups.length === 0) {
    return <p className="text-sm text-ink-soft">No findings: every point is inside the map with no limit crossed.</p>;
  }
  return (
    <div className="max-h-[40rem] space-y-3 overflow-y-auto pr-1" data-testid="findings">
      {ORDER.map((severity) => {
        const list = groups.filter((g) => g.severity === severity);
        if (list.length === 0) return null;
        const text = SEVERITY_TEXT[severity];
        const codes = [...new Set(list.map((g) => g.code))];
        return (
          <section key={severity} aria-label={text.title} className="space-y-2">
            <div>
              <h4 className="flex items-baseline gap-2">
                <span className={`rounded px-1.5 py-0.5 text-xs font-bold uppercase tracking-wide ${SEVERITY_STYLE[severity].mark}`}>{severity}</span>
                <span className="font-semibold text-ink">{text.title}</span>
              </h4>
              <p className="text-xs text-ink-faint">{text.hint}</p>
            </div>
            {codes.map((code) => {
              const ofCode = list.filter((g) => g.code === code);
              const points = ofCode.reduce((n, g) => n + g.rpms.length, 0);
              const hasSelected = selected !== null && ofCode.some((g) => g.line.key === selected.lineKey && g.rpms.some((r) => sameRpm(r, selected.rpm)));
              return (
                <details key={code} open={severity === 'limit' || hasSelected} className="rounded-md border border-paper-line bg-paper/40">
                  <summary className="cursor-pointer px-3 py-1.5 text-sm marker:text-ink-faint">
                    <span className="font-semibold text-ink">{findingTitle(code)}</span>
                    <span className="text-ink-soft">
                      {' '}
                      · {ofCode.length} {ofCode.length === 1 ? 'line' : 'lines'}, {points} {points === 1 ? 'point' : 'points'}
                    </span>
                  </summary>
                  <ul className="space-y-1.5 px-2 pb-2">
                    {ofCode.map((g) => (
                      <LineFinding key={g.id} group={g} selected={selected} onSelect={onSelect} />
                    ))}
                  </ul>
                </details>
              );
            })}
          </section>
        );
      })}
    </div>
  );
}
