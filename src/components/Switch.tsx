import { useId, type ReactNode } from 'react';
import { Spinner } from './Button';

/**
 * An on/off setting that takes effect when flipped (no save button): a button with the switch
 * role, its label beside it and an optional line under the label saying what it does.
 */
export function Switch({
  checked,
  onChange,
  label,
  description,
  pending = false,
  disabled = false,
}: {
  checked: boolean;
  onChange: (checked: boolean) => void;
  label: ReactNode;
  description?: ReactNode;
  /** While true the switch shows the value being set and cannot be flipped again. */
  pending?: boolean;
  disabled?: boolean;
}) {
  const id = useId();
  return (
    <div className="flex items-start gap-3">
      <button
        id={id}
        type="button"
        role="switch"
        aria-checked={checked}
        aria-labelledby={`${id}-label`}
        aria-describedby={description ? `${id}-description` : undefined}
        aria-busy={pending || undefined}
        disabled={disabled || pending}
        onClick={() => onChange(!checked)}
        className={`relative mt-0.5 inline-flex h-6 w-11 shrink-0 items-center rounded-full border transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${
          checked ? 'border-teal bg-teal' : 'border-ink/30 bg-paper-deep'
        }`}
      >
        <span
          aria-hidden="true"
          className={`inline-flex size-5 items-center justify-center rounded-full bg-white text-teal shadow transition-transform ${checked ? 'translate-x-5' : 'translate-x-0.5'}`}
        >
          {pending && <Spinner />}
        </span>
      </button>
      <div className="min-w-0 space-y-0.5">
        <label id={`${id}-label`} htmlFor={id} className="block text-sm font-semibold text-ink">
          {label}
        </label>
        {description && (
          <span id={`${id}-description`} className="block text-sm text-ink-soft">
            {description}
          </span>
        )}
      </div>
    </div>
  );
}
