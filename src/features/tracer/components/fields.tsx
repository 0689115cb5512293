import { useId, useState, type ReactNode } from 'react';
import { inputClass, TextField } from '#src/components/TextField';
import { parseTypedNumber, unitLabel } from '#src/lib/quantities';

/** The id of a setting's input, so a problem in the file can send the user straight to it. */
export function settingId(field: string): string {
  return `trace-setting-${field}`;
}

/** The trace stores numbers within ±1e15 (shared/tracer/state.ts). */
const TRACE_NUMBER_LIMIT = 1e15;

/** A typed number: null for an empty field, undefined for text that is not a number. */
function traceNumber(text: string): number | null | undefined {
  if (text.trim() === '') return null;
  const read = parseTypedNumber(text, { limit: TRACE_NUMBER_LIMIT });
  return read.ok ? read.value : undefined;
}

/**
 * A number box that keeps what the user types (so "1." or "-" can be on the way to a number)
 * and hands the trace a number, or null while the field is empty or not a number yet.
 */
export function NumberField({
  label,
  value,
  onChange,
  unit,
  hint,
  id,
  disabled,
  className = '',
  hideLabel = false,
  placeholder,
}: {
  label: ReactNode;
  value: number | null;
  onChange: (value: number | null) => void;
  unit?: string | null;
  hint?: ReactNode;
  id?: string;
  disabled?: boolean;
  className?: string;
  hideLabel?: boolean;
  placeholder?: string;
}) {
  const [text, setText] = useState(value === null ? '' : String(value));
  // Undo, redo or a loaded draft change the value from outside: show it, unless the text already
  // says it (adjusted while rendering, as React advises for state that follows a prop).
  const [shownValue, setShownValue] = useState(value);
  if (value !== shownValue) {
    setShownValue(value);
    const current = traceNumber(text);
    if (!(current === value || (current === undefined && value === null))) setText(value === null ? '' : String(value));
  }

  const read = text.trim() === '' ? null : parseTypedNumber(text, { limit: TRACE_NUMBER_LIMIT });
  return (
    <TextField
      label={label}
      id={id}
      hideLabel={hideLabel}
      unit={unit ?? null}
      hint={hint}
      error={read && !read.ok ? read.message : null}
      className={className}
      inputMode="decimal"
      autoComplete="off"
      spellCheck={false}
      value={text}
      disabled={disabled}
      placeholder={placeholder}
      onChange={(event) => {
        setText(event.target.value);
        onChange(traceNumber(event.target.value) ?? null);
      }}
    />
  );
}

/** A small select with a visible label, controlled. */
export function ChoiceField<T extends string>({
  label,
  value,
  options,
  onChange,
  id,
  disabled,
  className = '',
}: {
  label: ReactNode;
  value: T;
  options: readonly { value: T; label: string }[];
  onChange: (value: T) => void;
  id?: string;
  disabled?: boolean;
  className?: string;
}) {
  const generated = useId();
  const selectId = id ?? generated;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={selectId} className="block text-sm font-semibold text-ink">
        {label}
      </label>
      <select id={selectId} className={`${inputClass} pr-8`} value={value} disabled={disabled} onChange={(event) => onChange(event.target.value as T)}>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </div>
  );
}

/** A unit choice as people read it in a list. */
export function unitOption(unit: string): { value: string; label: string } {
  return { value: unit, label: unitLabel(unit) };
}
