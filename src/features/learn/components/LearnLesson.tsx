import { useMemo, useState, type ReactNode } from 'react';
import type { CompressorMap } from '#shared/maps/types';
import type { OperatingPoint, PointValues } from '#shared/matching/result';
import { Alert } from '#src/components/Alert';
import { Card } from '#src/components/Card';
import { CompressorMapPlot } from '#src/components/plots/CompressorMapPlot';
import type { OperatingLineView } from '#src/components/plots/types';
import { DEFAULT_LESSON, runLesson, stepsById, type LessonInputs } from '../lesson';
import { LessonControls } from './LessonControls';
import { WorkingStepCard } from './WorkingStepCard';
import { formatNumber, formatQuantity, krpmLabel, useUnitSystem } from '#src/lib/quantities';

interface Section {
  id: string;
  title: string;
  words: ReactNode;
  stepIds: string[];
}

// Our own plain words, one idea per section, in the order the air meets them.
const SECTIONS: Section[] = [
  {
    id: 'ambient',
    title: '1. The air outside',
    words: (
      <>
        Everything starts with the air around the car. The higher you go, the less air sits above you, so its pressure falls. The International Standard
        Atmosphere (ISA) is an agreed average day that says how fast: pressure follows a power law of the standard-day temperature. The temperature itself is
        the one you set, because a real day is rarely the standard one.
      </>
    ),
    stepIds: ['isa-temperature', 'ambient-pressure', 'ambient-temperature'],
  },
  {
    id: 'inlet',
    title: '2. Air arriving at the compressor',
    words: (
      <>
        Before the wheel, the air filter and the intake pipe cost a little pressure. What is left is the compressor’s inlet pressure <em>p₁</em>. Its density,
        the mass of air in each cubic metre, follows from the ideal-gas law: more pressure packs more air in, more heat spreads it out. Temperatures in these
        sums are always absolute (kelvin).
      </>
    ),
    stepIds: ['inlet-pressure', 'inlet-temperature', 'inlet-density'],
  },
  {
    id: 'airflow',
    title: '3. How much air the engine swallows',
    words: (
      <>
        Boost is gauge pressure: how far the manifold sits above the outside air. An engine is an air pump. Each cycle its cylinders fill their swept volume
        with air at manifold density, to a share set by its volumetric efficiency, and a four-stroke engine completes a cycle every second revolution. So the
        air mass flow grows with rpm, with boost (denser air) and with a cooler charge.
      </>
    ),
    stepIds: ['manifold-pressure', 'manifold-temperature', 'manifold-density', 'engine-airflow'],
  },
  {
    id: 'corrected',
    title: '4. Corrected flow: the across-the-page axis of the map',
    words: (
      <>
        A compressor map is measured on a test stand with air at one set of inlet conditions, the map’s <em>reference</em>. Out on the road the air is thinner
        or warmer, and the same wheel at the same place on its map then moves a different mass of air each second. Corrected flow undoes that: it scales the
        real mass flow to what the compressor would pass at the reference conditions. Thin air (low <em>p₁</em>) and warm air (high <em>T₁</em>) both make the
        corrected flow larger than the real one, so the point moves to the right on the map.
      </>
    ),
    stepIds: ['corrected-flow'],
  },
  {
    id: 'ratio',
    title: '5. Pressure ratio: the up-the-page axis',
    words: (
      <>
        The compressor must deliver the manifold pressure plus what the intercooler and pipes lose on the way, starting from its own inlet pressure. The map’s
        height is the ratio of the two absolute pressures. The same boost therefore asks for a higher ratio up a mountain, where the compressor starts from
        less.
      </>
    ),
    stepIds: ['outlet-pressure', 'pressure-ratio'],
  },
  {
    id: 'temperature',
    title: '6. How hot the air leaves',
    words: (
      <>
        Squeezing air heats it. A perfect (isentropic) compressor would heat it by a fixed amount for each pressure ratio; a real one heats it more, and the
        efficiency read from the map says how much more. That is why a point in the middle of the efficiency islands gives cooler air than one near the edges.
      </>
    ),
    stepIds: ['compressor-efficiency', 'isentropic-outlet-temperature', 'outlet-temperature'],
  },
  {
    id: 'map',
    title: '7. Where the point lands on the map',
    words: (
      <>
        With corrected flow across and pressure ratio up, the point has its place. To the left of the surge line the compressor cannot hold the pressure it has
        made and the flow stalls and reverses in pulses; to the right of the choke limit the wheel is passing all the air it can and its efficiency collapses;
        the speed lines say how fast the shaft must spin. The margins say how far the point sits from each of these edges.
      </>
    ),
    stepIds: ['shaft-speed', 'surge-margin', 'choke-margin', 'speed-margin'],
  },
];

