import { useEffect, useId, useRef, type FormEvent, type FormHTMLAttributes, type ReactNode } from 'react';
import type { FormErrors } from '../lib/forms';
import { Alert } from './Alert';

/**
 * A form that shows the general error above its fields and, when new errors arrive, moves
 * focus to the first invalid field (or to the general message), so keyboard and screen-reader
 * users land on the problem. Browser validation is off: the shared schemas and the server
 * word the messages.
 */
export function Form({
  errors,
  onSubmit,
  children,
  className = 'space-y-4',
  ...rest
}: Omit<FormHTMLAttributes<HTMLFormElement>, 'onSubmit'> & {
  errors: FormErrors;
  onSubmit: (form: HTMLFormElement) => void;
  children: ReactNode;
}) {
  const formRef = useRef<HTMLFormElement>(null);
  const alertId = useId();

  useEffect(() => {
    const form = formRef.current;
    if (!form) return;
    const firstInvalid = form.querySelector<HTMLElement>('[aria-invalid="true"]');
    if (firstInvalid) firstInvalid.focus();
    else if (errors.form) document.getElementById(alertId)?.focus();
  }, [errors, alertId]);

  function handleSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    onSubmit(event.currentTarget);
  }

  return (
    <form ref={formRef} noValidate onSubmit={handleSubmit} className={className} {...rest}>
      {errors.form && (
        <Alert tone="error" id={alertId} tabIndex={-1}>
          {errors.form}
        </Alert>
      )}
      {children}
    </form>
  );
}

/** The row of buttons at the foot of a form. */
export function FormActions({ children }: { children: ReactNode }) {
  return <div className="flex flex-wrap items-center gap-3 pt-1">{children}</div>;
}
