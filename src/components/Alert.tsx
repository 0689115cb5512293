import type { ReactNode } from 'react';

export type AlertTone = 'info' | 'success' | 'error';

// Errors are copper with a mark, not red: red is reserved for hard engineering limits.
const tones: Record<AlertTone, { box: string; mark: string }> = {
  info: { box: 'border-teal/40 bg-teal-light/50 text-ink', mark: 'i' },
  success: { box: 'border-teal/50 bg-teal-light/70 text-ink', mark: '✓' },
  error: { box: 'border-copper/60 bg-copper-light/70 text-ink', mark: '!' },
};

/**
 * A message in a box. Errors are announced as alerts; other tones politely. Pass `id` and
 * `tabIndex={-1}` when a form should move focus to it.
 */
export function Alert({
  tone = 'info',
  title,
  children,
  className = '',
  id,
  tabIndex,
}: {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  className?: string;
  id?: string;
  tabIndex?: number;
}) {
  const { box, mark } = tones[tone];
  return (
    <div
      id={id}
      tabIndex={tabIndex}
      role={tone === 'error' ? 'alert' : 'status'}
      className={`flex gap-3 rounded-md border px-4 py-3 text-sm ${box} ${className}`}
    >
      <span
        aria-hidden="true"
        className={`mt-0.5 flex size-5 shrink-0 items-center justify-center rounded-full text-xs font-bold text-white ${
          tone === 'error' ? 'bg-copper-ink' : 'bg-teal'
        }`}
      >
        {mark}
      </span>
      <div className="space-y-1">
        {title && <p className="font-semibold">{title}</p>}
        {children && <div className="text-ink-soft [&_a]:text-teal-dark [&_a]:underline">{children}</div>}
      </div>
    </div>
  );
}
