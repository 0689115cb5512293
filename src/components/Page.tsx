import { useEffect, type ReactNode } from 'react';

const widths = { form: 'max-w-md', narrow: 'max-w-2xl', wide: 'max-w-5xl' } as const;

/**
 * One screen: its h1, a line saying what it is for, optional actions, and the content.
 * Sets the document title so browser history and tabs read well.
 */
export function Page({
  title,
  description,
  actions,
  eyebrow,
  children,
  width = 'wide',
}: {
  title: string;
  description?: ReactNode;
  actions?: ReactNode;
  /** A small line above the title (the area, or the kind of object). */
  eyebrow?: ReactNode;
  children?: ReactNode;
  /** `form` for a single short form (sign-in), `narrow` for reading, `wide` for tables. */
  width?: 'form' | 'narrow' | 'wide';
}) {
  useDocumentTitle(title);
  return (
    <div className={`mx-auto w-full ${widths[width]} space-y-6`}>
      <header className="flex flex-wrap items-end justify-between gap-4 border-b border-ink/15 pb-4">
        <div className="space-y-1">
          {eyebrow && <p className="text-xs font-semibold uppercase tracking-[0.14em] text-copper-ink">{eyebrow}</p>}
          <h1 className="text-3xl font-semibold tracking-tight text-ink">{title}</h1>
          {description && <p className="max-w-prose text-ink-soft">{description}</p>}
        </div>
        {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
      </header>
      {children}
    </div>
  );
}

export function useDocumentTitle(title: string): void {
  useEffect(() => {
    document.title = title ? `${title} · Spoolbook` : 'Spoolbook';
  }, [title]);
}

/** Shown while a page's data loads; announced politely. */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="py-8 text-center text-ink-soft">
      {label}
    </p>
  );
}
