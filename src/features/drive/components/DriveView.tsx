import { useMemo, useState } from 'react';
import type { DriveFigures } from '#shared/drive/figures';
import { withUsableBoostByGear } from '#shared/drive/write-boost';
import type { SpoolbookMap } from '#shared/maps/types';
import type { StudyDetail, StudyDocument } from '#shared/schemas/study';
import { Alert } from '#src/components/Alert';
import { Button, buttonClass } from '#src/components/Button';
import { Card } from '#src/components/Card';
import { PlotFrame } from '#src/components/plots/PlotFrame';
import { SelectField } from '#src/components/SelectField';
import { runStudyLive, studyDriveLive } from '#src/components/study/run';
import { StudyCaution } from '#src/components/study/StudyCaution';
import { Table, td, th } from '#src/components/Table';
import { useSaveStudy } from '#src/features/studies/api';
import { formatNumber, type UnitSystem } from '#src/lib/quantities';
import { driveCsvHref } from '../api/drive-csv';
import { runFigure, spoolFigure, wheelForceFigure } from '../drive-plots';
import { boostUnit, speedUnit } from '../drive-units';
import { draftOf, vehicleOf, type VehicleDraft } from '../vehicle-draft';
import { VehicleForm } from './VehicleForm';

const PLOT_HEIGHT = 420;

const INERTIA_WORDS = {
  study: 'given in the study',
  map: 'from the map file',
  'wheel-size': 'estimated from the wheel size',
  'default-wheel': 'estimated for a 55 mm wheel (none given)',
} as const;

const seconds = (x: number | null) => (x === null ? '—' : `${formatNumber(x, 3)} s`);

/**
 * The Drive view of a study: the car (typed here, saved as a new revision), force at the wheels per
 * gear beside the traction limit, the boost the tyres can use (written into a scenario as boost by
 * gear), time to boost and the acceleration run of each plan.
 */
