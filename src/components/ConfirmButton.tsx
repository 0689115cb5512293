import { useRef, useState, type ReactNode } from 'react';
import { isApiError } from '../lib/api-client';
import { Alert } from './Alert';
import { Button, type ButtonVariant } from './Button';
import { Dialog } from './Dialog';

/**
 * A button for an action that cannot be undone: it asks first, says what will happen, runs
 * `onConfirm` with the confirm button busy, and keeps the dialog open with the server's
 * message if it fails.
 */
export function ConfirmButton({
  children,
  title,
  description,
  confirmLabel,
  cancelLabel = 'Cancel',
  onConfirm,
  variant = 'destructive',
  confirmVariant = 'destructive',
  disabled,
  className,
  'aria-label': ariaLabel,
}: {
  children: ReactNode;
  title: ReactNode;
  description: ReactNode;
  confirmLabel: string;
  /** The button that closes the dialog without acting; name it when "Cancel" would be ambiguous. */
  cancelLabel?: string;
  /** Resolves when the action is done; a rejection is shown in the dialog. */
  onConfirm: () => Promise<unknown>;
  variant?: ButtonVariant;
  confirmVariant?: ButtonVariant;
  disabled?: boolean;
  className?: string;
  'aria-label'?: string;
}) {
  const [open, setOpen] = useState(false);
  const [pending, setPending] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const cancelRef = useRef<HTMLButtonElement>(null);

  function close() {
    if (pending) return;
    setOpen(false);
    setError(null);
  }

  async function confirm() {
    setPending(true);
    setError(null);
    try {
      await onConfirm();
      setPending(false);
      setOpen(false);
    } catch (caught) {
      setPending(false);
      setError(isApiError(caught) ? caught.message : 'Something went wrong. Try again.');
    }
  }

  return (
    <>
      <Button variant={variant} onClick={() => setOpen(true)} disabled={disabled} className={className} aria-label={ariaLabel}>
        {children}
      </Button>
      <Dialog open={open} title={title} description={description} onClose={close} initialFocusRef={cancelRef}>
        {error && <Alert tone="error">{error}</Alert>}
        <div className="flex flex-wrap justify-end gap-3">
          <Button ref={cancelRef} onClick={close} disabled={pending}>
            {cancelLabel}
          </Button>
          <Button variant={confirmVariant} pending={pending} onClick={confirm}>
            {confirmLabel}
          </Button>
        </div>
      </Dialog>
    </>
  );
}
