import { MAX_MAP_DATA_ROWS, MAX_MAP_FILE_BYTES } from '#shared/maps/format';
import { parseMapFile } from '#shared/maps/parse';
import type { MapParseResult } from '#shared/maps/types';

/** A file the user chose, read and checked in the browser with the same rules as the server. */
export interface ReadMapFile {
  file: File;
  result: MapParseResult;
  /** The file's lines (for showing the line a problem is on); null when it is not text. */
  lines: string[] | null;
}

const megabytes = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;

/** Splits text into lines the way the parser counts them (CRLF, LF and CR all end a line). */
export function fileLines(bytes: Uint8Array): string[] | null {
  if (bytes.indexOf(0) !== -1) return null;
  const text = new TextDecoder('utf-8', { fatal: false }).decode(bytes);
  return text.replace(/^\uFEFF/, '').split(/\r\n|\r|\n/);
}

/**
 * Reads a chosen file and checks it at once. A file over the size limit is refused without
 * reading it: a map is a few hundred rows, and a wrong choice (a video, a disk image) should not
 * stall the page.
 */
export async function readMapFile(file: File): Promise<ReadMapFile> {
  if (file.size > MAX_MAP_FILE_BYTES) {
    return {
      file,
      lines: null,
      result: {
        ok: false,
        problems: [
          {
            code: 'too-large',
            line: null,
            column: null,
            message: `the file is ${megabytes(file.size)}; the limit is ${megabytes(MAX_MAP_FILE_BYTES)} and ${MAX_MAP_DATA_ROWS.toLocaleString('en-US')} rows`,
          },
        ],
      },
    };
  }
  const bytes = new Uint8Array(await file.arrayBuffer());
  const result = parseMapFile(bytes);
  const notText = !result.ok && result.problems.some((p) => p.code === 'not-text');
  return { file, result, lines: notText ? null : fileLines(bytes) };
}
