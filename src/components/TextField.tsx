import { useId, type InputHTMLAttributes, type ReactNode } from 'react';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: ReactNode;
  name?: string;
  /** The input's id, when something else points at the box; otherwise one is made up. */
  id?: string;
  /** A message beside the field; marks it invalid for assistive technology too. */
  error?: string | null;
  hint?: ReactNode;
  /** The label for assistive technology only (the box sits in a row that says what it is). */
  hideLabel?: boolean;
  /** A unit written inside the box, on the right (numbers). */
  unit?: string | null;
}

export const inputClass =
  'block w-full rounded-md border border-ink/25 bg-white px-3 py-2 text-ink shadow-inner shadow-paper-deep/60 ' +
  'placeholder:text-ink-faint focus:border-teal aria-[invalid=true]:border-copper ' +
  'read-only:bg-paper-deep/50 disabled:bg-paper-deep disabled:text-ink-soft';

/**
 * The one text box of the app: a label, the input, its error and a hint, tied together for
 * assistive technology. Number boxes are this box with a unit and text kept as typed.
 */
export function TextField({ label, name, id: givenId, error, hint, hideLabel = false, unit, className = '', type = 'text', style, ...rest }: TextFieldProps) {
  const madeId = useId();
  const id = givenId ?? madeId;
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  const input = (
    <input
      id={id}
      name={name}
      type={type}
      aria-invalid={error ? true : undefined}
      aria-describedby={describedBy}
      className={unit === undefined ? inputClass : `${inputClass} numeric`}
      // Room on the right for the unit written inside the box.
      style={unit ? { paddingRight: `${1 + unit.length * 0.5}rem`, ...style } : style}
      {...rest}
    />
  );
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className={hideLabel ? 'sr-only' : 'block text-sm font-semibold text-ink'}>
        {label}
      </label>
      {unit === undefined ? (
        input
      ) : (
        <div className="relative">
          {input}
          {unit && (
            <span aria-hidden="true" className="pointer-events-none absolute inset-y-0 right-3 flex items-center text-sm text-ink-faint">
              {unit}
            </span>
          )}
        </div>
      )}
      {error && <FieldError id={errorId!}>{error}</FieldError>}
      {hint && (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
    </div>
  );
}

export function FieldError({ id, children }: { id: string; children: ReactNode }) {
  return (
    <p id={id} className="flex items-start gap-1.5 text-sm font-medium text-copper-ink">
      <span aria-hidden="true" className="mt-px font-bold">
        !
      </span>
      <span>{children}</span>
    </p>
  );
}
