import { useId, useState, type ReactNode } from 'react';
import { FieldError, inputClass, TextField } from '#src/components/TextField';
import { asSentence } from '#src/lib/forms';
import { getIn, pathKey, type DocPath } from '#src/features/studies/lib/draft';
import { localizeIssue } from '#src/features/studies/lib/localize-issue';
import { useEditor } from './context';
import { inputText, parseTypedNumber, quantityUnit, type StudyQuantity, useUnitSystem } from '#src/lib/quantities';

/** A value shown, not edited: viewers and archived studies get text, not input boxes. */
export function ReadValue({ label, children, compact = false }: { label: ReactNode; children: ReactNode; compact?: boolean }) {
  if (compact) return <span className="numeric block px-2 py-1 text-right text-sm text-ink">{children}</span>;
  return (
    <div className="space-y-0.5">
      <p className="text-sm font-semibold text-ink">{label}</p>
      <p className="numeric text-ink" data-read-value>
        {children}
      </p>
    </div>
  );
}

const compactInput =
  'block w-full rounded border border-ink/20 bg-white px-2 py-1 text-right text-sm text-ink focus:border-teal aria-[invalid=true]:border-copper read-only:bg-paper-deep/40';

/**
 * A number typed in the user's units and stored in SI. What is typed stays as typed while the
 * field has focus; each valid number is converted and stored at once (the plots follow), a
 * half-typed or wrong one shows its message and leaves the stored value alone.
 */
export function UnitNumberInput({
  label,
  value,
  onChange,
  quantity,
  optional = false,
  error,
  hint,
  compact = false,
  readOnly = false,
  placeholder,
  onPaste,
  testId,
}: {
  label: ReactNode;
  /** SI value; undefined shows an empty box. */
  value: number | undefined;
  onChange: (si: number | undefined) => void;
  quantity: StudyQuantity;
  optional?: boolean;
  error?: string | null;
  hint?: ReactNode;
  /** Table cell: label for assistive technology only, small box. */
  compact?: boolean;
  readOnly?: boolean;
  placeholder?: string;
  onPaste?: (event: React.ClipboardEvent<HTMLInputElement>) => void;
  testId?: string;
}) {
  const unitSystem = useUnitSystem();
  const id = useId();
  const unit = quantityUnit(quantity, unitSystem);
  const shown = value === undefined || !Number.isFinite(value) ? '' : inputText(unit.fromSI(value));
  const [typed, setTyped] = useState(shown);
  const [focused, setFocused] = useState(false);
  const [typingError, setTypingError] = useState<string | null>(null);
  // While the user types (or leaves a wrong number behind) the box keeps their text; otherwise it
  // shows the stored value, so outside changes (unit switch, another version loaded, an undo) show.
  const text = focused || typingError !== null ? typed : shown;

  function change(next: string) {
    setTyped(next);
    if (next.trim() === '') {
      if (optional) {
        setTypingError(null);
        onChange(undefined);
      } else setTypingError('Type a number.');
      return;
    }
    const parsed = parseTypedNumber(next);
    if (!parsed.ok) {
      setTypingError(parsed.message);
      return;
    }
    setTypingError(null);
    const si = unit.toSI(parsed.value);
    if (Number.isFinite(si)) onChange(si);
  }

  if (readOnly) {
    return (
      <ReadValue label={label} compact={compact}>
        {shown === '' ? <span className="text-ink-faint">not set</span> : compact ? shown : `${shown}${unit.label ? ` ${unit.label}` : ''}`}
      </ReadValue>
    );
  }

  const message = typingError ?? (error ? asSentence(error) : null);
  const boxProps = {
    inputMode: 'decimal',
    autoComplete: 'off',
    value: text,
    placeholder,
    'data-testid': testId,
    onChange: (e: React.ChangeEvent<HTMLInputElement>) => change(e.target.value),
    onFocus: () => {
      if (typingError === null) setTyped(shown);
      setFocused(true);
    },
    // A number typed as "1." or "+2" reads back in its plain form once the user moves on.
    onBlur: () => setFocused(false),
    onPaste,
  } as const;

  if (!compact) return <TextField label={label} unit={unit.label} error={message} hint={hint} {...boxProps} />;

  // A table cell: a small box, the label and unit for assistive technology only.
  const errorId = message ? `${id}-error` : undefined;
  const hintId = hint ? `${id}-hint` : undefined;
  return (
    <div>
      <label htmlFor={id} className="sr-only">
        {label}
        {unit.label ? ` (${unit.label})` : ''}
      </label>
      <input
        id={id}
        aria-invalid={message ? true : undefined}
        aria-describedby={[errorId, hintId].filter(Boolean).join(' ') || undefined}
        className={compactInput}
        {...boxProps}
      />
      {message && (
        <p id={errorId} className="mt-0.5 text-left text-xs font-medium text-copper-ink">
          {message}
        </p>
      )}
      {hint && (
        <p id={hintId} className="text-xs text-ink-soft">
          {hint}
        </p>
      )}
    </div>
  );
}