export function DriveView({
  teamId,
  study,
  document,
  mapsById,
  system,
}: {
  teamId: string;
  study: StudyDetail;
  document: StudyDocument;
  mapsById: Record<string, SpoolbookMap | undefined>;
  system: UnitSystem;
}) {
  const [draft, setDraft] = useState<VehicleDraft>(() => draftOf(document.vehicle, document));
  const [planIndex, setPlanIndex] = useState(0);
  const [writeScenario, setWriteScenario] = useState<number | null>(null);
  const save = useSaveStudy(teamId, study.id);
  const [saved, setSaved] = useState<string | null>(null);
  const parsed = useMemo(() => vehicleOf(draft), [draft]);
  const live = useMemo(() => (parsed.ok ? { ...document, vehicle: parsed.vehicle } : null), [parsed, document]);
  const result = useMemo(() => (live ? runStudyLive(live, mapsById) : null), [live, mapsById]);
  const drive = useMemo(() => (live && result ? studyDriveLive(live, result, mapsById) : null), [live, result, mapsById]);
  const dirty = parsed.ok && JSON.stringify(parsed.vehicle) !== JSON.stringify(document.vehicle ?? null);
  const readOnly = !study.canEdit;

  const saveDocument = (next: StudyDocument, message: string, done: string) => {
    setSaved(null);
    save.mutate({ baseRevision: study.revision, document: next, message }, { onSuccess: (s) => setSaved(`${done} Saved as revision ${s.revision}.`) });
  };

  return (
    <div className="space-y-6">
      <DriveCaution />
      <Card
        title="The car"
        actions={
          !readOnly && (
            <Button
              variant="primary"
              disabled={!dirty}
              pending={save.isPending}
              onClick={() => live && saveDocument(live, 'The car for the drive figures', 'The car is saved.')}
            >
              Save the car
            </Button>
          )
        }
      >
        {!document.vehicle && (
          <p className="mb-3 text-sm text-ink-soft">
            This study has no car yet. The figures below start from round numbers of a small hatchback: type your own car in and save it.
          </p>
        )}
        <VehicleForm draft={draft} errors={parsed.ok ? {} : parsed.errors} document={document} readOnly={readOnly} onChange={setDraft} />
        {saved && (
          <p role="status" className="mt-3 text-sm font-semibold text-teal-dark">
            {saved}
          </p>
        )}
        {save.error && (
          <Alert tone="error" title="Not saved" className="mt-3">
            {save.error.message}
          </Alert>
        )}
      </Card>

      {!drive ? (
        <Alert tone="info" title="No drive figures yet">
          Correct the fields marked above: the figures follow as soon as the car reads.
        </Alert>
      ) : (
        <>
          <Card title="Force at the wheels and the traction limit">
            <div className="mb-3 flex flex-wrap items-end gap-4">
              <SelectField
                label="Plan"
                name="drivePlan"
                value={String(planIndex)}
                onChange={(e) => setPlanIndex(Number(e.target.value))}
                options={document.plans.map((p, i) => ({ value: String(i), label: p.name }))}
              />
              <p className="max-w-prose text-sm text-ink-soft">
                Scenario “{drive.figures.scenarioName}”
                {drive.figures.scenarioMissing ? ` (the car's scenario “${drive.figures.vehicle.scenario}” is no longer in the study)` : ''}. Each gear runs on
                its boost row; where the compressor cannot give a point, the line leaves a gap. The limit counts the load moving off the front and onto the rear
                axle as the car accelerates (Gillespie 1992, ch. 2), on a level road.
              </p>
            </div>
            <PlotFrame figure={wheelForceFigure(drive.figures, planIndex, system, PLOT_HEIGHT)} height={PLOT_HEIGHT} label="Force at the wheels" />
          </Card>

          <UsableBoost
            figures={drive.figures}
            planIndex={planIndex}
            system={system}
            readOnly={readOnly}
            scenarioIndex={writeScenario ?? drive.figures.scenarioIndex}
            scenarios={document.scenarios.map((s) => s.name)}
            pending={save.isPending}
            onScenario={setWriteScenario}
            dirty={dirty}
            onWrite={(scenarioIndex) => {
              const written = withUsableBoostByGear(live!, drive.figures, planIndex, scenarioIndex);
              if (!written.ok) return setSaved(`Not written: ${written.message}.`);
              saveDocument(
                written.document,
                `Boost by gear from the tyres' grip (${document.plans[planIndex].name})`,
                `The usable boost of ${document.plans[planIndex].name} is written into “${document.scenarios[scenarioIndex].name}” as boost by gear.`,
              );
            }}
          />

          <Card title="Time to boost">
            <p className="mb-3 max-w-prose text-sm text-ink-soft">
              From no boost at the start speed in the gear held, the rotor spun up by the turbine&apos;s spare power with the gates shut (I·dω/dt = (P_t −
              P_c)/ω), the engine speed rising with the car, until 90 % of the boost target. An estimate from a quasi-steady model: it leaves out the
              pipes&apos; filling and the turbine&apos;s pulses.
            </p>
            <Table
              caption="Time to 90 % of the boost target"
              head={
                <tr>
                  <th className={th}>Plan</th>
                  <th className={th}>Rotor inertia</th>
                  <th className={th}>Time</th>
                  <th className={th}>Why none</th>
                </tr>
              }
            >
              {drive.spools.map((s) => (
                <tr key={s.planId}>
                  <td className={td}>{s.planName}</td>
                  <td className={td}>
                    {s.inertia.toExponential(2)} kg·m² ({INERTIA_WORDS[s.inertiaFrom]})
                  </td>
                  <td className={td}>{seconds(s.timeTo90)}</td>
                  <td className={td}>{s.why ?? ''}</td>
                </tr>
              ))}
            </Table>
            {drive.spools.some((s) => s.samples.length > 0) && (
              <div className="mt-4">
                <PlotFrame figure={spoolFigure(drive.spools, system, PLOT_HEIGHT)} height={PLOT_HEIGHT} label="Boost against time" />
              </div>
            )}
          </Card>

          <Card title="Acceleration run">
            <p className="mb-3 max-w-prose text-sm text-ink-soft">
              From rest to the end speed through the gears on each plan&apos;s steady torque, capped by the traction limit, with no drive during each shift.
            </p>
            <Table
              caption="Acceleration run by plan"
              head={
                <tr>
                  <th className={th}>Plan</th>
                  <th className={th}>Time</th>
                  <th className={th}>Distance</th>
                  <th className={th}>At the traction limit</th>
                  <th className={th}>Turbine below target</th>
                  <th className={th}>Why none</th>
                </tr>
              }
            >
              {drive.runs.map((r) => (
                <tr key={r.planIndex}>
                  <td className={td}>{r.planName}</td>
                  <td className={td}>{seconds(r.time)}</td>
                  <td className={td}>{r.distance === null ? '—' : `${formatNumber(r.distance, 3)} m`}</td>
                  <td className={td}>{seconds(r.tractionLimitedTime)}</td>
                  <td className={td}>{seconds(r.boostLimitedTime)}</td>
                  <td className={td}>{r.why ?? ''}</td>
                </tr>
              ))}
            </Table>
            {drive.runs.some((r) => r.samples.length > 1) && (
              <div className="mt-4">
                <PlotFrame figure={runFigure(drive.runs, system, PLOT_HEIGHT)} height={PLOT_HEIGHT} label="Road speed against time" />
              </div>
            )}
          </Card>

          {document.vehicle && (
            <p className="flex flex-wrap gap-2">
              <a className={buttonClass('secondary')} href={driveCsvHref(teamId, study.id, 'drive')} download>
                Drive CSV
              </a>
              <a className={buttonClass('secondary')} href={driveCsvHref(teamId, study.id, 'spool')} download>
                Spool CSV
              </a>
              <span className="self-center text-xs text-ink-soft">The downloads are of the last saved revision.</span>
            </p>
          )}
        </>
      )}
      <StudyCaution />
    </div>
  );
}

