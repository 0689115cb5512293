import { fuelProperties } from '#shared/physics';
import { fuelChoiceSchema } from '#shared/matching/input/fuel-system';
import type { StudyDraft } from '#src/features/studies/lib/draft';
import { useEditor } from './context';
import { ChoiceField, NumberField } from './fields';
import { LossFields } from './LossFields';
import { FieldRow, Section, SubHeading } from './Section';

type PowerBasis = NonNullable<NonNullable<StudyDraft['power']>['basis']>;
type IntercoolerKind = NonNullable<NonNullable<StudyDraft['intercooler']>['kind']>;

/** Lower heating value of petrol, J/kg (common practice, no source): the fallback while the fuel is not set. */
const PETROL_LHV = 44e6;

/** Power assumptions, losses and the intercooler: what turns air into power and heat into density. */
export function AssumptionsSection() {
  const editor = useEditor();
  const { power, intercooler } = editor.draft;

  function lhv(): number {
    const fuel = fuelChoiceSchema.safeParse(editor.draft.fuelSystem?.fuel);
    return fuel.success ? fuelProperties(fuel.data).lowerHeatingValue : PETROL_LHV;
  }

  // Switching basis keeps the same assumption in the other form: bsfc = 1/(η·LHV).
  function chooseBasis(basis: PowerBasis) {
    if (!power || power.basis === basis) return;
    const loss = power.drivetrainLoss;
    if (basis === 'bsfc') {
      const eta = (power.basis === 'brake-thermal-efficiency' ? power.brakeThermalEfficiency : undefined) ?? 0.3;
      editor.update(['power'], { basis, bsfc: 1 / (eta * lhv()), drivetrainLoss: loss });
    } else {
      const bsfc = (power.basis === 'bsfc' ? power.bsfc : undefined) ?? 0;
      const eta = bsfc > 0 ? 1 / (bsfc * lhv()) : 0.3;
      editor.update(['power'], { basis, brakeThermalEfficiency: Number.isFinite(eta) && eta > 0 && eta <= 1 ? eta : 0.3, drivetrainLoss: loss });
    }
  }

  function chooseIntercooler(kind: IntercoolerKind) {
    if (intercooler?.kind === kind) return;
    editor.update(['intercooler'], kind === 'fixed' ? { kind, manifoldTemperature: 318.15 } : { kind, effectiveness: 0.75 });
  }

  return (
    <Section title="Power, losses and intercooler" prefixes={['power', 'losses', 'intercooler']} testId="section-assumptions">
      <SubHeading>Power</SubHeading>
      <ChoiceField
        path={['power', 'basis']}
        label="Power from air by"
        options={[
          { value: 'brake-thermal-efficiency', label: 'Brake thermal efficiency' },
          { value: 'bsfc', label: 'Brake specific fuel consumption' },
        ]}
        onChoose={chooseBasis}
      />
      <FieldRow>
        {power?.basis === 'bsfc' ? (
          <NumberField path={['power', 'bsfc']} label="BSFC" quantity="bsfc" hint="Of the fuel that burns (the stoichiometric share)." />
        ) : (
          <NumberField path={['power', 'brakeThermalEfficiency']} label="Brake thermal efficiency" quantity="fraction" />
        )}
        <NumberField path={['power', 'drivetrainLoss']} label="Drivetrain loss" quantity="fraction" hint="Share of crank power lost before the wheels." />
      </FieldRow>
      <SubHeading>Losses</SubHeading>
      <LossFields
        path={['losses', 'inlet']}
        loss={editor.draft.losses?.inlet}
        label="Inlet loss"
        hint="Filter and intake, before the compressor."
        flow="air"
        testId="loss-inlet"
      />
      <LossFields
        path={['losses', 'chargeCooler']}
        loss={editor.draft.losses?.chargeCooler}
        label="Charge-cooler loss"
        hint="Compressor outlet to manifold."
        flow="air"
        testId="loss-charge-cooler"
      />
      <NumberField
        path={['losses', 'inletTemperatureRise']}
        label="Intake heating"
        quantity="temperatureDifference"
        optional
        hint="How much warmer than ambient the air reaches the compressor (a temperature difference)."
      />
      <SubHeading>Intercooler</SubHeading>
      <ChoiceField
        path={['intercooler', 'kind']}
        label="Manifold temperature from"
        options={[
          { value: 'effectiveness', label: 'Intercooler effectiveness' },
          { value: 'fixed', label: 'A fixed manifold temperature' },
        ]}
        onChoose={chooseIntercooler}
      />
      {intercooler?.kind === 'fixed' ? (
        <NumberField path={['intercooler', 'manifoldTemperature']} label="Manifold temperature" quantity="temperature" />
      ) : (
        <FieldRow>
          <NumberField path={['intercooler', 'effectiveness']} label="Effectiveness" quantity="fraction" hint="0 % is no cooling." />
          <NumberField
            path={['intercooler', 'coolantTemperature']}
            label="Coolant temperature"
            quantity="temperature"
            optional
            hint="Empty: the scenario's ambient air (air-to-air)."
          />
        </FieldRow>
      )}
    </Section>
  );
}
