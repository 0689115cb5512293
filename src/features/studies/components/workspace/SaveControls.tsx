import { useId, useState } from 'react';
import { Button } from '#src/components/Button';

/**
 * Save with an optional message. Saving is offered only when there is something valid to save;
 * the reason is said when it is not.
 */
export function SaveControls({
  dirty,
  valid,
  pending,
  nextRevision,
  onSave,
}: {
  dirty: boolean;
  valid: boolean;
  pending: boolean;
  nextRevision: number;
  onSave: (message: string) => void;
}) {
  const id = useId();
  const [message, setMessage] = useState('');
  const status = !dirty ? 'All changes saved.' : valid ? 'Unsaved changes.' : 'Fix the problems in the inputs to save.';
  return (
    <form
      className="flex flex-wrap items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (!dirty || !valid || pending) return;
        onSave(message.trim());
        setMessage('');
      }}
      aria-label="Save the study"
    >
      <div className="space-y-1">
        <label htmlFor={id} className="block text-xs font-semibold text-ink-soft">
          What changed (optional)
        </label>
        <input
          id={id}
          value={message}
          maxLength={200}
          onChange={(e) => setMessage(e.target.value)}
          placeholder="e.g. VE from the dyno sheet"
          className="w-64 rounded-md border border-ink/25 bg-white px-3 py-2 text-sm"
        />
      </div>
      <Button type="submit" variant="primary" pending={pending} disabled={!dirty || !valid}>
        {dirty ? `Save revision ${nextRevision}` : 'Saved'}
      </Button>
      <p role="status" className={`w-full text-xs ${dirty ? 'font-semibold text-copper-ink' : 'text-ink-soft'}`} data-testid="save-status">
        {status}
      </p>
    </form>
  );
}
