export type TypedNumber = { ok: true; value: number } | { ok: false; message: string };

const NUMBER_TEXT = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i;

/**
 * Reads what a person typed as a number: digits with an optional sign, point and exponent (a
 * typographic minus counts as a minus). Refuses anything else: a comma could be a decimal comma or
 * a thousands separator, so asking is safer. Numbers beyond `limit` in size are refused too. What
 * an empty box means (nothing yet, a value cleared, a missing one) is for each box to say.
 */
export function parseTypedNumber(raw: string, { limit = Infinity }: { limit?: number } = {}): TypedNumber {
  const t = raw.trim().replace(/^−/, '-');
  if (t === '') return { ok: false, message: 'Type a number.' };
  if (/^[-+]?\d+,\d+$/.test(t)) return { ok: false, message: 'Use a point for decimals (1.5, not 1,5).' };
  if (!NUMBER_TEXT.test(t)) return { ok: false, message: 'Type a number (digits and a decimal point).' };
  const value = Number(t);
  return Number.isFinite(value) && Math.abs(value) <= limit ? { ok: true, value } : { ok: false, message: 'That number is too large.' };
}
