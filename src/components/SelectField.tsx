import { useId, type ReactNode, type SelectHTMLAttributes } from 'react';
import { FieldError, inputClass } from './TextField';

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: ReactNode;
  name: string;
  options: readonly { value: string; label: string }[];
  error?: string | null;
  /** Hide the label visually (it stays the accessible name), for compact table rows. */
  hideLabel?: boolean;
}

export function SelectField({ label, name, options, error, hideLabel = false, className = '', ...rest }: SelectFieldProps) {
  const id = useId();
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'block text-sm font-semibold text-ink'}>
        {label}
      </label>
      <select id={id} name={name} aria-invalid={error ? true : undefined} aria-describedby={errorId} className={`${inputClass} pr-8`} {...rest}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
      {error && <FieldError id={errorId!}>{error}</FieldError>}
    </div>
  );
}
