import type { ComponentProps, ReactNode } from 'react';
import { Link, type LinkProps } from 'react-router';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'destructive';

const base =
  'inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-semibold leading-5 ' +
  'transition-colors disabled:cursor-not-allowed select-none whitespace-nowrap';

// Destructive actions are copper, not red: red is kept for hard engineering limits.
// A disabled primary button often says a state ("Saved"): teal-dark on teal-light keeps 6.0:1
// (a faded teal was 2.6:1); the others fade, their text staying above 4.5:1 on paper.
const variants: Record<ButtonVariant, string> = {
  primary: 'bg-teal text-white shadow-sm not-disabled:hover:bg-teal-dark disabled:bg-teal-light disabled:text-teal-dark disabled:shadow-none',
  secondary: 'border border-ink/25 bg-white/70 text-ink hover:border-teal hover:text-teal-dark disabled:opacity-75',
  quiet: 'text-teal-dark underline-offset-4 hover:underline px-2 disabled:opacity-75',
  destructive: 'border border-copper bg-white/70 text-copper-ink hover:bg-copper-light disabled:opacity-75',
};

export function buttonClass(variant: ButtonVariant = 'secondary', extra = ''): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

export interface ButtonProps extends ComponentProps<'button'> {
  variant?: ButtonVariant;
  /** While true the button is busy: disabled, marked aria-busy and showing a spinner. */
  pending?: boolean;
  children: ReactNode;
}

export function Button({ variant = 'secondary', pending = false, disabled, className = '', children, type = 'button', ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClass(variant, className)} disabled={disabled || pending} aria-busy={pending || undefined} {...rest}>
      {pending && <Spinner />}
      {children}
    </button>
  );
}

export function Spinner() {
  return (
    <svg aria-hidden="true" viewBox="0 0 16 16" className="size-4 animate-spin" fill="none">
      <circle cx="8" cy="8" r="6" stroke="currentColor" strokeOpacity="0.3" strokeWidth="2" />
      <path d="M14 8a6 6 0 0 0-6-6" stroke="currentColor" strokeWidth="2" strokeLinecap="round" />
    </svg>
  );
}

/** A link that looks like a button, for navigation that reads as an action. */
export function ButtonLink({ variant = 'secondary', className = '', ...rest }: LinkProps & { variant?: ButtonVariant }) {
  return <Link className={buttonClass(variant, className)} {...rest} />;
}
