/**
 * What a picture file is, read from its first bytes and its header alone (no decoding library):
 * PNG (signature and IHDR chunk) or JPEG (SOI marker and the SOFn frame header). The name and the
 * type a browser claims for a file are never trusted; only these bytes are.
 */

/** Largest picture accepted, bytes (8 MiB): a scan or screenshot of one map sheet is far smaller. */
export const MAX_IMAGE_BYTES = 8 * 1024 * 1024;

/** Largest picture accepted, pixels (40 megapixels): a 600 dpi scan of an A4 sheet is about 35. */
export const MAX_IMAGE_PIXELS = 40_000_000;

/** Longest side accepted, pixels: browsers cannot draw a canvas much larger than this. */
export const MAX_IMAGE_SIDE = 20_000;

export const IMAGE_CONTENT_TYPES = ['image/png', 'image/jpeg'] as const;
export type ImageContentType = (typeof IMAGE_CONTENT_TYPES)[number];

export type ImageProblemCode = 'empty' | 'too-large' | 'not-an-image' | 'unsupported-image' | 'unreadable-header' | 'too-many-pixels';

export type ImageCheck =
  { ok: true; contentType: ImageContentType; extension: 'png' | 'jpg'; width: number; height: number } | { ok: false; code: ImageProblemCode; message: string };

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function startsWith(bytes: Uint8Array, prefix: readonly number[], at = 0): boolean {
  if (bytes.length < at + prefix.length) return false;
  return prefix.every((b, i) => bytes[at + i] === b);
}

function ascii(bytes: Uint8Array, at: number, length: number): string {
  let text = '';
  for (let i = at; i < Math.min(bytes.length, at + length); i++) text += String.fromCharCode(bytes[i]);
  return text;
}

function uint32(bytes: Uint8Array, at: number): number {
  return ((bytes[at] << 24) >>> 0) + (bytes[at + 1] << 16) + (bytes[at + 2] << 8) + bytes[at + 3];
}

function uint16(bytes: Uint8Array, at: number): number {
  return (bytes[at] << 8) + bytes[at + 1];
}

/** Other kinds of file people pick by mistake, named so the message can say what to do. */
function otherKind(bytes: Uint8Array): string | null {
  const head = ascii(bytes, 0, 16);
  if (head.startsWith('GIF87a') || head.startsWith('GIF89a')) return 'a GIF picture';
  if (head.startsWith('RIFF') && ascii(bytes, 8, 4) === 'WEBP') return 'a WebP picture';
  // BM, then (at 14) the size of one of the known DIB headers.
  if (head.startsWith('BM') && bytes.length > 18 && [12, 40, 52, 56, 64, 108, 124].includes(bytes[14] + (bytes[15] << 8))) return 'a BMP picture';
  if (startsWith(bytes, [0x49, 0x49, 0x2a, 0x00]) || startsWith(bytes, [0x4d, 0x4d, 0x00, 0x2a])) return 'a TIFF picture';
  if (ascii(bytes, 4, 4) === 'ftyp') return /heic|heix|mif1|avif/.test(ascii(bytes, 8, 4)) ? 'a HEIC or AVIF picture' : 'a video or ISO media file';
  if (head.startsWith('%PDF')) return 'a PDF document';
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04])) return 'a zip archive (or an office document)';
  const text = ascii(bytes, 0, 256)
    .replace(/^\uFEFF|^\xEF\xBB\xBF/, '')
    .trimStart()
    .toLowerCase();
  if (text.startsWith('<svg') || (text.startsWith('<?xml') && text.includes('<svg'))) return 'an SVG drawing';
  return null;
}

const ADVICE = 'Save or export the picture as PNG (best for screenshots) or JPEG (photos and scans) and choose it again.';

function refuse(code: ImageProblemCode, message: string): ImageCheck {
  return { ok: false, code, message };
}

