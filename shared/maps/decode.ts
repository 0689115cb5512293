import { MAX_MAP_DATA_ROWS, MAX_MAP_FILE_BYTES } from './format';
import type { ProblemList } from './problems';

const megabytes = (bytes: number) => `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
const LIMIT_WORDS = `the limit is ${megabytes(MAX_MAP_FILE_BYTES)} and ${MAX_MAP_DATA_ROWS.toLocaleString('en-US')} rows`;

function countLineBreaks(bytes: Uint8Array): number {
  let count = 0;
  for (let i = 0; i < bytes.length; i++) if (bytes[i] === 0x0a) count++;
  return count;
}

function utf8Length(text: string): number {
  // Each UTF-16 unit is at most 3 UTF-8 bytes: skip the exact count for files far under the limit.
  if (text.length * 3 <= MAX_MAP_FILE_BYTES) return text.length;
  return new TextEncoder().encode(text).length;
}

function startsWith(bytes: Uint8Array, signature: number[]): boolean {
  return signature.every((b, i) => bytes[i] === b);
}

function refuseTooLarge(byteLength: number, lineBreaks: number, problems: ProblemList): void {
  problems.add('too-large', null, null, `the file is ${megabytes(byteLength)}; ${LIMIT_WORDS}`);
  if (lineBreaks > MAX_MAP_DATA_ROWS) {
    problems.add('too-many-rows', null, null, `the file has about ${lineBreaks.toLocaleString('en-US')} rows; ${LIMIT_WORDS}`);
  }
}

/**
 * The file as text, or null with the reason in `problems`. Accepts a UTF-8 byte-order mark; refuses
 * UTF-16, binary data and anything over the size limit before reading further.
 */
export function decodeMapInput(input: string | Uint8Array, problems: ProblemList): string | null {
  let text: string;
  if (typeof input === 'string') {
    const bytes = utf8Length(input);
    if (bytes > MAX_MAP_FILE_BYTES) {
      refuseTooLarge(bytes, input.split('\n').length - 1, problems);
      return null;
    }
    text = input;
  } else {
    if (input.byteLength > MAX_MAP_FILE_BYTES) {
      refuseTooLarge(input.byteLength, countLineBreaks(input), problems);
      return null;
    }
    if (startsWith(input, [0xff, 0xfe]) || startsWith(input, [0xfe, 0xff])) {
      problems.add('not-text', null, null, 'the file is saved as UTF-16 text; save it as "CSV UTF-8" (comma-separated) instead');
      return null;
    }
    if (startsWith(input, [0x50, 0x4b, 0x03, 0x04])) {
      problems.add('not-text', null, null, 'the file is a zip archive (a spreadsheet workbook?), not CSV text; save it as "CSV UTF-8" (comma-separated)');
      return null;
    }
    if (input.indexOf(0) !== -1) {
      problems.add('not-text', null, null, 'the file holds binary data, not CSV text; save the map as "CSV UTF-8" (comma-separated)');
      return null;
    }
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(input);
    } catch {
      problems.add('not-text', null, null, 'the file is not UTF-8 text; save it as "CSV UTF-8" (comma-separated)');
      return null;
    }
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);

  const control = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F\uFFFD]/.exec(text);
  if (control) {
    const line = text.slice(0, control.index).split('\n').length;
    problems.add('not-text', line, null, 'the file holds binary data or control characters, not CSV text; save the map as "CSV UTF-8" (comma-separated)');
    return null;
  }
  if (text.trim() === '') {
    problems.add('empty-file', null, null, 'the file is empty');
    return null;
  }
  return text;
}
