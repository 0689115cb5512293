import { GRIP_PRESETS } from '#shared/drive/vehicle';
import type { StudyDocument } from '#shared/schemas/study';
import { SelectField } from '#src/components/SelectField';
import { TextField } from '#src/components/TextField';
import type { DraftErrors, VehicleDraft } from '../vehicle-draft';

type Field = Exclude<keyof VehicleDraft, 'drivenAxle' | 'rotors' | 'scenario'>;

/** Each typed field: its label, the unit shown and a hint where the figure is not obvious. */
const FIELDS: { key: Field; label: string; hint?: string; allWheelOnly?: boolean }[] = [
  { key: 'mass', label: 'Mass as it runs (kg)', hint: 'With driver and fuel.' },
  { key: 'drivenAxleWeightPercent', label: 'Weight on the driven axle at rest (%)', hint: 'All-wheel drive: on the front axle.' },
  { key: 'frontTorquePercent', label: 'Drive torque to the front axle (%)', allWheelOnly: true },
  { key: 'cgHeight', label: 'Centre of gravity height (m)' },
  { key: 'wheelbase', label: 'Wheelbase (m)' },
  { key: 'tyreRadius', label: 'Tyre rolling radius (m)' },
  { key: 'grip', label: 'Tyre grip coefficient', hint: 'Or pick a preset above.' },
  { key: 'gearRatios', label: 'Gear ratios, first gear first', hint: 'Separated by commas or spaces, e.g. 3.25, 2.05, 1.46, 1.12.' },
  { key: 'finalDrive', label: 'Final drive ratio' },
  { key: 'drivetrainLossPercent', label: 'Drivetrain loss (%)', hint: "Blank: the study's power assumption." },
  { key: 'shiftRpm', label: 'Shift up at (rpm)' },
  { key: 'shiftTime', label: 'Shift time (s)' },
  { key: 'dragArea', label: 'Drag area Cd·A (m²)' },
  { key: 'rollingResistance', label: 'Rolling resistance coefficient' },
  { key: 'spoolGear', label: 'Time to boost: gear held', hint: 'Blank: second gear.' },
  { key: 'spoolStartRpm', label: 'Time to boost: from (rpm)', hint: "Blank: the study's lowest rpm." },
  {
    key: 'launchRpm',
    label: 'Acceleration run: launch at (rpm)',
    hint: "The clutch slips at this speed until the car catches up. Blank: the study's lowest rpm.",
  },
  { key: 'runSpeedKmh', label: 'Acceleration run: to (km/h)', hint: 'Blank: 100 km/h.' },
];

/** The vehicle's fields with presets for the grip; every message beside its field. */
export function VehicleForm({
  draft,
  errors,
  document,
  readOnly,
  onChange,
}: {
  draft: VehicleDraft;
  errors: DraftErrors;
  document: StudyDocument;
  readOnly: boolean;
  onChange: (draft: VehicleDraft) => void;
}) {
  const set = (key: keyof VehicleDraft, value: string) => onChange({ ...draft, [key]: value });
  const preset = GRIP_PRESETS.find((p) => String(p.grip) === draft.grip.trim())?.key ?? 'own';
  return (
    <fieldset disabled={readOnly} className="space-y-4">
      <legend className="sr-only">Vehicle</legend>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
        <SelectField
          label="Driven wheels"
          name="drivenAxle"
          value={draft.drivenAxle}
          onChange={(e) => set('drivenAxle', e.target.value)}
          options={[
            { value: 'front', label: 'Front' },
            { value: 'rear', label: 'Rear' },
            { value: 'all', label: 'All, with a split' },
          ]}
        />
        <SelectField
          label="Tyre grip preset"
          name="gripPreset"
          value={preset}
          onChange={(e) => {
            const p = GRIP_PRESETS.find((x) => x.key === e.target.value);
            if (p) set('grip', String(p.grip));
          }}
          options={[
            ...GRIP_PRESETS.map((p) => ({ value: p.key, label: `${p.label}: ${p.grip} (common practice, no source)` })),
            { value: 'own', label: 'Our own figure' },
          ]}
        />
        <SelectField
          label="Scenario the car runs in"
          name="scenario"
          value={draft.scenario}
          onChange={(e) => set('scenario', e.target.value)}
          error={errors.scenario}
          options={[
            { value: '', label: `First scenario (${document.scenarios[0].name})` },
            ...document.scenarios.map((s) => ({ value: s.name, label: s.name })),
          ]}
        />
        {FIELDS.filter((f) => !f.allWheelOnly || draft.drivenAxle === 'all').map((f) => (
          <TextField
            key={f.key}
            label={f.label}
            name={f.key}
            inputMode={f.key === 'gearRatios' ? 'text' : 'decimal'}
            value={draft[f.key]}
            onChange={(e) => set(f.key, e.target.value)}
            error={errors[f.key]}
            hint={f.hint}
          />
        ))}
      </div>
      <div>
        <p className="text-sm font-semibold text-ink">Rotor of each plan</p>
        <p className="text-sm text-ink-soft">
          The rotor&apos;s inertia (kg·m²) from its maker, or the compressor wheel&apos;s size (mm) to estimate it from (3·10⁻⁵ kg·m² at 55 mm, scaled by the
          fifth power of the size: common practice, no source). Blank: a 55 mm wheel.
        </p>
        <div className="mt-2 grid gap-3 sm:grid-cols-2">
          {document.plans.map((plan) => (
            <div key={plan.id} className="grid grid-cols-2 gap-2">
              <TextField
                label={`${plan.name}: inertia (kg·m²)`}
                name={`rotor-${plan.id}-inertia`}
                inputMode="decimal"
                value={draft.rotors[plan.id]?.inertia ?? ''}
                onChange={(e) => onChange({ ...draft, rotors: { ...draft.rotors, [plan.id]: { ...draft.rotors[plan.id], inertia: e.target.value } } })}
              />
              <TextField
                label={`${plan.name}: wheel (mm)`}
                name={`rotor-${plan.id}-wheel`}
                inputMode="decimal"
                value={draft.rotors[plan.id]?.wheelMm ?? ''}
                onChange={(e) => onChange({ ...draft, rotors: { ...draft.rotors, [plan.id]: { ...draft.rotors[plan.id], wheelMm: e.target.value } } })}
              />
            </div>
          ))}
        </div>
        {errors.rotors && <p className="mt-1 text-sm font-medium text-copper-ink">{errors.rotors}</p>}
      </div>
    </fieldset>
  );
}
