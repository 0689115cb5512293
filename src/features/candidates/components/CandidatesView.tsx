import { useMemo, useState } from 'react';
import {
  COMPRESSOR_ORDER_WORDS,
  sortCompressorCandidates,
  sortTurbineCandidates,
  type CandidateMap,
  type CandidateOrigin,
  type CompressorCandidate,
  type CompressorOrder,
  type TurbineCandidate,
} from '#shared/candidates';
import type { VerdictStatus } from '#shared/matching/verdict';
import type { StudyDocument } from '#shared/schemas/study';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { VerdictStamp } from '#src/components/study/PlanVerdicts';
import type { UnitSystem } from '#src/lib/quantities';
import { useCandidateMaps } from '../api/get-candidate-maps';
import { useRanking } from '../use-ranking';
import { atSpeedText, marginText, percent, rpmText, temperatureText } from './format';
import { OperatingLinesThumbnail } from './OperatingLinesThumbnail';

type Kind = 'compressor' | 'turbine';
type Tag = 'all' | CandidateOrigin;

const TAG_WORDS: Record<Tag, string> = { all: 'Every map', team: "The team's own", estimate: 'Estimates (family)', 'built-in': 'Built-in demo maps' };
const ORIGIN_WORDS: Record<CandidateOrigin, string> = { team: 'team', estimate: 'estimate', 'built-in': 'built-in' };
const FITS: VerdictStatus[] = ['fits', 'fits-with-warnings'];

function OriginTag({ origin }: { origin: CandidateOrigin }) {
  const look = origin === 'estimate' ? 'border-copper/60 text-copper-ink' : 'border-ink/20 text-ink-soft';
  return <span className={`ml-1 rounded-sm border px-1 text-[0.7rem] uppercase tracking-wide ${look}`}>{ORIGIN_WORDS[origin]}</span>;
}

function Reason({ c }: { c: CompressorCandidate | TurbineCandidate }) {
  return (
    <div className="space-y-1">
      <VerdictStamp status={c.verdict.status} />
      <p className="text-xs text-ink-soft">{c.verdict.firstReason ?? 'every point on the map with the margins the study requires'}</p>
    </div>
  );
}

export interface CandidatesViewProps {
  teamId: string;
  document: StudyDocument;
  system: UnitSystem;
  canEdit: boolean;
  /** Adds the compressor as a new plan of the study (a new revision); resolves when saved. */
  onAddPlan: (candidate: { mapId: string; mapName: string }) => void;
  /** The map being added, while its save runs. */
  adding: string | null;
}

