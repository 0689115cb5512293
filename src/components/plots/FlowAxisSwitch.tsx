import { useId } from 'react';

const OPTIONS = [
  { value: 'corrected', label: 'Corrected mass flow' },
  { value: 'volume', label: 'Inlet volume flow' },
] as const;

/** Chooses the flow axis of a compressor map: two radio buttons drawn as one segmented control. */
export function FlowAxisSwitch({ value, onChange }: { value: 'corrected' | 'volume'; onChange: (axis: 'corrected' | 'volume') => void }) {
  const name = useId();
  return (
    <fieldset className="flex flex-wrap items-center gap-2">
      <legend className="float-left mr-2 text-sm font-semibold text-ink">Flow axis</legend>
      <div className="inline-flex overflow-hidden rounded-md border border-ink/25 bg-white/70">
        {OPTIONS.map((option) => (
          <label
            key={option.value}
            className={`cursor-pointer px-3 py-1.5 text-sm font-semibold transition-colors has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-teal ${
              value === option.value ? 'bg-teal-light/80 text-teal-dark' : 'text-ink-soft hover:bg-paper-deep'
            }`}
          >
            <input type="radio" name={name} value={option.value} checked={value === option.value} onChange={() => onChange(option.value)} className="sr-only" />
            {option.label}
          </label>
        ))}
      </div>
    </fieldset>
  );
}