function checkSize(type: ImageContentType, width: number, height: number): ImageCheck {
  const extension = type === 'image/png' ? 'png' : 'jpg';
  if (width <= 0 || height <= 0)
    return refuse(
      'unreadable-header',
      `The ${extension.toUpperCase()} header gives a size of ${width} × ${height} pixels, which no picture has. The file may be damaged.`,
    );
  if (width > MAX_IMAGE_SIDE || height > MAX_IMAGE_SIDE || width * height > MAX_IMAGE_PIXELS) {
    const megapixels = ((width * height) / 1e6).toFixed(1);
    return refuse(
      'too-many-pixels',
      `The picture is ${width} × ${height} pixels (${megapixels} megapixels); the limit is ${MAX_IMAGE_PIXELS / 1e6} megapixels and ${MAX_IMAGE_SIDE.toLocaleString('en-US')} pixels a side. Scale it down (a map traces well at 2,000 to 4,000 pixels across) and choose it again.`,
    );
  }
  return { ok: true, contentType: type, extension, width, height };
}

function readPng(bytes: Uint8Array): ImageCheck {
  // Signature (8), then the first chunk, which must be IHDR: length 13, type, width, height.
  if (bytes.length < 24 || ascii(bytes, 12, 4) !== 'IHDR' || uint32(bytes, 8) !== 13) {
    return refuse('unreadable-header', 'The file starts like a PNG picture but its header (IHDR) is missing or damaged. Export the picture again.');
  }
  return checkSize('image/png', uint32(bytes, 16), uint32(bytes, 20));
}

/** Start-of-frame markers carry the size: SOF0–SOF15 except DHT (C4), JPG (C8) and DAC (CC). */
function isStartOfFrame(marker: number): boolean {
  return marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc;
}

function readJpeg(bytes: Uint8Array): ImageCheck {
  const damaged = refuse(
    'unreadable-header',
    'The file starts like a JPEG picture but its size could not be read from it (no frame header before the image data). Export the picture again.',
  );
  let at = 2;
  while (at < bytes.length) {
    if (bytes[at] !== 0xff) return damaged;
    while (at < bytes.length && bytes[at] === 0xff) at++; // fill bytes
    if (at >= bytes.length) return damaged;
    const marker = bytes[at++];
    // Markers without a length: SOI, TEM and the restart markers.
    if (marker === 0xd8 || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) continue;
    if (marker === 0xd9 || marker === 0xda) return damaged; // end of image, or image data before any frame header
    if (at + 2 > bytes.length) return damaged;
    const length = uint16(bytes, at);
    if (length < 2) return damaged;
    if (isStartOfFrame(marker)) {
      if (at + 7 > bytes.length || length < 8) return damaged;
      return checkSize('image/jpeg', uint16(bytes, at + 5), uint16(bytes, at + 3));
    }
    at += length;
  }
  return damaged;
}

/**
 * Checks a picture file by its bytes: empty, too large, not a PNG or JPEG (whatever its name says),
 * a header that cannot be read, or more pixels than the Tracer takes. Messages are for people.
 */
export function checkImage(bytes: Uint8Array): ImageCheck {
  if (bytes.length === 0)
    return refuse('empty', 'The file is empty (0 bytes). Choose the picture again; if it came from a download, it may not have finished.');
  if (bytes.length > MAX_IMAGE_BYTES) {
    return refuse(
      'too-large',
      `The picture is ${(bytes.length / 1024 / 1024).toFixed(1)} MB; the limit is ${MAX_IMAGE_BYTES / 1024 / 1024} MB. Save it at a smaller size or as a JPEG and choose it again.`,
    );
  }
  if (startsWith(bytes, PNG_SIGNATURE)) return readPng(bytes);
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return readJpeg(bytes);
  const other = otherKind(bytes);
  if (other) return refuse('unsupported-image', `This file is ${other}, whatever its name says; the Tracer reads PNG and JPEG pictures only. ${ADVICE}`);
  return refuse('not-an-image', `This file is not a PNG or JPEG picture, whatever its name says (its content is checked, not its name). ${ADVICE}`);
}
