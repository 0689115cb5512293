import { useId, type TextareaHTMLAttributes } from 'react';
import { FieldError, inputClass } from '#src/components/TextField';

/** A labelled multi-line text field with the same error and hint treatment as TextField. */
export function NotesField({
  label,
  name,
  error,
  hint,
  ...rest
}: Omit<TextareaHTMLAttributes<HTMLTextAreaElement>, 'id'> & { label: string; name: string; error?: string | null; hint?: string }) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold text-ink">
        {label}
      </label>
      <textarea
        id={id}
        name={name}
        rows={4}
        aria-invalid={error ? true : undefined}
        aria-describedby={[errorId, hintId].filter(Boolean).join(' ') || undefined}
        className={`${inputClass} min-h-24`}
        {...rest}
      />
      {error && <FieldError id={errorId!}>{error}</FieldError>}
      {hint && (
        <p id={hintId} className="text-sm text-ink-soft">
          {hint}
        </p>
      )}
    </div>
  );
}
