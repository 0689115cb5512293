/// <reference lib="webworker" />
/**
 * Reads a chosen log file off the page's thread: the same reader as the server (shared/logs/read.ts,
 * papaparse), reporting progress, then a preview and the guessed mapping. The numbers stay here;
 * the page needs only what the mapping step shows.
 */
import { guessMapping } from '#shared/logs/guess';
import { readLogTable } from '#shared/logs/read';
import type { WorkerAnswer } from './messages';

self.onmessage = async (event: MessageEvent<{ file: File }>) => {
  const post = (answer: WorkerAnswer) => self.postMessage(answer);
  try {
    const text = await event.data.file.text();
    post({ kind: 'progress', share: 0.05 });
    let last = 0;
    const result = readLogTable(text, {
      onProgress: (share) => {
        if (share - last >= 0.02 || share === 1) {
          last = share;
          post({ kind: 'progress', share: 0.05 + 0.9 * share });
        }
      },
    });
    if (!result.ok) return post({ kind: 'problems', problems: result.problems });
    const t = result.table;
    const previewRows = Math.min(5, t.rowCount);
    post({
      kind: 'table',
      names: t.names,
      headerUnits: t.headerUnits,
      rowCount: t.rowCount,
      delimiter: t.delimiter,
      decimalComma: t.decimalComma,
      unreadable: t.unreadable,
      problems: t.problems.slice(0, 10),
      preview: t.columns.map((c) => Array.from(c.subarray(0, previewRows))),
      guess: guessMapping(t),
    });
  } catch (err) {
    post({ kind: 'problems', problems: [{ line: 1, message: err instanceof Error ? err.message : 'The file could not be read.' }] });
  }
};
