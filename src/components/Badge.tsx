import type { ReactNode } from 'react';

const tones = {
  neutral: 'border-ink/20 text-ink-soft',
  teal: 'border-teal/40 bg-teal-light/60 text-teal-dark',
  copper: 'border-copper/50 bg-copper-light/60 text-copper-ink',
} as const;

export function Badge({ tone = 'neutral', children }: { tone?: keyof typeof tones; children: ReactNode }) {
  return <span className={`inline-flex items-center rounded-full border px-2 py-0.5 text-xs font-semibold ${tones[tone]}`}>{children}</span>;
}
