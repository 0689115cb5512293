import type { HTMLAttributes, ReactNode } from 'react';

/** A sheet on the notebook page; `title` becomes its heading (h2 unless told). */
export function Card({
  title,
  titleAs: Heading = 'h2',
  actions,
  children,
  className = '',
  ...rest
}: Omit<HTMLAttributes<HTMLElement>, 'title'> & {
  title?: ReactNode;
  titleAs?: 'h2' | 'h3';
  actions?: ReactNode;
  children: ReactNode;
}) {
  return (
    <section className={`rounded-lg border border-paper-line bg-white/75 p-5 shadow-sm shadow-paper-line/60 ${className}`} {...rest}>
      {(title || actions) && (
        <header className="mb-4 flex flex-wrap items-baseline justify-between gap-2">
          {title && <Heading className="text-lg font-semibold text-ink">{title}</Heading>}
          {actions}
        </header>
      )}
      {children}
    </section>
  );
}
