import { Button } from '../../../../components/Button';
import { getIn } from '../../lib/draft';
import { useEditor } from './context';
import { ChoiceField, CountField, NumberField, ToggleField } from './fields';
import { RpmTableEditor } from './RpmTableEditor';
import { FieldRow, Section, SubHeading } from './Section';

type FuelKind = 'petrol' | 'ethanol-blend' | 'methanol';

export function FuelSection() {
  const editor = useEditor();
  const fuel = getIn(editor.draft, ['fuelSystem', 'fuel']) as { kind: FuelKind; ethanolPercent?: number } | undefined;
  const primary = getIn(editor.draft, ['fuelSystem', 'injectors', 'primary']) as Record<string, number> | undefined;
  const secondary = getIn(editor.draft, ['fuelSystem', 'injectors', 'secondary']);

  function chooseFuel(kind: FuelKind) {
    if (kind === 'ethanol-blend') editor.update(['fuelSystem', 'fuel'], { kind, ethanolPercent: fuel?.ethanolPercent ?? 85 });
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
            <NumberField path={['fuelSystem', 'fuel', 'ethanolPercent']} label="Ethanol content" quantity="percent" hint="Percent by volume, the rest petrol." />
          </div>
          {!editor.readOnly && (
            <Button className="mb-5" onClick={() => editor.update(['fuelSystem', 'fuel', 'ethanolPercent'], 85)} aria-label="Set the ethanol content to 85 percent (E85)">
              E85
            </Button>
          )}
        </div>
      )}
      <RpmTableEditor path={['fuelSystem', 'lambda']} title="Lambda target by rpm" valueLabel="Lambda" quantity="ratio" defaultValue={0.85} />
      <SubHeading>Injectors</SubHeading>
      <FieldRow>
        <CountField path={['fuelSystem', 'injectors', 'primary', 'count']} label="Primary injectors" />
        <NumberField path={['fuelSystem', 'injectors', 'primary', 'ratedFlow']} label="Rated flow, each" quantity="injectorFlow" />
      </FieldRow>
      <NumberField path={['fuelSystem', 'injectors', 'primary', 'ratedPressure']} label="Rated at a pressure difference of" quantity="pressure" />
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
            on ? { count: primary?.count ?? 4, ratedFlow: primary?.ratedFlow ?? 1e-5, ratedPressure: primary?.ratedPressure ?? 300_000, switchOverRpm: 5000 } : undefined,
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