function DriveCaution() {
  return (
    <aside aria-label="Drive caution" className="rounded-md border-l-4 border-copper bg-copper-light/40 px-4 py-3 text-sm text-ink-soft">
      <strong className="font-semibold text-ink">Planning estimates only. </strong>
      Traction, time to boost and acceleration here are estimates for choosing hardware and a first boost schedule, not for setting up a car on a public road.
      Tyres, surfaces and temperatures vary widely; confirm on the car with data logging, and follow the rules of your competition and its officials.
    </aside>
  );
}

/** The usable boost of one plan by gear and engine speed, and the button that writes it into a scenario. */
function UsableBoost({
  figures,
  planIndex,
  system,
  readOnly,
  scenarioIndex,
  scenarios,
  pending,
  dirty,
  onScenario,
  onWrite,
}: {
  figures: DriveFigures;
  planIndex: number;
  system: UnitSystem;
  readOnly: boolean;
  scenarioIndex: number;
  scenarios: string[];
  pending: boolean;
  dirty: boolean;
  onScenario: (i: number) => void;
  onWrite: (scenarioIndex: number) => void;
}) {
  const gears = figures.gears.filter((g) => g.planIndex === planIndex);
  const boost = boostUnit(system);
  const speed = speedUnit(system);
  const rpms = gears[0]?.points.map((p) => p.rpm) ?? [];
  return (
    <Card title="Boost the tyres can use">
      <p className="mb-3 max-w-prose text-sm text-ink-soft">
        The highest boost at each engine speed that keeps the force at the wheels within the traction limit, at most the target. Lower boost is taken to lower
        the torque with the manifold pressure; writing it recomputes the whole study on the new rows. Copper: below the target. “Not reachable”: the compressor
        cannot give the point at its target, so the tyres&apos; share is not known there.
      </p>
      <Table
        caption={`Usable boost (${boost.label}) by gear and engine speed`}
        head={
          <tr>
            <th className={th}>Engine speed</th>
            {gears.map((g) => (
              <th key={g.gear} className={th}>
                Gear {g.gear}
              </th>
            ))}
          </tr>
        }
      >
        {rpms.map((rpm, i) => (
          <tr key={rpm}>
            <td className={td}>{formatNumber(rpm, 6)} rpm</td>
            {gears.map((g) => {
              const p = g.points[i];
              const short = p.usableBoost !== null && p.boostTarget !== null && p.usableBoost < p.boostTarget;
              return (
                <td
                  key={g.gear}
                  className={`${td} ${short ? 'font-semibold text-copper-ink' : ''}`}
                  title={`${formatNumber(speed.fromSI(p.roadSpeed), 3)} ${speed.label}${p.why ? `: ${p.why}` : ''}`}
                >
                  {p.usableBoost === null ? 'not reachable' : formatNumber(boost.fromSI(p.usableBoost), 3)}
                  {p.beyondGripOffBoost ? ' (beyond grip off boost)' : ''}
                </td>
              );
            })}
          </tr>
        ))}
      </Table>
      {!readOnly && (
        <div className="mt-4 flex flex-wrap items-end gap-3">
          <SelectField
            label="Write into scenario"
            name="writeScenario"
            value={String(scenarioIndex)}
            onChange={(e) => onScenario(Number(e.target.value))}
            options={scenarios.map((s, i) => ({ value: String(i), label: s }))}
          />
          <Button variant="primary" pending={pending} onClick={() => onWrite(scenarioIndex)}>
            Write as boost by gear
          </Button>
          {dirty && <span className="text-xs text-ink-soft">The car&apos;s changes are saved with it.</span>}
        </div>
      )}
    </Card>
  );
}
