import { useMemo, useState } from 'react';
import type { SpoolbookMap } from '#shared/maps/types';
import type { LogSummary } from '#shared/schemas/logs';
import type { StudyDetail, StudyDocument } from '#shared/schemas/study';
import { chosenSegments } from '#shared/logs/segments';
import { volumetricEfficiencyWithFit } from '#shared/logs/study';
import { Alert } from '#src/components/Alert';
import { Button, buttonClass } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { Loading } from '#src/components/Page';
import { PlotFrame } from '#src/components/plots/PlotFrame';
import { inputClass } from '#src/components/TextField';
import { formatNumber, formatQuantity, type UnitSystem } from '#src/lib/quantities';
import { useSaveStudy } from '#src/features/studies/api';
import { logCsvHref, useLogSamples, useUpdateLog } from '../api';
import { compareLog, studyVeAt } from '../comparison';
import { boostFigure, drivePressureFigure, loggedMapFigure, shaftSpeedFigure } from '../log-figures';

const PLOT_HEIGHT = 460;

function seconds(v: number) {
  return `${formatNumber(v, 4)} s`;
}

/** One logged run beside the prediction: segments, the map, measured against predicted by rpm, and the fit. */
export function LogView({
  teamId,
  study,
  document,
  mapsById,
  log,
  system,
}: {
  teamId: string;
  study: StudyDetail;
  document: StudyDocument;
  mapsById: Record<string, SpoolbookMap | undefined>;
  log: LogSummary;
  system: UnitSystem;
}) {
  const samples = useLogSamples(teamId, study.id, log.id);
  const updateLog = useUpdateLog(teamId, study.id, log.id);
  const save = useSaveStudy(teamId, study.id);
  const [planIndex, setPlanIndex] = useState(0);
  const [scenarioIndex, setScenarioIndex] = useState(0);
  const comparison = useMemo(
    () =>
      samples.data
        ? compareLog({
            doc: document,
            mapsById,
            channels: samples.data.channels,
            rowCount: samples.data.rowCount,
            selection: log.selection,
            planIndex,
            scenarioIndex,
          })
        : null,
    [samples.data, document, mapsById, log.selection, planIndex, scenarioIndex],
  );

  if (samples.isPending) return <Loading label="Loading the log’s samples…" />;
  if (samples.error || !samples.data || !comparison)
    return (
      <Alert tone="error" title="The log’s samples could not be loaded">
        {samples.error?.message}
      </Alert>
    );
  const { channels } = samples.data;
  const time = channels.time!;
  const rpm = channels.engineSpeed!;
  const c = comparison;
  const chosen = (chosenSegments(log.selection, c.segments) ?? []).map((s) => ({ start: s.start, end: s.end }));
  const isChosen = (s: { start: number; end: number }) => chosen.some((r) => r.start === s.start && r.end === s.end);
  const toggle = (s: { start: number; end: number }) => {
    const next = isChosen(s) ? chosen.filter((r) => !(r.start === s.start && r.end === s.end)) : [...chosen, { start: s.start, end: s.end }];
    updateLog.mutate({ selection: next.sort((a, b) => a.start - b.start) });
  };
  let usedCount = 0;
  for (const u of c.used) usedCount += u;
  const planQuery = `?plan=${encodeURIComponent(document.plans[planIndex]?.id ?? '')}&scenario=${scenarioIndex}`;
  const fitted = c.fit.bands;
  const message = `Volumetric efficiency fitted from log "${log.name}"`.slice(0, 200);

  return (
    <div className="space-y-5">
      <Card title={`Segments of “${log.name}”`}>
        <p className="text-sm text-ink-soft">
          Full-load pulls (throttle at 90 % or more while engine speed rises by 1000 rpm or more) and steady holds. The comparison and the fit use the chosen
          segments: {usedCount.toLocaleString('en')} of {log.rows.toLocaleString('en')} samples.
        </p>
        {c.segments.length === 0 ? (
          <p className="mt-2 text-sm">No pulls or holds found: every sample is used.</p>
        ) : (
          <ul className="mt-2 grid gap-1 text-sm sm:grid-cols-2">
            {c.segments.map((s) => (
              <li key={`${s.start}-${s.end}`}>
                <label className="inline-flex items-center gap-2">
                  <input type="checkbox" checked={isChosen(s)} disabled={!study.canEdit || updateLog.isPending} onChange={() => toggle(s)} />
                  <span>
                    {s.kind === 'pull' ? 'Pull' : 'Hold'} {seconds(s.startTime)}–{seconds(s.endTime)}, {formatNumber(s.rpmFrom, 4)} → {formatNumber(s.rpmTo, 4)}{' '}
                    rpm
                  </span>
                </label>
              </li>
            ))}
          </ul>
        )}
        {c.segments.length > 0 && chosen.length === 0 && (
          <p className="mt-2 text-sm text-copper-ink">No segment chosen: nothing is compared or fitted. Tick at least one.</p>
        )}
        {updateLog.error && <p className="mt-2 text-sm text-copper-ink">{updateLog.error.message}</p>}
      </Card>

      <Card title="On the compressor map">
        <div className="mb-3 flex flex-wrap items-end gap-3 text-sm">
          <label>
            Plan
            <select className={`${inputClass} mt-1 block`} value={planIndex} onChange={(e) => setPlanIndex(Number(e.target.value))}>
              {document.plans.map((p, i) => (
                <option key={p.id} value={i}>
                  {p.name}
                </option>
              ))}
            </select>
          </label>
          <label>
            Scenario
            <select className={`${inputClass} mt-1 block`} value={scenarioIndex} onChange={(e) => setScenarioIndex(Number(e.target.value))}>
              {document.scenarios.map((s, i) => (
                <option key={s.name} value={i}>
                  {s.name}
                </option>
              ))}
            </select>
          </label>
          <a className={buttonClass('quiet')} href={logCsvHref(teamId, study.id, log.id, 'points', planQuery)}>
            points.csv
          </a>
          <a className={buttonClass('quiet')} href={logCsvHref(teamId, study.id, log.id, 'fit')}>
            fit.csv
          </a>
        </div>
        <p className="mb-2 text-sm text-ink-soft">
          Flow from{' '}
          {c.placed.flowFrom === 'logged mass air flow' ? 'the logged mass air flow' : 'the study’s engine model at the measured pressure and temperature'};
          inlet pressure from {channels.ambientPressure ? 'the logged barometric pressure' : 'the scenario’s ambient'} less the study’s inlet loss.
          {c.line ? ` Predicted line: ${c.line.label}.` : ' The study has no solved line for this plan and scenario.'}
        </p>
        <div data-testid="logged-map">
          <PlotFrame
            figure={loggedMapFigure(c, time, system, PLOT_HEIGHT + 60)}
            height={PLOT_HEIGHT + 60}
            label="Logged samples on the compressor map"
            exportName={`${log.name} on the map`}
          />
        </div>
      </Card>

      <Card title="Measured against predicted, by engine speed">
        <PlotFrame
          figure={boostFigure(c, rpm, time, system, PLOT_HEIGHT)}
          height={PLOT_HEIGHT}
          label="Measured and predicted boost"
          exportName={`${log.name} boost`}
        />
        {channels.shaftSpeed && (
          <PlotFrame
            figure={shaftSpeedFigure(c, rpm, time, channels.shaftSpeed, PLOT_HEIGHT)}
            height={PLOT_HEIGHT}
            label="Measured and predicted shaft speed"
            exportName={`${log.name} shaft speed`}
          />
        )}
        {channels.exhaustPressure && (
          <PlotFrame
            figure={drivePressureFigure(c, rpm, time, channels.exhaustPressure, system, PLOT_HEIGHT)}
            height={PLOT_HEIGHT}
            label="Measured and predicted drive pressure"
            exportName={`${log.name} drive pressure`}
          />
        )}
        <p className="mt-3 text-sm">
          Boost threshold (the first 250 rpm band whose mean boost reaches 90 % of the target): measured{' '}
          <strong>{c.threshold.measured === null ? 'not reached' : `${formatNumber(c.threshold.measured, 5)} rpm`}</strong>; predicted{' '}
          <strong>{c.threshold.predicted === null ? 'none' : `${formatNumber(c.threshold.predicted, 5)} rpm`}</strong> ({c.threshold.predictedNote}).
        </p>
        <div className="mt-3 overflow-x-auto">
          <table className="w-full text-sm tabular-nums" aria-label="Differences per engine-speed band">
            <thead>
              <tr className="text-left">
                <th className="px-2 py-1">Band (rpm)</th>
                <th className="px-2 py-1">Samples</th>
                <th className="px-2 py-1">Boost measured</th>
                <th className="px-2 py-1">predicted</th>
                <th className="px-2 py-1">difference</th>
                <th className="px-2 py-1">Corrected flow measured</th>
                <th className="px-2 py-1">predicted</th>
                <th className="px-2 py-1">Pressure ratio measured</th>
                <th className="px-2 py-1">predicted</th>
                {channels.shaftSpeed && <th className="px-2 py-1">Shaft speed measured / predicted</th>}
              </tr>
            </thead>
            <tbody>
              {c.bands.map((b) => (
                <tr key={b.rpm} className="border-t border-ink/10">
                  <td className="px-2 py-1">{b.rpm}</td>
                  <td className="px-2 py-1">{b.samples}</td>
                  <td className="px-2 py-1">{formatQuantity(b.measured.boost, 'pressure', system)}</td>
                  <td className="px-2 py-1">{formatQuantity(b.predicted.boost, 'pressure', system)}</td>
                  <td className="px-2 py-1">
                    {b.measured.boost !== null && b.predicted.boost !== null ? formatQuantity(b.measured.boost - b.predicted.boost, 'pressure', system) : '—'}
                  </td>
                  <td className="px-2 py-1">{formatQuantity(b.measured.correctedMassFlow, 'massFlow', system)}</td>
                  <td className="px-2 py-1">{formatQuantity(b.predicted.correctedMassFlow, 'massFlow', system)}</td>
                  <td className="px-2 py-1">{formatQuantity(b.measured.pressureRatio, 'ratio', system)}</td>
                  <td className="px-2 py-1">{formatQuantity(b.predicted.pressureRatio, 'ratio', system)}</td>
                  {channels.shaftSpeed && (
                    <td className="px-2 py-1">
                      {formatQuantity(b.measured.shaftSpeed, 'speed', system)} / {formatQuantity(b.predicted.shaftSpeed, 'speed', system)}
                    </td>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </Card>

      <Card title="Volumetric efficiency from the log">
        {fitted.length === 0 ? (
          <p className="text-sm">
            No fit: the log needs mass air flow (or fuel flow with lambda) and a charge or inlet temperature, with at least 5 samples in a 500 rpm band.
          </p>
        ) : (
          <>
            <p className="text-sm text-ink-soft">
              Backed out of the {c.fit.flowFrom} with the measured manifold pressure and the {c.fit.temperatureFrom}: VE = ṁ·60·n_R/(ρ_man·V_d·N), ρ_man =
              p_man/(R·T_man) (Heywood 1988 §2.10), per 500 rpm band, with the spread (standard deviation) of its samples. A sensor offset or a leak shows up
              here as a wrong VE: check the log before you use these values.
            </p>
            <table className="mt-2 w-full text-sm tabular-nums" aria-label="Fitted volumetric efficiency">
              <thead>
                <tr className="text-left">
                  <th className="px-2 py-1">Engine speed (rpm)</th>
                  <th className="px-2 py-1">Fitted VE</th>
                  <th className="px-2 py-1">Spread</th>
                  <th className="px-2 py-1">Samples</th>
                  <th className="px-2 py-1">Study’s VE</th>
                  <th className="px-2 py-1">Difference</th>
                </tr>
              </thead>
              <tbody>
                {fitted.map((b) => {
                  const current = studyVeAt(document, b.rpm);
                  return (
                    <tr key={b.rpm} className="border-t border-ink/10">
                      <td className="px-2 py-1">{b.rpm}</td>
                      <td className="px-2 py-1">{formatNumber(b.value * 100, 3)} %</td>
                      <td className="px-2 py-1">± {formatNumber(b.spread * 100, 2)} %</td>
                      <td className="px-2 py-1">{b.samples}</td>
                      <td className="px-2 py-1">{formatNumber(current * 100, 3)} %</td>
                      <td className="px-2 py-1">{formatNumber((b.value - current) * 100, 2)} %</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
            {study.canEdit && (
              <div className="mt-3 flex flex-wrap items-center gap-3">
                <Button
                  variant="primary"
                  pending={save.isPending}
                  onClick={() =>
                    save.mutate({
                      baseRevision: study.revision,
                      message,
                      document: {
                        ...document,
                        engine: { ...document.engine, volumetricEfficiency: volumetricEfficiencyWithFit(document.engine.volumetricEfficiency, fitted) },
                      },
                    })
                  }
                >
                  Use these values
                </Button>
                <span className="text-sm text-ink-soft">Writes them into the study’s table as a new revision: “{message}”.</span>
              </div>
            )}
            {save.isSuccess && (
              <Alert tone="success" className="mt-3">
                Saved as revision {save.data.revision}.
              </Alert>
            )}
            {save.error && (
              <Alert tone="error" className="mt-3">
                {save.error.message}
              </Alert>
            )}
          </>
        )}
      </Card>
    </div>
  );
}
