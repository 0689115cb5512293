import { useId, useState, type ReactNode } from 'react';
import { studyTitleSchema } from '#shared/schemas/study';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Dialog } from '#src/components/Dialog';
import { TextField } from '#src/components/TextField';
import { isApiError } from '#src/lib/api-client';
import { asSentence } from '#src/lib/forms';

/**
 * Asks for a study title (new study, rename, duplicate, keep my version as a copy), checks it
 * with the shared schema, runs `onSubmit` and keeps the dialog open with the server's message if
 * that fails.
 */
export function TitleDialog({
  open,
  title,
  description,
  initialTitle,
  submitLabel,
  onSubmit,
  onClose,
  children,
}: {
  open: boolean;
  title: string;
  description?: ReactNode;
  initialTitle: string;
  submitLabel: string;
  onSubmit: (title: string) => Promise<unknown>;
  onClose: () => void;
  children?: ReactNode;
}) {
  const formId = useId();
  const [value, setValue] = useState(initialTitle);
  const [fieldError, setFieldError] = useState<string | null>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  // Each opening (or a new starting title while open) starts from the starting title, no errors.
  const opening = open ? initialTitle : null;
  const [openedWith, setOpenedWith] = useState(opening);
  if (opening !== openedWith) {
    setOpenedWith(opening);
    if (opening !== null) {
      setValue(opening);
      setFieldError(null);
      setFormError(null);
    }
  }

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    const parsed = studyTitleSchema.safeParse(value);
    if (!parsed.success) {
      setFieldError(asSentence(`Title ${parsed.error.issues[0]?.message ?? 'is not valid'}`));
      return;
    }
    setFieldError(null);
    setFormError(null);
    setPending(true);
    try {
      await onSubmit(parsed.data);
      setPending(false);
      onClose();
    } catch (error) {
      setPending(false);
      if (isApiError(error) && error.fieldErrors.title) setFieldError(asSentence(`Title ${error.fieldErrors.title}`));
      else setFormError(isApiError(error) ? error.message : 'Something went wrong. Try again.');
    }
  }

  return (
    <Dialog open={open} title={title} description={description} onClose={() => !pending && onClose()}>
      <form id={formId} noValidate onSubmit={submit} className="space-y-4">
        {formError && <Alert tone="error">{formError}</Alert>}
        <TextField label="Title" name="title" value={value} onChange={(e) => setValue(e.target.value)} error={fieldError} maxLength={200} autoComplete="off" />
        {children}
        <div className="flex flex-wrap justify-end gap-3">
          <Button onClick={onClose} disabled={pending}>
            Cancel
          </Button>
          <Button type="submit" variant="primary" pending={pending}>
            {submitLabel}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
