import { useState } from 'react';
import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Form, FormActions } from '#src/components/Form';
import { Loading } from '#src/components/Page';
import { TextField } from '#src/components/TextField';
import { formErrorsFrom, formValues, noFormErrors, type FormErrors } from '#src/lib/forms';
import { useBeginTwoFactor, useDisableTwoFactor, useEnableTwoFactor, useNewRecoveryCodes, useTwoFactorStatus } from '../api/security';

/** The optional second factor: an authenticator app (TOTP) plus one-time recovery codes. */
export function TwoFactorSettings() {
  const status = useTwoFactorStatus();
  const [codes, setCodes] = useState<string[] | null>(null);
  if (!status.data) return <Loading />;
  if (codes) return <RecoveryCodes codes={codes} onDone={() => setCodes(null)} />;
  return status.data.enabled ? <TwoFactorOn left={status.data.recoveryCodesLeft} onCodes={setCodes} /> : <TwoFactorSetup onCodes={setCodes} />;
}

function PasswordStep({
  label,
  action,
  pending,
  onPassword,
  errors,
}: {
  label: string;
  action: string;
  pending: boolean;
  onPassword: (p: string) => void;
  errors: FormErrors;
}) {
  return (
    <Form errors={errors} onSubmit={(form) => onPassword(formValues(form).password ?? '')} aria-label={label}>
      <TextField label="Your password" name="password" type="password" autoComplete="current-password" error={errors.fields.password} required />
      <FormActions>
        <Button type="submit" variant="primary" pending={pending}>
          {action}
        </Button>
      </FormActions>
    </Form>
  );
}

function TwoFactorSetup({ onCodes }: { onCodes: (codes: string[]) => void }) {
  const begin = useBeginTwoFactor();
  const enable = useEnableTwoFactor();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [started, setStarted] = useState(false);

  if (!started || !begin.data) {
    return (
      <div className="space-y-4">
        <p className="text-sm text-ink-soft">
          With a second factor on, signing in asks for your password and then a 6-digit code from an authenticator app on your phone. Give your password to
          begin.
        </p>
        <PasswordStep
          label="Set up a second factor"
          action="Set up"
          pending={begin.isPending}
          errors={errors}
          onPassword={(password) => {
            setErrors(noFormErrors);
            begin.mutate(password, { onSuccess: () => setStarted(true), onError: (e) => setErrors(formErrorsFrom(e, ['password'])) });
          }}
        />
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <ol className="list-decimal space-y-2 pl-5 text-sm text-ink">
        <li>Scan this picture with your authenticator app, or type the key below into it.</li>
        <li>Enter the 6-digit code the app then shows.</li>
      </ol>
      <div className="flex flex-wrap items-center gap-5">
        <img
          src={begin.data.qrCode}
          alt="A code to scan with an authenticator app"
          width={160}
          height={160}
          className="rounded border border-paper-line bg-white p-1"
        />
        <div className="text-sm">
          <p className="font-semibold">Key</p>
          <code className="break-all rounded bg-paper-deep px-2 py-1 font-mono text-sm" data-testid="totp-key">
            {begin.data.secret}
          </code>
        </div>
      </div>
      <Form
        errors={errors}
        aria-label="Turn on the second factor"
        onSubmit={(form) => {
          setErrors(noFormErrors);
          enable.mutate((formValues(form).code ?? '').trim(), {
            onSuccess: (r) => onCodes(r.recoveryCodes),
            onError: (e) => setErrors(formErrorsFrom(e, ['code'])),
          });
        }}
      >
        <TextField label="Code from the app" name="code" inputMode="numeric" autoComplete="one-time-code" error={errors.fields.code} required />
        <FormActions>
          <Button type="submit" variant="primary" pending={enable.isPending}>
            Turn on
          </Button>
        </FormActions>
      </Form>
    </div>
  );
}

function TwoFactorOn({ left, onCodes }: { left: number; onCodes: (codes: string[]) => void }) {
  const disable = useDisableTwoFactor();
  const renew = useNewRecoveryCodes();
  const [errors, setErrors] = useState<FormErrors>(noFormErrors);
  const [step, setStep] = useState<'idle' | 'off' | 'codes'>('idle');
  return (
    <div className="space-y-4">
      <Alert tone="success" title="The second factor is on">
        Signing in asks for a code from your authenticator app. {left} unused recovery code{left === 1 ? '' : 's'} left.
      </Alert>
      {step === 'idle' && (
        <div className="flex flex-wrap gap-3">
          <Button onClick={() => setStep('codes')}>New recovery codes</Button>
          <Button onClick={() => setStep('off')}>Turn off</Button>
        </div>
      )}
      {step !== 'idle' && (
        <PasswordStep
          label={step === 'off' ? 'Turn off the second factor' : 'Make new recovery codes'}
          action={step === 'off' ? 'Turn off' : 'Make new codes'}
          pending={disable.isPending || renew.isPending}
          errors={errors}
          onPassword={(password) => {
            setErrors(noFormErrors);
            const onError = (e: unknown) => setErrors(formErrorsFrom(e, ['password']));
            if (step === 'off') disable.mutate(password, { onSuccess: () => setStep('idle'), onError });
            else renew.mutate(password, { onSuccess: (r) => onCodes(r.recoveryCodes), onError });
          }}
        />
      )}
    </div>
  );
}

function RecoveryCodes({ codes, onDone }: { codes: string[]; onDone: () => void }) {
  return (
    <div className="space-y-4">
      <Alert tone="info" title="Keep these recovery codes">
        Each works once, in place of a code from the app, if you lose your phone. They are shown only now: print them or keep them in a password manager.
      </Alert>
      <ul className="grid grid-cols-2 gap-2 font-mono text-sm" aria-label="Recovery codes">
        {codes.map((c) => (
          <li key={c} className="rounded bg-paper-deep px-2 py-1">
            {c}
          </li>
        ))}
      </ul>
      <Button variant="primary" onClick={onDone}>
        I have kept them
      </Button>
    </div>
  );
}
