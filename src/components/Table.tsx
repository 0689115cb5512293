import type { ReactNode } from 'react';

/**
 * A ruled table with a caption (visible or for screen readers only). Numbers line up because
 * tables use tabular figures (see app.css).
 */
export function Table({ caption, captionHidden = false, head, children }: { caption: string; captionHidden?: boolean; head: ReactNode; children: ReactNode }) {
  return (
    // Relative: a screen-reader-only header cell (absolutely placed) stays inside the scrolling
    // box instead of widening the whole page on a phone.
    <div className="relative overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm">
        <caption className={captionHidden ? 'sr-only' : 'mb-2 text-left font-semibold text-ink'}>{caption}</caption>
        <thead className="border-b-2 border-ink/20 text-xs uppercase tracking-wider text-ink-soft">{head}</thead>
        <tbody className="divide-y divide-paper-line">{children}</tbody>
      </table>
    </div>
  );
}

export const th = 'px-3 py-2 font-semibold';
export const td = 'px-3 py-2.5 align-middle';