/** A number field of the document at `path`. */
export function NumberField({
  path,
  label,
  quantity,
  optional,
  hint,
  placeholder,
  testId,
}: {
  path: DocPath;
  label: ReactNode;
  quantity: StudyQuantity;
  optional?: boolean;
  hint?: ReactNode;
  placeholder?: string;
  testId?: string;
}) {
  const editor = useEditor();
  const unitSystem = useUnitSystem();
  const raw = getIn(editor.draft, path);
  const issue = editor.issues[pathKey(path)];
  return (
    <UnitNumberInput
      label={label}
      value={typeof raw === 'number' ? raw : undefined}
      onChange={(si) => editor.update(path, si)}
      quantity={quantity}
      optional={optional}
      error={issue ? localizeIssue(issue, quantity, unitSystem) : null}
      hint={hint}
      placeholder={placeholder}
      readOnly={editor.readOnly}
      testId={testId}
    />
  );
}

/** A whole number (counts, gears): typed and stored as is. */
export function CountField({ path, label, hint }: { path: DocPath; label: ReactNode; hint?: ReactNode }) {
  return <NumberField path={path} label={label} quantity="count" hint={hint} />;
}

/** A line of text of the document at `path`. */
export function TextInputField({ path, label, hint, maxLength = 120 }: { path: DocPath; label: ReactNode; hint?: ReactNode; maxLength?: number }) {
  const editor = useEditor();
  const raw = getIn(editor.draft, path);
  const error = editor.issues[pathKey(path)];
  if (editor.readOnly) return <ReadValue label={label}>{typeof raw === 'string' && raw !== '' ? raw : <span className="text-ink-faint">none</span>}</ReadValue>;
  return (
    <TextField
      label={label}
      value={typeof raw === 'string' ? raw : ''}
      maxLength={maxLength}
      error={error ? asSentence(error) : null}
      hint={hint}
      onChange={(e) => editor.update(path, e.target.value)}
    />
  );
}

/** A choice among fixed values. `onChoose` replaces the plain write when a choice reshapes the document. */
export function ChoiceField<T extends string | number>({
  path,
  label,
  options,
  onChoose,
  value,
}: {
  path: DocPath;
  label: ReactNode;
  options: readonly { value: T; label: string }[];
  onChoose?: (value: T) => void;
  /** The shown value when it is not the one at `path` (a derived choice). */
  value?: T;
}) {
  const editor = useEditor();
  const id = useId();
  const current: unknown = value ?? getIn(editor.draft, path);
  const error = editor.issues[pathKey(path)];
  const errorId = error ? `${id}-error` : undefined;
  if (editor.readOnly) return <ReadValue label={label}>{options.find((o) => String(o.value) === String(current))?.label ?? String(current ?? '—')}</ReadValue>;
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block text-sm font-semibold text-ink">
        {label}
      </label>
      <select
        id={id}
        value={String(current)}
        aria-invalid={error ? true : undefined}
        aria-describedby={errorId}
        onChange={(e) => {
          const option = options.find((o) => String(o.value) === e.target.value);
          if (!option) return;
          if (onChoose) onChoose(option.value);
          else editor.update(path, option.value);
        }}
        className={`${inputClass} pr-8`}
      >
        {options.map((o) => (
          <option key={String(o.value)} value={String(o.value)}>
            {o.label}
          </option>
        ))}
      </select>
      {error && <FieldError id={errorId!}>{asSentence(error)}</FieldError>}
    </div>
  );
}

/** An on/off choice that adds or removes part of the document. */
export function ToggleField({ label, checked, onChange, hint }: { label: ReactNode; checked: boolean; onChange: (on: boolean) => void; hint?: ReactNode }) {
  const editor = useEditor();
  const id = useId();
  if (editor.readOnly) return <ReadValue label={label}>{checked ? 'Yes' : 'No'}</ReadValue>;
  return (
    <div className="space-y-0.5">
      <div className="flex items-center gap-2">
        <input id={id} type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} className="size-4 accent-teal" />
        <label htmlFor={id} className="text-sm font-semibold text-ink">
          {label}
        </label>
      </div>
      {hint && <p className="pl-6 text-xs text-ink-soft">{hint}</p>}
    </div>
  );
}

/** A message beside a part of the form that has no single field (a whole table, a scenario's ambient). */
export function GroupIssue({ path }: { path: DocPath }) {
  const editor = useEditor();
  const error = editor.issues[pathKey(path)];
  if (!error) return null;
  return (
    <p role="alert" className="text-sm font-medium text-copper-ink">
      ! {asSentence(error)}
    </p>
  );
}
