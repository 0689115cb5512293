import { useState } from 'react';
import { Link } from 'react-router';
import { signInSchema } from '../../../../shared/schemas/account';
import { Button } from '../../../components/Button';
import { Form, FormActions } from '../../../components/Form';
import { TextField } from '../../../components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '../../../lib/forms';
import { paths } from '../../../lib/paths';
import { useSignIn } from '../api/sign-in';

const FIELDS = ['email', 'password'] as const;

/** Signs in; what happens next is up to the page (the guards react to the new `me`). */
export function SignInForm({ defaultEmail = '' }: { defaultEmail?: string }) {
  const signIn = useSignIn();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(signInSchema, formValues(form), FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    signIn.mutate(parsed.data, { onError: (error) => setErrors(formErrorsFrom(error, FIELDS)) });
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Sign in">
      <TextField label="E-mail" name="email" type="email" autoComplete="username" defaultValue={defaultEmail} error={errors.fields.email} required />
      <TextField label="Password" name="password" type="password" autoComplete="current-password" error={errors.fields.password} required />
      <FormActions>
        <Button type="submit" variant="primary" pending={signIn.isPending}>
          Sign in
        </Button>
        <Link to={paths.forgotPassword.href()} className="text-sm">
          Forgot your password?
        </Link>
      </FormActions>
    </Form>
  );
}
