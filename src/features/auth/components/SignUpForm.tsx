import { useState } from 'react';
import { signUpSchema } from '#shared/schemas/account';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { PasswordField } from './PasswordField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { useSignUp } from '../api/sign-up';

const FIELDS = ['name', 'email', 'password'] as const;

/** Creates an account (and its personal team) and signs in. */
export function SignUpForm({ defaultEmail = '' }: { defaultEmail?: string }) {
  const signUp = useSignUp();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(signUpSchema, formValues(form), FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    signUp.mutate(parsed.data, { onError: (error) => setErrors(formErrorsFrom(error, FIELDS)) });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Create account">
      <TextField label="Your name" name="name" autoComplete="name" error={errors.fields.name} required />
      <TextField label="E-mail" name="email" type="email" autoComplete="email" defaultValue={defaultEmail} error={errors.fields.email} required />
      <PasswordField label="Password" name="password" error={errors.fields.password} required />
      <FormActions>
        <Button type="submit" variant="primary" pending={signUp.isPending}>
          Create account
        </Button>
      </FormActions>
    </Form>
  );
}
