import type { ReactNode } from 'react';
import { useEditor } from './context';

/**
 * One group of inputs, folded open or shut by its heading. The heading counts the problems
 * inside (paths under `prefixes`), so a shut section with a problem still says so.
 */
export function Section({
  title,
  prefixes,
  children,
  defaultOpen = true,
  testId,
}: {
  title: string;
  prefixes: string[];
  children: ReactNode;
  defaultOpen?: boolean;
  testId?: string;
}) {
  const { issues } = useEditor();
  const count = Object.keys(issues).filter((p) => prefixes.some((prefix) => p === prefix || p.startsWith(`${prefix}.`))).length;
  return (
    <details open={defaultOpen} className="group rounded-lg border border-paper-line bg-white/80 shadow-sm" data-testid={testId}>
      <summary className="flex cursor-pointer list-none items-center justify-between gap-2 rounded-lg px-4 py-2.5 hover:bg-paper-deep/40">
        <span className="flex items-center gap-2">
          <span aria-hidden="true" className="inline-block w-3 text-ink-faint transition-transform group-open:rotate-90">
            ▸
          </span>
          <h3 className="font-semibold text-ink">{title}</h3>
        </span>
        {count > 0 && (
          <span className="rounded-full bg-copper-light px-2 py-0.5 text-xs font-semibold text-copper-ink">
            {count === 1 ? '1 problem' : `${count} problems`}
          </span>
        )}
      </summary>
      <div className="space-y-4 border-t border-paper-line px-4 pb-4 pt-3">{children}</div>
    </details>
  );
}

/** Fields side by side on wide panels. */
export function FieldRow({ children }: { children: ReactNode }) {
  return <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">{children}</div>;
}

/** A small heading inside a section. */
export function SubHeading({ children }: { children: ReactNode }) {
  return <h4 className="text-xs font-semibold uppercase tracking-[0.12em] text-copper-ink">{children}</h4>;
}
