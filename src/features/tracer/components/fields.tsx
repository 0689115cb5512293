import { useEffect, useId, useState, type ReactNode } from 'react';
import { FieldError, inputClass } from '#src/components/TextField';

/** The id of a setting's input, so a problem in the file can send the user straight to it. */
export function settingId(field: string): string {
  return `trace-setting-${field}`;
}

type Parsed = number | null | undefined;

const NUMBER_TEXT = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

/** A typed number: null for an empty field, undefined for text that is not a number. */
export function parseTypedNumber(text: string): Parsed {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  if (!NUMBER_TEXT.test(trimmed)) return undefined;
  const value = Number(trimmed);
  return Number.isFinite(value) && Math.abs(value) <= 1e15 ? value : undefined;
}

/**
 * A number input that keeps what the user types (so "1." or "-" can be on the way to a number)
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
  const generated = useId();
  const inputId = id ?? generated;
  const [text, setText] = useState(value === null ? '' : String(value));
  const parsed = parseTypedNumber(text);

  // Undo, redo or a loaded draft change the value from outside: show it, unless the text already says it.
  useEffect(() => {
    const current = parseTypedNumber(text);
    if (current === value || (current === undefined && value === null)) return;
    setText(value === null ? '' : String(value));
    // Only an outside change of the value resets the text.
  }, [value]);

  const error =
    parsed === undefined
      ? /^\s*[+-]?\d+,\d+\s*$/.test(text)
        ? 'Write the number with a decimal point (1.5, not 1,5).'
        : 'Type a number, such as 1.5 or 2e5.'
      : null;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  return (
    <div className={`space-y-1 ${className}`}>
      <label htmlFor={inputId} className={hideLabel ? 'sr-only' : 'block text-sm font-semibold text-ink'}>
        {label}
      </label>
      <div className="flex items-center gap-2">
        <input
          id={inputId}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          className={`${inputClass} numeric`}
          value={text}
          disabled={disabled}
          placeholder={placeholder}
          aria-invalid={error ? true : undefined}
          aria-describedby={[errorId, hintId].filter(Boolean).join(' ') || undefined}
          onChange={(event) => {
            setText(event.target.value);
            const next = parseTypedNumber(event.target.value);
            onChange(next === undefined ? null : next);
          }}
        />
        {unit && <span className="shrink-0 text-sm text-ink-soft">{unit}</span>}
      </div>
      {error && <FieldError id={errorId!}>{error}</FieldError>}
      {hint && (
        <p id={hintId} className="text-xs text-ink-soft">
          {hint}
        </p>
      )}
    </div>
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

/** Mathjs unit names as people read them in a list. */
export function unitOption(unit: string): { value: string; label: string } {
  const words: Record<string, string> = {
    degC: '°C',
    degF: '°F',
    degR: '°R',
    m3: 'm³',
    'm3/s': 'm³/s',
    'm3/min': 'm³/min',
    'kg/s K^0.5 / kPa': 'kg/s·K^0.5/kPa',
    'kg/s K^0.5 / Pa': 'kg/s·K^0.5/Pa',
    'lb/min degR^0.5 / psi': 'lb/min·°R^0.5/psi',
  };
  return { value: unit, label: words[unit] ?? unit };
}
