import { useState } from 'react';
import { updateProfileSchema, type User } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useUpdateProfile } from '../api/update-profile';

const FIELDS = ['name'] as const;

export function ProfileForm({ user }: { user: User }) {
  const update = useUpdateProfile();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(updateProfileSchema, { name: formValues(form).name ?? '' }, FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    update.mutate(parsed.data, { onError: (error) => setErrors(formErrorsFrom(error, FIELDS)) });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Profile">
      <TextField label="E-mail" name="email" value={user.email} readOnly hint="Your sign-in address." />
      <TextField label="Display name" name="name" autoComplete="name" defaultValue={user.name} error={errors.fields.name} required />
      {update.isSuccess && !update.isPending && <Alert tone="success">Saved.</Alert>}
      <FormActions>
        <Button type="submit" variant="primary" pending={update.isPending}>
          Save name
        </Button>
      </FormActions>
    </Form>
  );
}
