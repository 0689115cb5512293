import { useId, useState } from 'react';
import { FieldError, inputClass } from '#src/components/TextField';
import { pathKey } from '#src/features/studies/lib/draft';
import { useEditor } from './context';
import { ChoiceField, CountField, NumberField, ReadValue, TextInputField } from './fields';
import { RpmTableEditor } from './RpmTableEditor';
import { FieldRow, Section, SubHeading } from './Section';

/** An explicit rpm list typed as "2500, 3000, 4000". */
function RpmListField() {
  const editor = useEditor();
  const id = useId();
  const rpm = editor.draft.engine?.rpm;
  const values = (rpm?.kind === 'list' ? rpm.values : undefined) ?? [];
  const joined = values.join(', ');
  const [typed, setTyped] = useState(joined);
  const [error, setError] = useState<string | null>(null);
  const [focused, setFocused] = useState(false);
  // Follow the list when it changes elsewhere (a loaded revision), but never under the typing hand.
  const text = focused || error !== null ? typed : joined;
  const issue = error ?? editor.issues[pathKey(['engine', 'rpm', 'values'])] ?? null;
  if (editor.readOnly) return <ReadValue label="Engine speeds (rpm)">{values.join(', ')}</ReadValue>;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold text-ink">
        Engine speeds (rpm, separated by commas)
      </label>
      <input
        id={id}
        value={text}
        aria-invalid={issue ? true : undefined}
        onFocus={() => {
          if (error === null) setTyped(joined);
          setFocused(true);
        }}
        onBlur={() => setFocused(false)}
        onChange={(e) => {
          setTyped(e.target.value);
          const parts = e.target.value.split(/[,;\s]+/).filter(Boolean);
          const numbers = parts.map(Number);
          if (parts.length === 0 || numbers.some((n) => !Number.isFinite(n))) return setError('Type engine speeds as numbers separated by commas.');
          setError(null);
          editor.update(['engine', 'rpm', 'values'], numbers);
        }}
        className={inputClass}
      />
      {issue && <FieldError id={`${id}-error`}>{issue}</FieldError>}
    </div>
  );
}

export function EngineSection() {
  const editor = useEditor();
  const rpm = editor.draft.engine?.rpm;

  function chooseRpmKind(kind: 'range' | 'list') {
    if (!rpm || rpm.kind === kind) return;
    if (kind === 'list') {
      const values: number[] = [];
      if (rpm.kind === 'range' && rpm.step !== undefined && rpm.step > 0 && rpm.min !== undefined && rpm.max !== undefined)
        for (let n = rpm.min; n <= rpm.max + 1e-9 && values.length < 400; n += rpm.step) values.push(n);
      editor.update(['engine', 'rpm'], { kind: 'list', values: values.length ? values : [3000] });
    } else {
      const values = (rpm.kind === 'list' ? rpm.values : undefined) ?? [];
      const min = values[0] ?? 2500;
      const max = values[values.length - 1] ?? 8000;
      editor.update(['engine', 'rpm'], { kind: 'range', min, max: max > min ? max : min + 500, step: 250 });
    }
  }

  return (
    <Section title="Engine" prefixes={['engine', 'engineLabel']} testId="section-engine">
      <TextInputField path={['engineLabel']} label="Engine label" hint="Shown in the study list and searched, e.g. “2.0 L four, hill-climb, E85”." />
      <FieldRow>
        <NumberField path={['engine', 'displacement']} label="Displacement" quantity="volume" hint="All cylinders together." />
        <CountField path={['engine', 'cylinders']} label="Cylinders" />
      </FieldRow>
      <ChoiceField
        path={['engine', 'strokes']}
        label="Cycle"
        options={[
          { value: 4, label: 'Four-stroke' },
          { value: 2, label: 'Two-stroke' },
        ]}
        onChoose={(strokes) => {
          // The trapping efficiency belongs to a two-stroke: switching to four drops it.
          editor.update(['engine', 'strokes'], strokes);
          if (strokes === 4) editor.update(['engine', 'trappingEfficiency'], undefined);
        }}
      />
      {editor.draft.engine?.strokes === 2 && (
        <NumberField
          path={['engine', 'trappingEfficiency']}
          label="Trapping efficiency"
          quantity="fraction"
          optional
          hint="Share of the delivered air the cylinders keep when the ports close; the rest short-circuits to the exhaust. Fuel and power follow the trapped air, the compressor passes all of it. Empty: 100 %."
        />
      )}
      <SubHeading>Engine speeds computed</SubHeading>
      <ChoiceField
        path={['engine', 'rpm', 'kind']}
        label="Given as"
        options={[
          { value: 'range', label: 'A range with a step' },
          { value: 'list', label: 'A list of speeds' },
        ]}
        onChoose={chooseRpmKind}
      />
      {rpm?.kind === 'list' ? (
        <RpmListField />
      ) : (
        <div className="grid grid-cols-3 gap-3">
          <NumberField path={['engine', 'rpm', 'min']} label="From" quantity="speed" />
          <NumberField path={['engine', 'rpm', 'max']} label="To" quantity="speed" />
          <NumberField path={['engine', 'rpm', 'step']} label="Step" quantity="speed" />
        </div>
      )}
      <RpmTableEditor
        path={['engine', 'volumetricEfficiency']}
        rows={editor.draft.engine?.volumetricEfficiency}
        title="Volumetric efficiency by rpm"
        valueLabel="Volumetric efficiency"
        quantity="fraction"
        defaultValue={0.9}
        testId="ve-table"
      />
      <p className="text-xs text-ink-soft">
        Referred to manifold density, as usual for pressure-charged engines; read between rows by straight lines and held flat beyond the first and last.
      </p>
      <SubHeading>Limits (optional)</SubHeading>
      <p className="text-xs text-ink-soft">Each limit crossed is a finding in red. Leave a box empty for no limit.</p>
      <FieldRow>
        <NumberField path={['engine', 'limits', 'maxRpm']} label="Rpm limit" quantity="speed" optional />
        <NumberField path={['engine', 'limits', 'maxManifoldPressure']} label="Manifold pressure limit (absolute)" quantity="pressure" optional />
      </FieldRow>
      <NumberField path={['engine', 'limits', 'maxCompressorOutletTemperature']} label="Compressor outlet temperature limit" quantity="temperature" optional />
    </Section>
  );
}
