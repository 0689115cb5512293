import { useState } from 'react';
import { Link } from 'react-router';
import { resetConfirmSchema } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button, ButtonLink } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { PasswordField } from './PasswordField';
import { isApiError } from '#src/lib/api-client';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { paths } from '#src/lib/paths';
import { useConfirmPasswordReset } from '../api/confirm-password-reset';

const FIELDS = ['password', 'confirmPassword'] as const;

/** Sets a new password with the token from the e-mailed link. */
export function ResetPasswordForm({ token }: { token: string }) {
  const confirm = useConfirmPasswordReset();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const values = formValues(form);
    const parsed = parseForm(resetConfirmSchema, { token, password: values.password ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    if (values.password !== values.confirmPassword) {
      return setErrors({ form: null, fields: { confirmPassword: 'Does not match the new password.' } });
    }
    setErrors(noFormErrors);
    confirm.mutate(parsed.data, { onError: (error) => setErrors(formErrorsFrom(error, FIELDS)) });
  }

  if (confirm.isSuccess) {
    return (
      <div className="space-y-4">
        <Alert tone="success" title="Password changed">
          Every session of this account was signed out. Sign in with your new password.
        </Alert>
        <ButtonLink to={paths.signIn.href()} variant="primary">
          Sign in
        </ButtonLink>
      </div>
    );
  }

  const tokenLooksValid = resetConfirmSchema.shape.token.safeParse(token).success;
  if (!tokenLooksValid || (isApiError(confirm.error) && confirm.error.code === 'invalid_token')) {
    return (
      <Alert tone="error" title="This link no longer works">
        Reset links work once and expire after a while. <Link to={paths.forgotPassword.href()}>Ask for a new link</Link>.
      </Alert>
    );
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Password reset">
      <PasswordField label="New password" name="password" error={errors.fields.password} required />
      <TextField label="Confirm password" name="confirmPassword" type="password" autoComplete="new-password" error={errors.fields.confirmPassword} required />
      <FormActions>
        <Button type="submit" variant="primary" pending={confirm.isPending}>
          Set new password
        </Button>
      </FormActions>
    </Form>
  );
}
