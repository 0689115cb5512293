import type { ReactNode } from 'react';
import { DEFAULT_TURBINE_EFFICIENCY } from '#shared/matching/exhaust/context';
import { REQUIREMENT_DEFAULTS, type Requirements } from '#shared/matching/input/requirements';
import type { RpmTable } from '#shared/matching/input/rpm';
import type { StudyDocument } from '#shared/schemas/study';
import { planColour } from '#src/components/plots/style';
import { mapName, type StudyViewData } from '../study-view';
import { formatNumber, formatPressureLoss, formatStudyValue, quantityUnit, type StudyQuantity, type UnitSystem, useUnitSystem } from '#src/lib/quantities';

/** Columns of an rpm table per printed block, so a long table wraps instead of running off the page. */
const RPM_COLUMNS_PER_BLOCK = 10;
/** Plans per printed exhaust table (a column each): the rest go into the next table under it. */
const PLAN_COLUMNS_PER_TABLE = 4;

function chunks<T>(items: readonly T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

/** A table by rpm laid across the page: engine speeds in the first row, values in the second. */
export function RpmTableView({
  caption,
  valueLabel = caption,
  table,
  quantity,
}: {
  caption: string;
  /** What the value row holds, e.g. "Boost"; the unit is added to it. */
  valueLabel?: string;
  table: RpmTable;
  quantity: StudyQuantity;
}) {
  const system = useUnitSystem();
  const unit = quantityUnit(quantity, system);
  return (
    <div className="space-y-1 overflow-x-auto print:overflow-visible" tabIndex={0} role="region" aria-label={caption}>
      {chunks(table, RPM_COLUMNS_PER_BLOCK).map((block, i) => (
        <table key={i} className="report-rpm-table border-collapse text-sm">
          {i === 0 && <caption className="pb-1 text-left text-sm font-semibold text-ink">{caption}</caption>}
          <tbody>
            <tr>
              <th scope="row" className="whitespace-nowrap border border-paper-line bg-paper-deep/50 px-2 py-1 text-left text-xs font-semibold text-ink-soft">
                Engine speed (rpm)
              </th>
              {block.map((row) => (
                <td key={row.rpm} className="numeric border border-paper-line px-2 py-1 text-right">
                  {formatNumber(row.rpm, 21)}
                </td>
              ))}
            </tr>
            <tr>
              <th scope="row" className="whitespace-nowrap border border-paper-line bg-paper-deep/50 px-2 py-1 text-left text-xs font-semibold text-ink-soft">
                {unit.label ? `${valueLabel} (${unit.label})` : valueLabel}
              </th>
              {block.map((row) => (
                <td key={row.rpm} className="numeric border border-paper-line px-2 py-1 text-right">
                  {formatNumber(unit.fromSI(row.value), 4)}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      ))}
    </div>
  );
}

/** Label–value pairs in two columns. */
function Facts({ items }: { items: [string, ReactNode][] }) {
  return (
    <dl className="report-facts grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
      {items.map(([label, value]) => (
        <div key={label} className="flex justify-between gap-3 border-b border-paper-line/70 py-1">
          <dt className="text-ink-soft">{label}</dt>
          {/* Short values (a number and its unit) stay on one line; sentences may wrap. */}
          <dd className={`numeric text-right font-medium text-ink ${typeof value === 'string' && value.length <= 24 ? 'shrink-0 whitespace-nowrap' : ''}`}>
            {value}
          </dd>
        </div>
      ))}
    </dl>
  );
}

function InputBlock({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section className="report-block space-y-2">
      <h3 className="text-base font-semibold text-ink">{title}</h3>
      {children}
    </section>
  );
}

function fuelText(fuel: StudyDocument['fuelSystem']['fuel']): string {
  if (fuel.kind === 'petrol') return 'Petrol';
  if (fuel.kind === 'methanol') return 'Methanol';
  return `Ethanol blend, ${formatNumber(fuel.ethanolPercent, 3)} % ethanol by volume`;
}

function rowKindText(kind: string, gear: number | undefined): string {
  if (kind === 'gear') return gear !== undefined ? `Gear ${gear}` : 'By gear';
  if (kind === 'part-throttle') return 'Part throttle';
  return 'Full load';
}

type Plan = StudyDocument['plans'][number];
type Exhaust = NonNullable<Plan['exhaust']>;

function housingText(housing: Exhaust['housing']): string {
  return housing === 'divided' ? 'Divided (two scrolls)' : 'Single scroll';
}

/**
 * The exhaust side of every plan, one column per plan and one row per input (a row per plan would
 * not fit across a page), then each plan's turbine inlet temperatures by rpm. Shown only when some
 * plan has an exhaust side; a plan judged on the compressor alone says so in its column.
 */
function ExhaustInputs({ data }: { data: Pick<StudyViewData, 'document' | 'mapsById' | 'mapNames'> }) {
  const system = useUnitSystem();
  const plans = data.document.plans;
  const v = (value: unknown, quantity: StudyQuantity) => formatStudyValue(value, quantity, system);
  const rows: { label: string; value: (plan: Plan, exhaust: Exhaust) => string }[] = [
    {
      label: 'Turbine map',
      value: (plan) => (plan.turbineMapId ? mapName(plan.turbineMapId, data.mapsById, data.mapNames) : 'None (exhaust side not computed)'),
    },
    { label: 'Turbine housing', value: (_, x) => housingText(x.housing) },
    { label: 'Wastegates', value: (_, x) => `${x.wastegates.count} × ${v(x.wastegates.valveDiameter, 'diameter')} valve` },
    { label: 'Valve discharge coefficient', value: (_, x) => formatNumber(x.wastegates.dischargeCoefficient, 3) },
    { label: 'Mechanical efficiency', value: (_, x) => v(x.mechanicalEfficiency, 'fraction') },
    {
      label: 'Pulse-energy factor',
      value: (_, x) => (x.housing !== 'divided' ? '— (single scroll)' : x.pulseFactor === undefined ? '1.0 (default)' : formatNumber(x.pulseFactor, 3)),
    },
    {
      label: 'Turbine efficiency off the map',
      value: (_, x) => (x.turbineEfficiency === undefined ? `${v(DEFAULT_TURBINE_EFFICIENCY, 'fraction')} (default)` : v(x.turbineEfficiency, 'fraction')),
    },
    { label: 'Pressure loss after the turbine', value: (_, x) => formatPressureLoss(x.downstreamLoss, system) },
  ];
  const indexed = plans.map((plan, index) => ({ plan, index }));
  return (
    <div className="space-y-3">
      {chunks(indexed, PLAN_COLUMNS_PER_TABLE).map((block, b) => (
        <table
          key={b}
          className="report-exhaust w-full table-fixed border-collapse text-left text-sm"
          aria-label={b === 0 ? 'Exhaust side of each plan' : 'Exhaust side of each plan (continued)'}
        >
          <thead className="border-b-2 border-ink/20 text-xs uppercase tracking-wider text-ink-soft">
            <tr>
              <td className="w-44 px-2 py-1.5" />
              {block.map(({ plan, index }) => (
                <th key={plan.id} scope="col" className="px-2 py-1.5 align-bottom normal-case tracking-normal">
                  <span className="flex items-center gap-1.5 text-sm font-semibold text-ink">
                    <span aria-hidden="true" className="inline-block size-2.5 shrink-0 rounded-full" style={{ background: planColour(index) }} />
                    {plan.name}
                  </span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-line">
            {rows.map((row, r) => (
              <tr key={row.label}>
                <th scope="row" className="px-2 py-1.5 text-xs font-semibold text-ink-soft">
                  {row.label}
                </th>
                {block.map(({ plan }) =>
                  plan.exhaust ? (
                    <td key={plan.id} className="numeric px-2 py-1.5">
                      {row.value(plan, plan.exhaust)}
                    </td>
                  ) : r === 0 ? (
                    <td key={plan.id} rowSpan={rows.length} className="px-2 py-1.5 align-top text-ink-soft">
                      Compressor only
                    </td>
                  ) : null,
                )}
              </tr>
            ))}
          </tbody>
        </table>
      ))}
      {plans.map((plan) =>
        plan.exhaust ? (
          <RpmTableView
            key={plan.id}
            caption={`Turbine inlet temperature: ${plan.name}`}
            valueLabel="Turbine inlet temperature"
            table={plan.exhaust.turbineInletTemperature}
            quantity="temperature"
          />
        ) : null,
      )}
    </div>
  );
}

const REQUIREMENT_ROWS: { key: keyof Requirements; label: string; quantity: StudyQuantity }[] = [
  { key: 'minSurgeMargin', label: 'Smallest surge margin', quantity: 'fraction' },
  { key: 'minChokeMargin', label: 'Smallest choke margin', quantity: 'fraction' },
  { key: 'minSpeedMargin', label: 'Smallest speed margin', quantity: 'fraction' },
  { key: 'maxCompressorOutletTemperature', label: 'Highest compressor outlet temperature accepted', quantity: 'temperature' },
  { key: 'lambdaWarningUnderBoost', label: 'Lambda warning under boost', quantity: 'ratio' },
  { key: 'lambdaLimitUnderBoost', label: 'Lambda limit under boost', quantity: 'ratio' },
  { key: 'underBoostFrom', label: 'Under boost from', quantity: 'pressureGauge' },
];

/** The study's required margins, each as set or its default, said so. */
function requirementFacts(set: StudyDocument['requirements'], system: UnitSystem): [string, ReactNode][] {
  return REQUIREMENT_ROWS.map(({ key, label, quantity }) => {
    const value = set?.[key];
    return [
      label,
      value !== undefined ? formatStudyValue(value, quantity, system) : `${formatStudyValue(REQUIREMENT_DEFAULTS[key], quantity, system)} (default)`,
    ];
  });
}

/**
 * Every input of the study in the user's units: engine, fuel system, power assumptions, losses,
 * intercooler, scenarios with their boost schedules, plans with their maps, and the exhaust side
 * of the plans that have one. Read-only.
 */
export function StudyInputs({ data }: { data: Pick<StudyViewData, 'document' | 'mapsById' | 'mapNames'> }) {
  const system = useUnitSystem();
  const doc = data.document;
  const v = (value: unknown, quantity: StudyQuantity) => formatStudyValue(value, quantity, system);
  const e = doc.engine;
  const rpmText =
    e.rpm.kind === 'range'
      ? `${formatNumber(e.rpm.min, 21)} to ${formatNumber(e.rpm.max, 21)} rpm in steps of ${formatNumber(e.rpm.step, 21)} rpm`
      : `${e.rpm.values.map((r) => formatNumber(r, 21)).join(', ')} rpm`;
  const engineFacts: [string, ReactNode][] = [
    ['Engine', doc.engineLabel || '—'],
    ['Displacement', v(e.displacement, 'volume')],
    ['Cylinders', formatNumber(e.cylinders, 21)],
    ['Cycle', `${e.strokes}-stroke`],
    ['Engine speeds computed', rpmText],
  ];
  if (e.limits?.maxRpm !== undefined) engineFacts.push(['Engine speed limit', v(e.limits.maxRpm, 'speed')]);
  if (e.limits?.maxManifoldPressure !== undefined) engineFacts.push(['Manifold pressure limit (absolute)', v(e.limits.maxManifoldPressure, 'pressure')]);
  if (e.limits?.maxCompressorOutletTemperature !== undefined)
    engineFacts.push(['Compressor outlet temperature limit', v(e.limits.maxCompressorOutletTemperature, 'temperature')]);

  const f = doc.fuelSystem;
  const inj = f.injectors;
  const fuelFacts: [string, ReactNode][] = [
    ['Fuel', fuelText(f.fuel)],
    ['Primary injectors', `${inj.primary.count} × ${v(inj.primary.ratedFlow, 'injectorFlow')} at ${v(inj.primary.ratedPressure, 'pressure')} difference`],
  ];
  if (inj.secondary) {
    fuelFacts.push([
      'Secondary injectors',
      `${inj.secondary.count} × ${v(inj.secondary.ratedFlow, 'injectorFlow')} at ${v(inj.secondary.ratedPressure, 'pressure')} difference, from ${v(inj.secondary.switchOverRpm, 'speed')}`,
    ]);
  }
  fuelFacts.push(['Base fuel pressure', v(inj.fuelPressure, 'pressureGauge')]);
  fuelFacts.push(['Regulator', inj.regulator === 'manifold-referenced' ? '1:1, referenced to the manifold' : 'Fixed rail pressure (not referenced to boost)']);
  if (f.pumpFlowAvailable !== undefined) fuelFacts.push(['Fuel pump delivers', v(f.pumpFlowAvailable, 'fuelFlow')]);

  const p = doc.power;
  const powerFacts: [string, ReactNode][] =
    p.basis === 'bsfc'
      ? [
          ['Power from', 'Brake specific fuel consumption'],
          ['BSFC', v(p.bsfc, 'bsfc')],
        ]
      : [
          ['Power from', 'Brake thermal efficiency'],
          ['Brake thermal efficiency', v(p.brakeThermalEfficiency, 'fraction')],
        ];
  powerFacts.push(['Drivetrain loss', v(p.drivetrainLoss, 'fraction')]);

  const lossFacts: [string, ReactNode][] = [
    ['Filter and intake loss (before the compressor)', formatPressureLoss(doc.losses.inlet, system)],
    ['Intercooler and pipe loss (compressor to manifold)', formatPressureLoss(doc.losses.chargeCooler, system)],
    ['Intake heating before the compressor', v(doc.losses.inletTemperatureRise ?? 0, 'temperatureDifference')],
  ];
  const ic = doc.intercooler;
  const intercoolerFacts: [string, ReactNode][] =
    ic.kind === 'fixed'
      ? [
          ['Manifold temperature', 'Stated'],
          ['Manifold air temperature', v(ic.manifoldTemperature, 'temperature')],
        ]
      : [
          ['Manifold temperature', 'From the intercooler’s effectiveness'],
          ['Effectiveness', v(ic.effectiveness, 'fraction')],
          ['Coolant', ic.coolantTemperature === undefined ? 'Ambient air (air-to-air)' : v(ic.coolantTemperature, 'temperature')],
        ];

  return (
    <div className="space-y-6">
      <InputBlock title="Engine">
        <Facts items={engineFacts} />
        <RpmTableView caption="Volumetric efficiency" table={e.volumetricEfficiency} quantity="fraction" />
      </InputBlock>
      <InputBlock title="Fuel system">
        <Facts items={fuelFacts} />
        <RpmTableView caption="Lambda target" table={f.lambda} quantity="ratio" />
      </InputBlock>
      <InputBlock title="Power">
        <Facts items={powerFacts} />
      </InputBlock>
      <InputBlock title="Losses">
        <Facts items={lossFacts} />
      </InputBlock>
      <InputBlock title="Intercooler">
        <Facts items={intercoolerFacts} />
      </InputBlock>
      <InputBlock title="Scenarios">
        <div className="space-y-4">
          {doc.scenarios.map((s, i) => {
            const a = s.ambient;
            const ambient =
              a.altitude !== undefined
                ? `Altitude ${v(a.altitude, 'length')} (standard atmosphere), ${a.temperature !== undefined ? v(a.temperature, 'temperature') : 'standard-day temperature'}`
                : `Barometric pressure ${v(a.pressure, 'pressure')}, ${v(a.temperature, 'temperature')}`;
            return (
              <div key={i} className="report-scenario space-y-2 rounded-md border border-paper-line bg-white/60 p-3">
                <p className="text-sm">
                  <span className="font-semibold text-ink">
                    Scenario {i + 1}: {s.name}
                  </span>{' '}
                  <span className="text-ink-soft">· {ambient}</span>
                </p>
                {s.boostSchedule.map((row, j) => (
                  <RpmTableView
                    key={j}
                    caption={
                      rowKindText(row.kind, row.gear) === row.label
                        ? `Boost row: ${row.label}`
                        : `Boost row: ${row.label} (${rowKindText(row.kind, row.gear).toLowerCase()})`
                    }
                    valueLabel="Boost"
                    table={row.boost}
                    quantity="pressureGauge"
                  />
                ))}
              </div>
            );
          })}
        </div>
      </InputBlock>
      <InputBlock title="Plans">
        <div className="overflow-x-auto print:overflow-visible" tabIndex={0} role="region" aria-label="Plans">
          <table className="w-full border-collapse text-left text-sm">
            <thead className="border-b-2 border-ink/20 text-xs uppercase tracking-wider text-ink-soft">
              <tr>
                <th scope="col" className="px-2 py-1.5">
                  Plan
                </th>
                <th scope="col" className="px-2 py-1.5">
                  Compressor map
                </th>
                <th scope="col" className="px-2 py-1.5 text-right">
                  Turbochargers
                </th>
                <th scope="col" className="px-2 py-1.5 text-right">
                  Default efficiency
                </th>
                <th scope="col" className="px-2 py-1.5 text-right">
                  Off-map efficiency (assumption)
                </th>
                <th scope="col" className="px-2 py-1.5 text-right">
                  Shaft speed limit
                </th>
              </tr>
            </thead>
            <tbody className="divide-y divide-paper-line">
              {doc.plans.map((plan, i) => (
                <tr key={plan.id}>
                  <td className="px-2 py-1.5">
                    <span className="flex items-center gap-1.5">
                      <span aria-hidden="true" className="inline-block size-2.5 rounded-full" style={{ background: planColour(i) }} />
                      {plan.name}
                    </span>
                  </td>
                  <td className="px-2 py-1.5">{plan.compressorMapId ? mapName(plan.compressorMapId, data.mapsById, data.mapNames) : 'None'}</td>
                  <td className="numeric px-2 py-1.5 text-right">{plan.turbochargers}</td>
                  <td className="numeric px-2 py-1.5 text-right">{v(plan.compressorEfficiency, 'fraction')}</td>
                  <td className="numeric px-2 py-1.5 text-right">
                    {plan.offMapEfficiency !== undefined ? v(plan.offMapEfficiency, 'fraction') : 'None: off the map is not reachable'}
                  </td>
                  <td className="numeric px-2 py-1.5 text-right">{plan.maxShaftSpeed !== undefined ? v(plan.maxShaftSpeed, 'speed') : 'From the map'}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </InputBlock>
      <InputBlock title="Required margins">
        <Facts items={requirementFacts(doc.requirements, system)} />
      </InputBlock>
      {doc.plans.some((plan) => plan.exhaust) && (
        <InputBlock title="Exhaust side">
          <ExhaustInputs data={data} />
        </InputBlock>
      )}
      {doc.notes.trim() && (
        <InputBlock title="Notes">
          <p className="whitespace-pre-wrap text-sm text-ink">{doc.notes}</p>
        </InputBlock>
      )}
    </div>
  );
}
