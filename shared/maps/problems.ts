import { MAX_REPORTED_PROBLEMS } from './format';
import type { MapProblem, MapProblemCode } from './types';

/** Collects the problems of one file, so that the user reads all of them at once. */
export class ProblemList {
  readonly items: MapProblem[] = [];

  add(code: MapProblemCode, line: number | null, column: number | null, message: string): void {
    this.items.push({ code, line, column, message });
  }

  get isEmpty(): boolean {
    return this.items.length === 0;
  }

  /** File order (whole-file problems first), capped so that a broken file gives a readable list. */
  sorted(): MapProblem[] {
    const ordered = this.items
      .map((p, index) => ({ p, index }))
      .sort((a, b) => (a.p.line ?? 0) - (b.p.line ?? 0) || (a.p.column ?? 0) - (b.p.column ?? 0) || a.index - b.index)
      .map(({ p }) => p);
    if (ordered.length <= MAX_REPORTED_PROBLEMS) return ordered;
    const more = ordered.length - MAX_REPORTED_PROBLEMS;
    return [
      ...ordered.slice(0, MAX_REPORTED_PROBLEMS),
      { code: 'too-many-problems', line: null, column: null, message: `and ${more} more problems not listed; fix these first` },
    ];
  }
}

/** A cell's text as quoted in messages, shortened so that a long or binary cell cannot flood them. */
export function quoteCell(text: string): string {
  const shown = text.length > 30 ? `${text.slice(0, 30)}…` : text;
  return `"${shown}"`;
}
