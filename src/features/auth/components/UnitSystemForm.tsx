import { unitSystemSchema, type UnitSystem } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { useUpdateProfile } from '../api/update-profile';
import { unitSystemNames } from '#src/lib/quantities';

const examples: Record<UnitSystem, string> = {
  si: 'kPa, °C, kg/s, kW, litres',
  us: 'psi, °F, lb/min, hp, cubic inches',
};

/** The account's unit system as a radio group; a choice is saved at once. */
export function UnitSystemForm({ value }: { value: UnitSystem }) {
  const update = useUpdateProfile();
  const shown = update.isPending && update.variables?.unitSystem ? update.variables.unitSystem : value;
  return (
    <fieldset className="space-y-3" aria-busy={update.isPending || undefined}>
      <legend className="mb-2 text-sm font-semibold text-ink">Unit system</legend>
      {unitSystemSchema.options.map((system) => (
        <label
          key={system}
          className="flex cursor-pointer items-start gap-3 rounded-md border border-paper-line bg-white/60 px-3 py-2 has-[:checked]:border-teal has-[:checked]:bg-teal-light/40"
        >
          <input
            type="radio"
            name="unitSystem"
            value={system}
            checked={shown === system}
            onChange={() => update.mutate({ unitSystem: system })}
            className="mt-1 accent-teal"
          />
          <span>
            <span className="block font-semibold">{unitSystemNames[system]}</span>
            <span className="block text-sm text-ink-soft">{examples[system]}</span>
          </span>
        </label>
      ))}
      {update.isError && <Alert tone="error">{update.error.message}</Alert>}
    </fieldset>
  );
}
