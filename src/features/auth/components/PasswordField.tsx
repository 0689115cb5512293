import { useEffect, useState } from 'react';
import type { judgePassword } from '#shared/passwords/strength';
import { TextField, type TextFieldProps } from '#src/components/TextField';

type Judge = typeof judgePassword;

// The strength estimator carries a dictionary of common passwords: load it only on forms that
// ask for a new password, and only once.
let judgeLoading: Promise<Judge> | null = null;
function loadJudge(): Promise<Judge> {
  judgeLoading ??= import('#shared/passwords/strength').then((m) => m.judgePassword);
  return judgeLoading;
}

// Red is kept for hard engineering limits; a weak password is copper.
const METER = ['bg-copper', 'bg-copper', 'bg-copper', 'bg-teal', 'bg-teal'];

/**
 * A new-password field with a live strength hint: the same judgement the server applies (common
 * passwords, the e-mail address, the product's name are refused).
 */
export function PasswordField({ context = {}, ...props }: Omit<TextFieldProps, 'type' | 'hint'> & { context?: { email?: string; name?: string } }) {
  const [password, setPassword] = useState('');
  const [judge, setJudge] = useState<Judge | null>(null);
  useEffect(() => {
    let live = true;
    void loadJudge().then((j) => live && setJudge(() => j));
    return () => {
      live = false;
    };
  }, []);
  const judgement = judge && password ? judge(password, context) : null;
  const hint = (
    <span aria-live="polite" className="block">
      {judgement ? (
        <>
          <span className="mb-1 flex gap-1" aria-hidden="true">
            {[0, 1, 2, 3].map((i) => (
              <span key={i} className={`h-1.5 flex-1 rounded ${i < Math.max(1, judgement.score) ? METER[judgement.score] : 'bg-ink/10'}`} />
            ))}
          </span>
          <span data-testid="password-strength">{judgement.hint}.</span>
        </>
      ) : (
        'At least 8 characters. A few unrelated words together make a strong password.'
      )}
    </span>
  );
  return (
    <TextField
      {...props}
      type="password"
      autoComplete="new-password"
      hint={hint}
      onChange={(e) => {
        setPassword(e.currentTarget.value);
        props.onChange?.(e);
      }}
    />
  );
}