/** The study's Candidates: every map of the library judged against it, ranked, in a Web Worker with progress. */
export function CandidatesView({ teamId, document, system, canEdit, onAddPlan, adding }: CandidatesViewProps) {
  const [kind, setKind] = useState<Kind>('compressor');
  const [tag, setTag] = useState<Tag>('all');
  const [onlyFits, setOnlyFits] = useState(false);
  const [order, setOrder] = useState<CompressorOrder>('smallest');
  const exhaustPlans = document.plans.filter((p) => p.exhaust);
  const [templateId, setTemplateId] = useState(document.plans[0].id);
  const [turbineTemplateId, setTurbineTemplateId] = useState(exhaustPlans[0]?.id ?? '');
  const compressorMaps = useCandidateMaps(teamId, 'compressor');
  const turbineMaps = useCandidateMaps(teamId, 'turbine', { enabled: kind === 'turbine' });
  const [compressorId, setCompressorId] = useState<string>(exhaustPlans[0]?.compressorMapId ?? '');

  const input = useMemo(() => {
    if (kind === 'compressor') return compressorMaps.data ? { kind, doc: document, templateId, maps: compressorMaps.data } : null;
    const compressor = compressorMaps.data?.find((m) => m.id === compressorId);
    if (!turbineMaps.data || !compressor || !turbineTemplateId) return null;
    return { kind, doc: document, templateId: turbineTemplateId, compressor: { id: compressor.id, map: compressor.map }, maps: turbineMaps.data };
  }, [kind, document, templateId, compressorMaps.data, turbineMaps.data, compressorId, turbineTemplateId]);
  const ranking = useRanking(input);

  const mapsById = useMemo(() => new Map<string, CandidateMap>((compressorMaps.data ?? []).map((m) => [m.id, m])), [compressorMaps.data]);
  const keep = (c: { origin: CandidateOrigin; verdict: { status: VerdictStatus } }) =>
    (tag === 'all' || c.origin === tag) && (!onlyFits || FITS.includes(c.verdict.status));
  const compressors = useMemo(() => sortCompressorCandidates(ranking.compressors, order), [ranking.compressors, order]);
  const turbines = useMemo(() => sortTurbineCandidates(ranking.turbines), [ranking.turbines]);
  const shownCompressors = compressors.filter(keep);
  const shownTurbines = turbines.filter(keep);
  const fitting = (kind === 'compressor' ? compressors : turbines).filter((c) => FITS.includes(c.verdict.status)).length;
  const error = compressorMaps.error ?? turbineMaps.error;

  return (
    <div className="space-y-4">
      <form className="flex flex-wrap items-end gap-4 rounded-md border border-paper-line bg-paper-deep/40 p-3 text-sm" onSubmit={(e) => e.preventDefault()}>
        <fieldset className="flex gap-3">
          <legend className="sr-only">What to rank</legend>
          {(['compressor', 'turbine'] as const).map((k) => (
            <label key={k} className="flex items-center gap-1">
              <input type="radio" name="kind" value={k} checked={kind === k} onChange={() => setKind(k)} />
              {k === 'compressor' ? 'Compressors' : 'Turbine housings'}
            </label>
          ))}
        </fieldset>
        <label className="flex flex-col gap-1">
          <span className="text-xs text-ink-soft">Maps</span>
          <select value={tag} onChange={(e) => setTag(e.target.value as Tag)} className="rounded border border-paper-line bg-white px-2 py-1">
            {(Object.keys(TAG_WORDS) as Tag[]).map((t) => (
              <option key={t} value={t}>
                {TAG_WORDS[t]}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={onlyFits} onChange={(e) => setOnlyFits(e.target.checked)} />
          Only maps that fit
        </label>
        {kind === 'compressor' ? (
          <>
            <label className="flex flex-col gap-1">
              <span className="text-xs text-ink-soft">Among maps that fit, first the</span>
              <select
                value={order}
                onChange={(e) => setOrder(e.target.value as CompressorOrder)}
                className="rounded border border-paper-line bg-white px-2 py-1"
              >
                {(Object.keys(COMPRESSOR_ORDER_WORDS) as CompressorOrder[]).map((o) => (
                  <option key={o} value={o}>
                    {COMPRESSOR_ORDER_WORDS[o].toLowerCase()}
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1">
              <span className="text-xs text-ink-soft">Turbochargers and efficiency from plan</span>
              <select value={templateId} onChange={(e) => setTemplateId(e.target.value)} className="rounded border border-paper-line bg-white px-2 py-1">
                {document.plans.map((p) => (
                  <option key={p.id} value={p.id}>
                    {p.name}
                  </option>
                ))}
              </select>
            </label>
          </>
        ) : (
          exhaustPlans.length > 0 && (
            <>
              <label className="flex flex-col gap-1">
                <span className="text-xs text-ink-soft">Exhaust side from plan</span>
                <select
                  value={turbineTemplateId}
                  onChange={(e) => setTurbineTemplateId(e.target.value)}
                  className="rounded border border-paper-line bg-white px-2 py-1"
                >
                  {exhaustPlans.map((p) => (
                    <option key={p.id} value={p.id}>
                      {p.name}
                    </option>
                  ))}
                </select>
              </label>
              <label className="flex flex-col gap-1">
                <span className="text-xs text-ink-soft">With the compressor</span>
                <select value={compressorId} onChange={(e) => setCompressorId(e.target.value)} className="rounded border border-paper-line bg-white px-2 py-1">
                  <option value="">Choose a compressor…</option>
                  {(compressorMaps.data ?? []).map((m) => (
                    <option key={m.id} value={m.id}>
                      {m.name}
                    </option>
                  ))}
                </select>
              </label>
            </>
          )
        )}
      </form>

      {error && (
        <Alert tone="error" title="The library could not be loaded">
          {error.message}
        </Alert>
      )}
      {kind === 'turbine' && exhaustPlans.length === 0 && (
        <Alert title="No plan of this study has an exhaust side">
          Turbine housings are judged with a plan's wastegates, exhaust temperatures and losses: turn the exhaust side on for a plan in the study, save, and
          come back.
        </Alert>
      )}
      {kind === 'turbine' && exhaustPlans.length > 0 && !compressorId && <Alert>Choose the compressor the housings are judged with.</Alert>}
      {ranking.status === 'error' && (
        <Alert tone="error" title="The ranking stopped">
          {ranking.error}
        </Alert>
      )}
      {ranking.status === 'running' && (
        <div role="status" className="space-y-1">
          <p className="text-sm text-ink-soft">
            Judging map {ranking.done} of {ranking.total} against every scenario and boost row…
          </p>
          <progress className="w-full" value={ranking.done} max={Math.max(ranking.total, 1)} aria-label="Ranking progress" />
        </div>
      )}
      {ranking.status === 'done' && (
        <p className="text-sm text-ink-soft" data-testid="candidates-summary">
          {fitting} of {kind === 'compressor' ? compressors.length : turbines.length} maps fit this study. Each map is judged as a plan with it would be: the
          same engine, scenarios, boost rows and required margins.
        </p>
      )}

      {ranking.status === 'done' && kind === 'compressor' && (
        <table className="w-full border-collapse text-sm" aria-label="Compressor candidates">
          <thead>
            <tr className="border-b border-ink/20 text-left text-xs uppercase tracking-wide text-ink-soft">
              <th className="py-2 pr-2">Map</th>
              <th className="py-2 pr-2">Verdict</th>
              <th className="py-2 pr-2">Worst margins</th>
              <th className="py-2 pr-2">Efficiency</th>
              <th className="py-2 pr-2">Lines on the map</th>
              <th className="py-2" />
            </tr>
          </thead>
          <tbody>
            {shownCompressors.map((c) => {
              const map = mapsById.get(c.mapId)?.map;
              return (
                <tr key={c.mapId} className="border-b border-paper-line align-top" data-candidate={c.mapName}>
                  <td className="py-2 pr-2 font-semibold">
                    {c.mapName}
                    <OriginTag origin={c.origin} />
                  </td>
                  <td className="max-w-56 py-2 pr-2">
                    <Reason c={c} />
                  </td>
                  <td className="py-2 pr-2 text-xs tabular-nums">
                    <p>Surge {marginText(c.worstSurgeMargin)}</p>
                    <p>Choke {marginText(c.worstChokeMargin)}</p>
                    <p>Speed {marginText(c.worstSpeedMargin)}</p>
                  </td>
                  <td className="py-2 pr-2 text-xs tabular-nums">
                    <p>Peak torque: {atSpeedText(c.efficiencyAtPeakTorque)}</p>
                    <p>Peak power: {atSpeedText(c.efficiencyAtPeakPower)}</p>
                    <p>Full-load mean: {c.meanFullLoadEfficiency === null ? '—' : percent(c.meanFullLoadEfficiency)}</p>
                    <p>Hottest outlet: {temperatureText(c.peakOutletTemperature, system)}</p>
                  </td>
                  <td className="py-2 pr-2">
                    {map?.kind === 'compressor' && (
                      <OperatingLinesThumbnail map={map} traces={c.traces} label={`The study's operating lines on ${c.mapName}`} />
                    )}
                  </td>
                  <td className="py-2">
                    {canEdit && (
                      <Button
                        variant={FITS.includes(c.verdict.status) ? 'primary' : 'secondary'}
                        pending={adding === c.mapId}
                        disabled={adding !== null}
                        onClick={() => onAddPlan(c)}
                      >
                        Add as a plan
                      </Button>
                    )}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      )}

      {ranking.status === 'done' && kind === 'turbine' && (
        <table className="w-full border-collapse text-sm" aria-label="Turbine housing candidates">
          <thead>
            <tr className="border-b border-ink/20 text-left text-xs uppercase tracking-wide text-ink-soft">
              <th className="py-2 pr-2">Housing</th>
              <th className="py-2 pr-2">Verdict</th>
              <th className="py-2 pr-2">Boost threshold</th>
              <th className="py-2 pr-2">Peak drive pressure ratio</th>
              <th className="py-2 pr-2">Wastegate share at peak power</th>
            </tr>
          </thead>
          <tbody>
            {shownTurbines.map((c) => (
              <tr key={c.mapId} className="border-b border-paper-line align-top" data-candidate={c.mapName}>
                <td className="py-2 pr-2 font-semibold">
                  {c.mapName}
                  <OriginTag origin={c.origin} />
                  <p className="text-xs font-normal text-ink-soft">
                    {c.housing === 'divided' ? 'Divided' : 'Single scroll'}
                    {c.areaRatio !== null ? `, A/R ${c.areaRatio}` : ''}
                  </p>
                </td>
                <td className="max-w-56 py-2 pr-2">
                  <Reason c={c} />
                </td>
                <td className="py-2 pr-2 text-xs tabular-nums">
                  {c.holdsEveryFullLoadLine ? rpmText(c.boostThreshold) : 'a full-load line never holds its target'}
                </td>
                <td className="py-2 pr-2 text-xs tabular-nums">
                  {c.peakDrivePressureRatio
                    ? `${c.peakDrivePressureRatio.value.toFixed(2)} at ${Math.round(c.peakDrivePressureRatio.rpm).toLocaleString('en-US')} rpm`
                    : '—'}
                </td>
                <td className="py-2 pr-2 text-xs tabular-nums">{atSpeedText(c.wastegateShareAtPeakPower)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {ranking.status === 'done' && (kind === 'compressor' ? shownCompressors : shownTurbines).length === 0 && (
        <p className="text-sm text-ink-soft">No map matches the filters.</p>
      )}
    </div>
  );
}
