import { Button } from '#src/components/Button';
import { pathKey, type StudyDraft } from '#src/features/studies/lib/draft';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';
import { useEditor } from './context';
import { ChoiceField, CountField, NumberField, ToggleField, UnitNumberInput } from './fields';
import { RpmTableEditor } from './RpmTableEditor';
import { FieldRow, Section, SubHeading } from './Section';
import { useUnitSystem } from '#src/lib/quantities';

type FuelKind = NonNullable<NonNullable<NonNullable<StudyDraft['fuelSystem']>['fuel']>['kind']>;

export function FuelSection() {
  const editor = useEditor();
  const fuel = editor.draft.fuelSystem?.fuel;
  const primary = editor.draft.fuelSystem?.injectors?.primary;
  const secondary = editor.draft.fuelSystem?.injectors?.secondary;

  function chooseFuel(kind: FuelKind) {
    if (kind === 'ethanol-blend')
      editor.update(['fuelSystem', 'fuel'], { kind, ethanolPercent: (fuel?.kind === 'ethanol-blend' ? fuel.ethanolPercent : undefined) ?? 85 });
    else editor.update(['fuelSystem', 'fuel'], { kind });
  }

  return (
    <Section title="Fuel system" prefixes={['fuelSystem']} testId="section-fuel">
      <ChoiceField
        path={['fuelSystem', 'fuel', 'kind']}
        label="Fuel"
        options={[
          { value: 'petrol', label: 'Petrol' },
          { value: 'ethanol-blend', label: 'Ethanol blend (by volume)' },
          { value: 'methanol', label: 'Methanol' },
        ]}
        onChoose={chooseFuel}
      />
      {fuel?.kind === 'ethanol-blend' && (
        <div className="flex items-end gap-2">
          <div className="flex-1">
            <NumberField
              path={['fuelSystem', 'fuel', 'ethanolPercent']}
              label="Ethanol content"
              quantity="percent"
              hint="Percent by volume, the rest petrol."
            />
          </div>
          {!editor.readOnly && (
            <Button
              className="mb-5"
              onClick={() => editor.update(['fuelSystem', 'fuel', 'ethanolPercent'], 85)}
              aria-label="E85: set the ethanol content to 85 percent"
            >
              E85
            </Button>
          )}
        </div>
      )}
      <RpmTableEditor
        path={['fuelSystem', 'lambda']}
        rows={editor.draft.fuelSystem?.lambda}
        title="Lambda target by rpm"
        valueLabel="Lambda"
        quantity="ratio"
        defaultValue={0.85}
      />
      <SubHeading>Injectors</SubHeading>
      <FieldRow>
        <CountField path={['fuelSystem', 'injectors', 'primary', 'count']} label="Primary injectors" />
        <NumberField path={['fuelSystem', 'injectors', 'primary', 'ratedFlow']} label="Rated flow, each" quantity="injectorFlow" />
      </FieldRow>
      <NumberField path={['fuelSystem', 'injectors', 'primary', 'ratedPressure']} label="Rated at a pressure difference of" quantity="pressure" />
      <InjectorRatingFields set="primary" />
      <NumberField path={['fuelSystem', 'injectors', 'fuelPressure']} label="Base fuel pressure" quantity="pressureGauge" />
      <ChoiceField
        path={['fuelSystem', 'injectors', 'regulator']}
        label="Regulator"
        options={[
          { value: 'manifold-referenced', label: 'Rail rises with boost (1:1 regulator)' },
          { value: 'fixed-rail', label: 'Fixed rail pressure' },
        ]}
      />
      <ToggleField
        label="Staged secondary injectors"
        checked={secondary !== undefined}
        hint="A second set that opens with the primaries from a switch-over speed."
        onChange={(on) =>
          editor.update(
            ['fuelSystem', 'injectors', 'secondary'],
            on
              ? { count: primary?.count ?? 4, ratedFlow: primary?.ratedFlow ?? 1e-5, ratedPressure: primary?.ratedPressure ?? 300_000, switchOverRpm: 5000 }
              : undefined,
          )
        }
      />
      {secondary !== undefined && (
        <div className="space-y-3 border-l-2 border-teal/20 pl-3">
          <FieldRow>
            <CountField path={['fuelSystem', 'injectors', 'secondary', 'count']} label="Secondary injectors" />
            <NumberField path={['fuelSystem', 'injectors', 'secondary', 'ratedFlow']} label="Rated flow, each" quantity="injectorFlow" />
          </FieldRow>
          <FieldRow>
            <NumberField path={['fuelSystem', 'injectors', 'secondary', 'ratedPressure']} label="Rated at" quantity="pressure" />
            <NumberField path={['fuelSystem', 'injectors', 'secondary', 'switchOverRpm']} label="Switch-over speed" quantity="speed" />
          </FieldRow>
          <InjectorRatingFields set="secondary" />
        </div>
      )}
      <NumberField
        path={['fuelSystem', 'pumpFlowAvailable']}
        label="Fuel pump flow available"
        quantity="fuelFlow"
        optional
        hint="At the rail pressure it must hold. Leave empty if unknown."
      />
    </Section>
  );
}

/** Battery voltage a dead time is taken at when none is typed yet, V (a running engine's charging voltage, common practice). */
const DEFAULT_DEAD_TIME_VOLTAGE = 14;

/**
 * What an injector's rating leaves out: the density of the fluid it was rated with (a denser fuel
 * flows less at the same pressure) and its dead time, the opening delay lost on every injection,
 * at the battery voltage it was measured at.
 */
function InjectorRatingFields({ set }: { set: 'primary' | 'secondary' }) {
  const editor = useEditor();
  const unitSystem = useUnitSystem();
  const base = ['fuelSystem', 'injectors', set];
  const deadTime = editor.draft.fuelSystem?.injectors?.[set]?.deadTime;
  const deadTimeIssue = editor.issues[pathKey([...base, 'deadTime', 'time'])];
  return (
    <>
      <FieldRow>
        <NumberField
          path={[...base, 'ratingFluidDensity']}
          label="Rating fluid density"
          quantity="density"
          optional
          hint="The test fluid the flow was rated with. Empty: rated with this fuel."
        />
        <UnitNumberInput
          label="Dead time"
          value={deadTime?.time}
          onChange={(si) =>
            editor.update([...base, 'deadTime'], si === undefined ? undefined : { time: si, voltage: deadTime?.voltage ?? DEFAULT_DEAD_TIME_VOLTAGE })
          }
          quantity="duration"
          optional
          error={deadTimeIssue ? localizeIssue(deadTimeIssue, 'duration', unitSystem) : null}
          hint="Opening delay lost on every injection, from the maker's data. Empty: none."
          readOnly={editor.readOnly}
        />
      </FieldRow>
      {deadTime !== undefined && (
        <NumberField
          path={[...base, 'deadTime', 'voltage']}
          label="Dead time measured at"
          quantity="voltage"
          hint="Battery voltage: at a lower voltage the dead time is longer."
        />
      )}
    </>
  );
}
