import { unitSystemSchema } from '#shared/schemas/account';
import { useUpdateProfile } from '../api/update-profile';
import { unitSystemNames, useUnitSystem } from '#src/lib/quantities';

const shortNames = { si: 'SI', us: 'US' } as const;

/** The one switch in the header that moves the whole app between SI and US customary units. */
export function UnitSwitch() {
  const current = useUnitSystem();
  const update = useUpdateProfile();
  const shown = update.isPending && update.variables?.unitSystem ? update.variables.unitSystem : current;
  return (
    <div role="group" aria-label="Units" className="inline-flex rounded-md border border-ink/20 bg-white/70 p-0.5 text-xs font-semibold">
      {unitSystemSchema.options.map((system) => (
        <button
          key={system}
          type="button"
          aria-pressed={shown === system}
          aria-label={`${unitSystemNames[system]} units`}
          disabled={update.isPending}
          onClick={() => shown !== system && update.mutate({ unitSystem: system })}
          className={`rounded px-2 py-1 transition-colors ${shown === system ? 'bg-teal text-white' : 'text-ink-soft hover:text-ink'}`}
        >
          {shortNames[system]}
        </button>
      ))}
    </div>
  );
}
