import { useId, type InputHTMLAttributes, type ReactNode } from 'react';

export interface TextFieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  label: ReactNode;
  name: string;
  /** A message beside the field; marks it invalid for assistive technology too. */
  error?: string | null;
  hint?: ReactNode;
}

export const inputClass =
  'block w-full rounded-md border border-ink/25 bg-white px-3 py-2 text-ink shadow-inner shadow-paper-deep/60 ' +
  'placeholder:text-ink-faint focus:border-teal aria-[invalid=true]:border-copper ' +
  'read-only:bg-paper-deep/50 disabled:bg-paper-deep disabled:text-ink-soft';

export function TextField({ label, name, error, hint, className = '', type = 'text', ...rest }: TextFieldProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [errorId, hintId].filter(Boolean).join(' ') || undefined;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={id} className="block text-sm font-semibold text-ink">
        {label}
      </label>
      <input id={id} name={name} type={type} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={inputClass} {...rest} />
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
