import { checkImage, MAX_IMAGE_BYTES, type ImageCheck } from '#shared/tracer/image-header';

/**
 * Checks a chosen file in the browser by the same rules as the server (its bytes, not its name),
 * so a wrong file is refused at once, before any upload. A file over the byte limit is refused
 * without reading it.
 */
export async function readPicture(file: File): Promise<ImageCheck> {
  if (file.size > MAX_IMAGE_BYTES) {
    return checkImage(new Uint8Array(MAX_IMAGE_BYTES + 1));
  }
  return checkImage(new Uint8Array(await file.arrayBuffer()));
}

/** A trace's first name, from the picture's file name: "gt-map_scan.png" → "gt map scan". */
export function nameFromFile(fileName: string): string {
  return fileName
    .replace(/\.[A-Za-z0-9]{1,5}$/, '')
    .replace(/[_]+/g, ' ')
    .replace(/[\u0000-\u001f\u007f]+/g, ' ')
    .replace(/^[=+\-@\s]+/, '')
    .trim()
    .slice(0, 120);
}
