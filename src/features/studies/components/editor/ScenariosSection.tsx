import { Button } from '#src/components/Button';
import { scenarioDashes } from '#src/components/plots/style';
import type { BoostRowDraft, ScenarioDraft } from '#src/features/studies/lib/draft';
import { useEditor } from './context';
import { ChoiceField, CountField, GroupIssue, NumberField, TextInputField } from './fields';
import { RpmTableEditor } from './RpmTableEditor';
import { FieldRow, Section, SubHeading } from './Section';

/** A first boost row: full load, 100 kPa from 3000 rpm (invented starting values the user replaces). */
const FIRST_BOOST_ROW: BoostRowDraft = { label: 'Full load', kind: 'full-load', boost: [{ rpm: 3000, value: 100_000 }] };

/** A small picture of the line dash a scenario is drawn with on the plots. */
function DashSample({ index }: { index: number }) {
  const dash = scenarioDashes[index % scenarioDashes.length];
  const pattern: Record<string, string | undefined> = {
    solid: undefined,
    dash: '6 4',
    dot: '2 3',
    dashdot: '6 3 2 3',
    longdash: '10 4',
    longdashdot: '10 3 2 3',
  };
  return (
    <svg aria-hidden="true" width="34" height="8" className="shrink-0 text-ink">
      <line x1="1" y1="4" x2="33" y2="4" stroke="currentColor" strokeWidth="2" strokeDasharray={pattern[dash]} />
    </svg>
  );
}

function BoostRowEditor({ si, ri, row, rows }: { si: number; ri: number; row: BoostRowDraft; rows: readonly BoostRowDraft[] }) {
  const editor = useEditor();
  const base = ['scenarios', si, 'boostSchedule', ri] as const;
  function chooseKind(kind: NonNullable<BoostRowDraft['kind']>) {
    const { gear: _gear, ...rest } = row;
    editor.update(base, kind === 'gear' ? { ...rest, kind, gear: row.gear ?? ri + 1 } : { ...rest, kind });
  }
  return (
    <div className="space-y-3 rounded-md border border-paper-line bg-paper/40 p-3" data-testid={`boost-row-${si}-${ri}`}>
      <div className="flex items-start justify-between gap-2">
        <SubHeading>Boost row {ri + 1}</SubHeading>
        {!editor.readOnly && (
          <Button
            variant="quiet"
            disabled={rows.length <= 1}
            onClick={() =>
              editor.update(
                ['scenarios', si, 'boostSchedule'],
                rows.filter((_r, k) => k !== ri),
              )
            }
            aria-label={`Remove row: boost row ${row.label}`}
          >
            Remove row
          </Button>
        )}
      </div>
      <FieldRow>
        <TextInputField path={[...base, 'label']} label="Label" maxLength={100} />
        <ChoiceField
          path={[...base, 'kind']}
          label="Kind"
          options={[
            { value: 'full-load', label: 'Full load' },
            { value: 'gear', label: 'One gear' },
            { value: 'part-throttle', label: 'Part throttle' },
          ]}
          onChoose={chooseKind}
        />
      </FieldRow>
      {row.kind === 'gear' && <CountField path={[...base, 'gear']} label="Gear" />}
      <RpmTableEditor
        path={[...base, 'boost']}
        rows={row.boost}
        title={`Boost target, ${row.label || `row ${ri + 1}`}`}
        valueLabel="Boost"
        quantity="pressureGauge"
        defaultValue={100_000}
      />
    </div>
  );
}

