import type { LogColumnMapping } from '#shared/logs/mapping';
import type { ReadProblem } from '#shared/logs/read';

/** What the reading worker sends the page. */
export type WorkerAnswer =
  | { kind: 'progress'; share: number }
  | { kind: 'problems'; problems: ReadProblem[] }
  | {
      kind: 'table';
      names: string[];
      headerUnits: (string | null)[];
      rowCount: number;
      delimiter: string;
      decimalComma: boolean;
      unreadable: number[];
      problems: ReadProblem[];
      /** The first values of each column, for the mapping step. */
      preview: number[][];
      guess: LogColumnMapping[];
    };