const LOCATION_WORDS: Record<NonNullable<PointValues['mapLocation']>, string> = {
  inside: 'inside the map',
  'left-of-surge': 'left of the surge line',
  'beyond-choke': 'beyond the choke limit',
  'above-top-speed': 'above the top speed line',
  'below-map': 'below the map (too little pressure ratio to read)',
  'off-map': 'off the map',
};

function lineView(key: string, label: string, planIndex: number, point: OperatingPoint): OperatingLineView {
  const v = point.values;
  return {
    key,
    label,
    planIndex,
    scenarioIndex: 0,
    points: v
      ? [
          {
            rpm: v.rpm,
            correctedMassFlow: v.correctedMassFlow,
            volumeFlow: v.inletVolumeFlow,
            pressureRatio: v.pressureRatio,
            hover: [
              { label: 'Engine speed', value: v.rpm, kind: 'speed' },
              { label: 'Boost (gauge)', value: v.boost, kind: 'pressure' },
              { label: 'Corrected mass flow', value: v.correctedMassFlow, kind: 'massFlow' },
              { label: 'Pressure ratio', value: v.pressureRatio, kind: 'ratio' },
            ],
          },
        ]
      : [],
  };
}

function Summary({ point, standard, hasMap, mapLoading }: { point: OperatingPoint; standard: OperatingPoint; hasMap: boolean; mapLoading: boolean }) {
  const system = useUnitSystem();
  const v = point.values;
  if (!v)
    return (
      <Alert tone="error" title="This point cannot be worked out">
        {point.findings.map((f) => f.message).join(' ')}
      </Alert>
    );
  const s = standard.values;
  const rows: [string, string][] = [
    ['Air mass flow', formatQuantity(v.massFlow, 'massFlow', system)],
    ['Corrected mass flow', formatQuantity(v.correctedMassFlow, 'massFlow', system)],
    ['Pressure ratio', formatNumber(v.pressureRatio, 3)],
    // Off the map the compressor cannot deliver the point: there is no outlet temperature to give.
    ['Compressor outlet temperature', v.reachable === false ? 'not reachable' : formatQuantity(v.compressorOutletTemperature, 'temperature', system)],
  ];
  if (v.shaftSpeed !== null) rows.push(['Shaft speed', krpmLabel(v.shaftSpeed)]);
  if (v.surgeMargin !== null) rows.push(['Surge margin', formatQuantity(v.surgeMargin, 'fraction', system)]);
  return (
    <div className="space-y-3">
      <p className="text-ink" aria-live="polite">
        {hasMap ? (
          <>
            The point lands{' '}
            <strong className={v.mapLocation === 'inside' ? 'text-teal-dark' : 'text-copper-ink'}>{LOCATION_WORDS[v.mapLocation ?? 'inside']}</strong>.
            {v.reachable === false && ' The compressor cannot deliver it there, so no efficiency, outlet temperature or power is given.'}
          </>
        ) : mapLoading ? (
          'The demo map is on its way; meanwhile the point is drawn on plain axes.'
        ) : (
          'Without the map the point is drawn on plain axes.'
        )}{' '}
        {s && (
          <>
            On a standard day at sea level the same engine and boost would sit at {formatQuantity(s.correctedMassFlow, 'massFlow', system)} and pressure ratio{' '}
            {formatNumber(s.pressureRatio, 3)}.
          </>
        )}
      </p>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-3">
        {rows.map(([label, value]) => (
          <div key={label}>
            <dt className="text-ink-soft">{label}</dt>
            <dd className="numeric font-semibold text-ink">{value}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

/** The live example: four inputs, the point on the demo map, and every step from the outside air to the map. */
export function LearnLesson({ map, mapLoading, mapError }: { map: CompressorMap | null; mapLoading: boolean; mapError: string | null }) {
  const [inputs, setInputs] = useState<LessonInputs>(DEFAULT_LESSON);
  const lesson = useMemo(() => runLesson(inputs, map), [inputs, map]);
  const lines = useMemo(
    () => [lineView('yours', 'Your conditions', 0, lesson.point), lineView('standard', 'Standard day, sea level', 1, lesson.standardDay)],
    [lesson],
  );
  const findings = lesson.point.findings;

  return (
    <div className="space-y-8">
      <section aria-labelledby="learn-why" className="max-w-prose space-y-3 text-ink">
        <h2 id="learn-why" className="text-xl font-semibold">
          Why a map has these two axes
        </h2>
        <p>
          A compressor map shows, for one compressor, which combinations of air flow and pressure rise it can make, how fast its shaft spins to make them and
          how efficiently. To find where your engine puts the compressor, you need two numbers for each engine speed: the <strong>corrected mass flow</strong>{' '}
          (across the page) and the <strong>pressure ratio</strong> (up the page). Move the sliders and follow each number from the outside air to the point on
          the map. The example runs through the same engine that computes every Study.
        </p>
      </section>

      <div className="grid gap-6 lg:grid-cols-[18rem_1fr]">
        <Card title="The example" className="self-start lg:sticky lg:top-4">
          <LessonControls inputs={inputs} onChange={setInputs} />
        </Card>
        <Card title="Where it lands">
          <div className="space-y-4">
            {mapError && (
              <Alert tone="error" title="The demo map could not be loaded">
                {mapError}
              </Alert>
            )}
            <Summary point={lesson.point} standard={lesson.standardDay} hasMap={map !== null} mapLoading={mapLoading} />
            <CompressorMapPlot
              map={map}
              lines={lines}

              highlight={{ lineKey: 'yours', rpm: inputs.rpm }}
              height={440}
              exportName="Learn example"
            />
            {findings.length > 0 && (
              <div className="text-sm">
                <p className="font-semibold text-ink">What the engine says about this point</p>
                <ul className="mt-1 list-disc space-y-0.5 pl-5 text-ink-soft">
                  {findings.map((f, i) => (
                    <li key={i}>
                      <span className={f.severity === 'limit' ? 'font-semibold text-limit' : f.severity === 'warning' ? 'font-semibold text-copper-ink' : ''}>
                        {f.severity}
                      </span>
                      : {f.message}
                    </li>
                  ))}
                </ul>
              </div>
            )}
          </div>
        </Card>
      </div>

      <div className="space-y-8">
        {SECTIONS.map((section) => {
          const steps = stepsById(lesson.steps, section.stepIds);
          return (
            <section key={section.id} aria-labelledby={`learn-${section.id}`} className="space-y-3">
              <h3 id={`learn-${section.id}`} className="text-lg font-semibold text-ink">
                {section.title}
              </h3>
              <p className="max-w-prose text-ink">{section.words}</p>
              {steps.length > 0 ? (
                <div className="grid gap-3 xl:grid-cols-2">
                  {steps.map((step) => (
                    <WorkingStepCard key={step.id} step={step} />
                  ))}
                </div>
              ) : (
                <p className="text-sm text-ink-soft">Nothing to show for this point here{map ? '' : ' (no map)'}.</p>
              )}
            </section>
          );
        })}
      </div>

      <section aria-labelledby="learn-sources" className="max-w-prose space-y-2 border-t border-paper-line pt-6 text-sm text-ink-soft">
        <h3 id="learn-sources" className="text-base font-semibold text-ink">
          Where the formulas come from
        </h3>
        <p>
          Each step names its source under it. The air around the engine follows the standard atmosphere (ISO 2533:1975, with ICAO Doc 7488, the troposphere);
          the air the engine takes in follows Heywood, <em>Internal Combustion Engine Fundamentals</em> (1st edition, 1988), section 2.10; corrected flow,
          pressure ratio and outlet temperature follow NASA Glenn Research Center’s pages on corrected airflow and on compressor thermodynamics, and Isermann,{' '}
          <em>Combustion Engine Diagnosis</em> (2017), equations 5.4.14 and 5.4.15. Static pressures stand in for total pressures, and each engine speed is
          worked on its own (quasi-steady).
        </p>
      </section>
    </div>
  );
}
