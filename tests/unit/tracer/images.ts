import { deflateSync } from 'node:zlib';

// Picture files made byte by byte for the tests, so that nothing depends on an image library.
// PNG layout: PNG specification (W3C, 2nd edition 2003), sections 5.2 (signature), 5.3 (chunk
// layout, CRC-32) and 11.2.2 (IHDR). JPEG layout: ITU-T T.81 (1992), annex B (markers, SOFn).

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'ascii');
  Buffer.from(data).copy(out, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

export const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** The signature and an IHDR chunk claiming `width` × `height` (8-bit RGB), nothing else. */
export function pngHeaderOnly(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  return Buffer.concat([PNG_SIGNATURE, chunk('IHDR', ihdr)]);
}

/** A real, decodable PNG: `width` × `height`, a light sheet with a dark diagonal. */
export function pngPicture(width: number, height: number): Buffer {
  const rows: number[] = [];
  for (let y = 0; y < height; y++) {
    rows.push(0); // filter: none
    for (let x = 0; x < width; x++) {
      const ink = Math.abs(x * height - y * width) < width + height;
      rows.push(...(ink ? [40, 40, 40] : [250, 246, 236]));
    }
  }
  return Buffer.concat([pngHeaderOnly(width, height), chunk('IDAT', deflateSync(Buffer.from(rows))), chunk('IEND', new Uint8Array(0))]);
}

/** A JPEG's markers up to the frame header (SOI, APP0 and optionally a large APP1, SOF0, SOS, EOI). */
export function jpegHeaderOnly(width: number, height: number, { exifBytes = 0, frameMarker = 0xc0 } = {}): Buffer {
  const parts: Buffer[] = [Buffer.from([0xff, 0xd8])];
  parts.push(Buffer.from([0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00]));
  if (exifBytes > 0) {
    const app1 = Buffer.alloc(4 + exifBytes);
    app1.set([0xff, 0xe1]);
    app1.writeUInt16BE(exifBytes + 2, 2);
    parts.push(app1);
  }
  const sof = Buffer.from([0xff, frameMarker, 0x00, 0x11, 0x08, 0, 0, 0, 0, 0x03, 0x01, 0x22, 0x00, 0x02, 0x11, 0x01, 0x03, 0x11, 0x01]);
  sof.writeUInt16BE(height, 5);
  sof.writeUInt16BE(width, 7);
  parts.push(sof, Buffer.from([0xff, 0xda, 0x00, 0x08, 0x01, 0x01, 0x00, 0x00, 0x3f, 0x00, 0x12, 0x34, 0xff, 0xd9]));
  return Buffer.concat(parts);
}

/** A GIF's first bytes: "GIF89a" and a logical screen of 10 × 10. */
export const GIF_BYTES = Buffer.from([0x47, 0x49, 0x46, 0x38, 0x39, 0x61, 10, 0, 10, 0, 0, 0, 0, 0x3b]);
