/**
 * The stored form of a log's SI channels, before compression: each channel quantised to its
 * quantity's resolution (quantities.ts), as differences from the previous sample in zigzag
 * variable-length integers, so slowly changing signals take about a byte a sample and compress
 * well. Missing samples are kept in a bitmap. Pure: the server deflates the bytes with node:zlib,
 * the browser inflates them with DecompressionStream.
 */
import type { LogChannels } from './convert';
import { LOG_QUANTITIES, LOG_QUANTITY_INFO, type LogQuantity } from './quantities';

const MAGIC = 0x53424c47; // "SBLG"
const VERSION = 1;

class ByteWriter {
  bytes: Uint8Array;
  length = 0;
  constructor(size: number) {
    this.bytes = new Uint8Array(Math.max(64, size));
  }
  private room(n: number) {
    if (this.length + n <= this.bytes.length) return;
    const next = new Uint8Array(Math.max(this.length + n, this.bytes.length * 2));
    next.set(this.bytes.subarray(0, this.length));
    this.bytes = next;
  }
  byte(v: number) {
    this.room(1);
    this.bytes[this.length++] = v;
  }
  uint32(v: number) {
    this.room(4);
    new DataView(this.bytes.buffer).setUint32(this.length, v, true);
    this.length += 4;
  }
  raw(b: Uint8Array) {
    this.room(b.length);
    this.bytes.set(b, this.length);
    this.length += b.length;
  }
  /** Zigzag variable-length integer (any safe integer). */
  signed(v: number) {
    let u = v >= 0 ? v * 2 : -v * 2 - 1;
    this.room(8);
    while (u >= 128) {
      this.bytes[this.length++] = (u % 128) | 128;
      u = Math.floor(u / 128);
    }
    this.bytes[this.length++] = u;
  }
}

/** The channels as bytes (see the module note). Channels are written in LOG_QUANTITIES order. */
export function packChannels(channels: LogChannels, rowCount: number): Uint8Array {
  const present = LOG_QUANTITIES.filter((q) => channels[q]);
  const header = new TextEncoder().encode(JSON.stringify({ rowCount, channels: present }));
  const out = new ByteWriter(rowCount * present.length * 2 + header.length + 16);
  out.uint32(MAGIC);
  out.byte(VERSION);
  out.uint32(header.length);
  out.raw(header);
  for (const q of present) {
    const values = channels[q]!;
    const step = LOG_QUANTITY_INFO[q].resolution;
    let missing: Uint8Array | null = null;
    for (let i = 0; i < rowCount; i++)
      if (!Number.isFinite(values[i])) {
        missing ??= new Uint8Array(Math.ceil(rowCount / 8));
        missing[i >> 3] |= 1 << (i & 7);
      }
    out.byte(missing ? 1 : 0);
    if (missing) out.raw(missing);
    let previous = 0;
    for (let i = 0; i < rowCount; i++) {
      const v = values[i];
      const q = Number.isFinite(v) ? Math.round(v / step) : previous;
      out.signed(q - previous);
      previous = q;
    }
  }
  return out.bytes.slice(0, out.length);
}

/** Reads bytes written by packChannels; throws on anything else. */
export function unpackChannels(bytes: Uint8Array): { channels: LogChannels; rowCount: number } {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (bytes.length < 9 || view.getUint32(0, true) !== MAGIC || bytes[4] !== VERSION) throw new Error('not a stored log');
  const headerLength = view.getUint32(5, true);
  const header = JSON.parse(new TextDecoder().decode(bytes.subarray(9, 9 + headerLength))) as { rowCount: number; channels: LogQuantity[] };
  let at = 9 + headerLength;
  const { rowCount } = header;
  const channels: LogChannels = {};
  for (const q of header.channels) {
    if (!LOG_QUANTITIES.includes(q)) throw new Error(`unknown channel ${String(q)}`);
    const step = LOG_QUANTITY_INFO[q].resolution;
    const hasMissing = bytes[at++] === 1;
    const missing = hasMissing ? bytes.subarray(at, at + Math.ceil(rowCount / 8)) : null;
    if (missing) at += missing.length;
    const values = new Float64Array(rowCount);
    let previous = 0;
    for (let i = 0; i < rowCount; i++) {
      let u = 0;
      let scale = 1;
      let b: number;
      do {
        if (at >= bytes.length) throw new Error('stored log is cut short');
        b = bytes[at++];
        u += (b & 127) * scale;
        scale *= 128;
      } while (b >= 128);
      const delta = u % 2 === 0 ? u / 2 : -(u + 1) / 2;
      previous += delta;
      values[i] = missing && missing[i >> 3] & (1 << (i & 7)) ? Number.NaN : previous * step;
    }
    channels[q] = values;
  }
  return { channels, rowCount };
}
