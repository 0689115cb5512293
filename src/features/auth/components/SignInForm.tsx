import { useState } from 'react';
import { Link } from 'react-router';
import { signInSchema } from '#shared/schemas/account';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, parseForm, type FormErrors } from '#src/lib/forms';
import { paths } from '#src/lib/paths';
import { useSecondFactorSignIn, useSignIn } from '../api/sign-in';

const FIELDS = ['email', 'password'] as const;
const CODE_FIELDS = ['code'] as const;

/** Signs in; what happens next is up to the page (the guards react to the new `me`). */
export function SignInForm({ defaultEmail = '' }: { defaultEmail?: string }) {
  const signIn = useSignIn();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [challenge, setChallenge] = useState<string | null>(null);

  function submit(form: HTMLFormElement) {
    const parsed = parseForm(signInSchema, formValues(form), FIELDS);
    if (!parsed.ok) return setErrors(parsed.errors);
    setErrors(noFormErrors);
    signIn.mutate(parsed.data, {
      onSuccess: (answer) => {
        if ('challenge' in answer) setChallenge(answer.challenge);
      },
      onError: (error) => setErrors(formErrorsFrom(error, FIELDS)),
    });
  }

  if (challenge) return <SecondFactorForm challenge={challenge} onRestart={() => setChallenge(null)} />;

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

/** The step after a right password when the account has a second factor. */
function SecondFactorForm({ challenge, onRestart }: { challenge: string; onRestart: () => void }) {
  const confirm = useSecondFactorSignIn();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);

  function submit(form: HTMLFormElement) {
    const code = (formValues(form).code ?? '').trim();
    if (!code) return setErrors({ form: null, fields: { code: 'Enter the code your app shows.' } });
    setErrors(noFormErrors);
    confirm.mutate(
      { challenge, code },
      {
        onError: (error) => {
          const next = formErrorsFrom(error, CODE_FIELDS);
          setErrors(next);
        },
      },
    );
  }

  return (
    <Form errors={errors} onSubmit={submit} aria-label="Second factor">
      <p className="text-sm text-ink-soft">Your password was right. Now enter the 6-digit code from your authenticator app, or one of your recovery codes.</p>
      <TextField label="Code" name="code" autoComplete="one-time-code" inputMode="text" error={errors.fields.code} required autoFocus />
      <FormActions>
        <Button type="submit" variant="primary" pending={confirm.isPending}>
          Confirm
        </Button>
        <button type="button" className="text-sm text-teal underline" onClick={onRestart}>
          Start again
        </button>
      </FormActions>
    </Form>
  );
}
