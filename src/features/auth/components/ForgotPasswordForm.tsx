import { useState } from 'react';
import { resetRequestSchema } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useRequestPasswordReset } from '../api/request-password-reset';

const FIELDS = ['email'] as const;

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [sentTo, setSentTo] = useState<string | null>(null);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(resetRequestSchema, formValues(form), FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    request.mutate(parsed.data, {
      onSuccess: () => setSentTo(parsed.data.email),
      onError: (error) => setErrors(formErrorsFrom(error, FIELDS)),
    });
  }

  if (sentTo) {
    // The server answers alike for known and unknown addresses; so does this message.
    return (
      <Alert tone="success" title="Check your mail">
        If an account uses {sentTo}, a link to choose a new password is on its way. The link works once and expires after a while; ask for another if it does.
      </Alert>
    );
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Request a password reset">
      <TextField label="E-mail" name="email" type="email" autoComplete="email" error={errors.fields.email} required />
      <FormActions>
        <Button type="submit" variant="primary" pending={request.isPending}>
          Send reset link
        </Button>
      </FormActions>
    </Form>
  );
}