export function ScenariosSection() {
  const editor = useEditor();
  const scenarios = editor.draft.scenarios ?? [];

  function chooseAmbient(si: number, mode: 'altitude' | 'pressure') {
    const a = scenarios[si].ambient ?? {};
    const humidity = a.relativeHumidity !== undefined ? { relativeHumidity: a.relativeHumidity } : {};
    if (mode === 'altitude')
      editor.update(
        ['scenarios', si, 'ambient'],
        a.temperature === undefined ? { altitude: 0, ...humidity } : { altitude: 0, temperature: a.temperature, ...humidity },
      );
    else editor.update(['scenarios', si, 'ambient'], { pressure: 101_325, temperature: a.temperature ?? 288.15, ...humidity });
  }

  function addScenario() {
    const last = scenarios[scenarios.length - 1];
    const copy: ScenarioDraft = last
      ? structuredClone(last)
      : {
          name: '',
          ambient: { pressure: 101_325, temperature: 293.15 },
          boostSchedule: [FIRST_BOOST_ROW],
        };
    copy.name = `Scenario ${scenarios.length + 1}`;
    editor.update(['scenarios'], [...scenarios, copy]);
  }

  return (
    <Section title="Scenarios" prefixes={['scenarios']} testId="section-scenarios">
      <p className="text-xs text-ink-soft">
        Conditions of the day and a boost schedule. Every boost row is its own operating line for every plan; scenarios are told apart by line dash.
      </p>
      <GroupIssue path={['scenarios']} />
      {scenarios.map((s, si) => {
        const mode = s.ambient?.altitude !== undefined ? 'altitude' : 'pressure';
        const boostRows = s.boostSchedule ?? [];
        return (
          <fieldset key={si} className="space-y-3 rounded-md border border-ink/15 p-3" data-testid={`scenario-${si}`}>
            <legend className="flex items-center gap-2 px-1 text-sm font-semibold text-ink">
              <DashSample index={si} />
              Scenario {si + 1}
            </legend>
            <TextInputField path={['scenarios', si, 'name']} label="Name" maxLength={100} />
            <ChoiceField
              path={['scenarios', si, 'ambient']}
              label="Ambient pressure from"
              value={mode}
              options={[
                { value: 'altitude', label: 'Altitude (standard atmosphere)' },
                { value: 'pressure', label: 'Barometric pressure' },
              ]}
              onChoose={(m) => chooseAmbient(si, m)}
            />
            <FieldRow>
              {mode === 'altitude' ? (
                <NumberField path={['scenarios', si, 'ambient', 'altitude']} label="Altitude" quantity="length" />
              ) : (
                <NumberField path={['scenarios', si, 'ambient', 'pressure']} label="Barometric pressure (absolute)" quantity="pressure" />
              )}
              <NumberField
                path={['scenarios', si, 'ambient', 'temperature']}
                label="Air temperature"
                quantity="temperature"
                optional={mode === 'altitude'}
                hint={mode === 'altitude' ? 'Empty: the standard-day temperature at that altitude.' : undefined}
              />
            </FieldRow>
            <NumberField
              path={['scenarios', si, 'ambient', 'relativeHumidity']}
              label="Relative humidity"
              quantity="fraction"
              optional
              hint="Empty: dry air (0 %). Water vapour takes room in the charge but burns nothing: humid air makes less power."
            />
            <GroupIssue path={['scenarios', si, 'ambient']} />
            <GroupIssue path={['scenarios', si, 'boostSchedule']} />
            {boostRows.map((row, ri) => (
              <BoostRowEditor key={ri} si={si} ri={ri} row={row} rows={boostRows} />
            ))}
            {!editor.readOnly && (
              <div className="flex flex-wrap gap-2">
                <Button
                  variant="quiet"
                  disabled={boostRows.length >= 20}
                  onClick={() => {
                    const last = boostRows[boostRows.length - 1];
                    const row: BoostRowDraft = last ? { ...structuredClone(last), label: `Row ${boostRows.length + 1}` } : FIRST_BOOST_ROW;
                    editor.update(['scenarios', si, 'boostSchedule'], [...boostRows, row]);
                  }}
                >
                  + Add boost row
                </Button>
                <Button
                  variant="quiet"
                  disabled={scenarios.length >= 20}
                  onClick={() =>
                    editor.update(
                      ['scenarios'],
                      [...scenarios.slice(0, si + 1), { ...structuredClone(s), name: `${s.name ?? ''} (copy)` }, ...scenarios.slice(si + 1)],
                    )
                  }
                >
                  Duplicate scenario
                </Button>
                <Button
                  variant="quiet"
                  disabled={scenarios.length <= 1}
                  onClick={() =>
                    editor.update(
                      ['scenarios'],
                      scenarios.filter((_x, k) => k !== si),
                    )
                  }
                >
                  Remove scenario
                </Button>
              </div>
            )}
          </fieldset>
        );
      })}
      {!editor.readOnly && (
        <Button onClick={addScenario} disabled={scenarios.length >= 20}>
          + Add scenario
        </Button>
      )}
    </Section>
  );
}
