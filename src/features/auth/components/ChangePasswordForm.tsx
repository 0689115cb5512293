import { useState } from 'react';
import { changePasswordSchema } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { useMe } from '#src/lib/session';
import { PasswordField } from './PasswordField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useChangePassword } from '../api/change-password';

const FIELDS = ['currentPassword', 'newPassword', 'confirmPassword'] as const;

export function ChangePasswordForm() {
  const change = useChangePassword();
  const user = useMe().data?.user;
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const values = formValues(form);
    const parsed = parseForm(changePasswordSchema, { currentPassword: values.currentPassword ?? '', newPassword: values.newPassword ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    if (values.newPassword !== values.confirmPassword) {
      return setErrors({ form: null, fields: { confirmPassword: 'Does not match the new password.' } });
    }
    setErrors(noFormErrors);
    change.mutate(parsed.data, {
      onSuccess: () => form.reset(),
      onError: (error) => setErrors(formErrorsFrom(error, FIELDS)),
    });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Change password">
      <TextField
        label="Current password"
        name="currentPassword"
        type="password"
        autoComplete="current-password"
        error={errors.fields.currentPassword}
        required
      />
      <PasswordField label="New password" name="newPassword" error={errors.fields.newPassword} context={user ?? {}} required />
      <TextField label="Confirm password" name="confirmPassword" type="password" autoComplete="new-password" error={errors.fields.confirmPassword} required />
      {change.isSuccess && !change.isPending && (
        <Alert tone="success" title="Password changed">
          Every other session of this account was signed out; this one stays signed in.
        </Alert>
      )}
      <FormActions>
        <Button type="submit" variant="primary" pending={change.isPending}>
          Change password
        </Button>
      </FormActions>
    </Form>
  );
}
