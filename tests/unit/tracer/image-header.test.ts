import { describe, expect, it } from 'vitest';
import { checkImage, MAX_IMAGE_BYTES } from '#shared/tracer/image-header';
import { GIF_BYTES, jpegHeaderOnly, pngHeaderOnly, pngPicture } from './images';

// The sizes below are the ones written into the hand-made files (images.ts), so the header parse
// must give them back exactly; the limits are the Tracer's own (40 megapixels, 20,000 px a side,
// 8 MiB), common practice, no source.

describe('picture files are recognised by their bytes', () => {
  it('reads the size of a PNG from its IHDR chunk', () => {
    expect(checkImage(pngPicture(37, 21))).toEqual({ ok: true, contentType: 'image/png', extension: 'png', width: 37, height: 21 });
  });

  it('reads the size of a JPEG from its frame header, after an APP1 block', () => {
    expect(checkImage(jpegHeaderOnly(3000, 2000, { exifBytes: 20_000 }))).toEqual({
      ok: true,
      contentType: 'image/jpeg',
      extension: 'jpg',
      width: 3000,
      height: 2000,
    });
    // A progressive JPEG (SOF2) carries its size the same way.
    expect(checkImage(jpegHeaderOnly(640, 480, { frameMarker: 0xc2 }))).toMatchObject({ ok: true, width: 640, height: 480 });
  });

  it('refuses an empty file', () => {
    expect(checkImage(new Uint8Array(0))).toMatchObject({ ok: false, code: 'empty' });
  });

  it('refuses a file over the byte limit before reading it', () => {
    const big = new Uint8Array(MAX_IMAGE_BYTES + 1);
    big.set(pngHeaderOnly(100, 100));
    const result = checkImage(big);
    expect(result).toMatchObject({ ok: false, code: 'too-large' });
    if (!result.ok) expect(result.message).toContain('8 MB');
  });

  it('refuses more than 40 megapixels, and sides over 20,000 px, saying the size', () => {
    const result = checkImage(pngHeaderOnly(8000, 6000)); // 48 megapixels
    expect(result).toMatchObject({ ok: false, code: 'too-many-pixels' });
    if (!result.ok) expect(result.message).toContain('8000 × 6000 pixels (48.0 megapixels)');
    expect(checkImage(pngHeaderOnly(25_000, 100))).toMatchObject({ ok: false, code: 'too-many-pixels' });
    expect(checkImage(pngHeaderOnly(6000, 6000))).toMatchObject({ ok: true }); // 36 megapixels
  });

  it('refuses other pictures by what they are, whatever their name', () => {
    const gif = checkImage(GIF_BYTES);
    expect(gif).toMatchObject({ ok: false, code: 'unsupported-image' });
    if (!gif.ok) expect(gif.message).toContain('GIF');
    const svg = checkImage(new TextEncoder().encode('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"></svg>'));
    expect(svg).toMatchObject({ ok: false, code: 'unsupported-image' });
  });

  it('refuses text, and any file that only starts like a picture', () => {
    expect(checkImage(new TextEncoder().encode('curve,label,flow\nsurge,,1,1.2\n'))).toMatchObject({ ok: false, code: 'not-an-image' });
    expect(checkImage(new TextEncoder().encode('BMW turbo notes'))).toMatchObject({ ok: false, code: 'not-an-image' });
    // The PNG signature with no IHDR after it, and a JPEG whose image data comes before any frame header.
    expect(checkImage(pngHeaderOnly(10, 10).subarray(0, 12))).toMatchObject({ ok: false, code: 'unreadable-header' });
    expect(checkImage(Buffer.from([0xff, 0xd8, 0xff, 0xda, 0x00, 0x02, 0xff, 0xd9]))).toMatchObject({ ok: false, code: 'unreadable-header' });
    expect(checkImage(pngHeaderOnly(0, 10))).toMatchObject({ ok: false, code: 'unreadable-header' });
  });
});
