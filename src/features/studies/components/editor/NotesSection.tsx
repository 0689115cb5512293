import { useId } from 'react';
import { FieldError } from '#src/components/TextField';
import { asSentence } from '#src/lib/forms';
import { useEditor } from './context';
import { Section } from './Section';

/** Free notes kept with the study: the reasoning, where numbers came from, what to try next. */
export function NotesSection() {
  const editor = useEditor();
  const id = useId();
  const error = editor.issues.notes;
  const notes = typeof editor.draft.notes === 'string' ? editor.draft.notes : '';
  if (editor.readOnly) {
    return (
      <Section title="Notes" prefixes={['notes']} defaultOpen={false} testId="section-notes">
        <p className="whitespace-pre-wrap text-sm text-ink">{notes || <span className="text-ink-faint">No notes.</span>}</p>
      </Section>
    );
  }
  return (
    <Section title="Notes" prefixes={['notes']} defaultOpen={false} testId="section-notes">
      <label htmlFor={id} className="sr-only">
        Notes
      </label>
      <textarea
        id={id}
        rows={6}
        maxLength={10_000}
        value={notes}
        onChange={(e) => editor.update(['notes'], e.target.value)}
        aria-invalid={error ? true : undefined}
        className="block w-full rounded-md border border-ink/25 bg-white px-3 py-2 text-sm text-ink read-only:bg-paper-deep/40"
        placeholder="Where the numbers came from, what to try next…"
      />
      {error && <FieldError id={`${id}-error`}>{asSentence(error)}</FieldError>}
    </Section>
  );
}
