/**
 * The number fields every input schema is built from. Messages name the unit expected, since most
 * bad values are unit slips.
 */
import { z } from 'zod';

export const num = (what: string) => z.number({ error: `${what} must be a number` });

export const fraction = (what: string) =>
  num(what).gt(0, `${what} is a fraction above 0`).max(1, `${what} is a fraction from 0 to 1 (not a percentage); above 1 is impossible`);

export const temperature = (what: string, min = 150, max = 400) =>
  num(what)
    .min(min, `${what} is absolute temperature in K, at least ${min} K (was °C given?)`)
    .max(max, `${what} is absolute temperature in K, at most ${max} K`);

export const rpm = (what = 'rpm') => num(what).gt(0, `${what} must be above 0 rpm`).max(30_000, `${what} must be at most 30 000 rpm`);

export const count = (what: string, max: number) =>
  num(what).int(`${what} must be a whole number`).min(1, `${what} must be at least 1`).max(max, `${what} must be at most ${max}`);

export const name = (what: string) =>
  z
    .string({ error: `${what} must be text` })
    .trim()
    .min(1, `${what} must not be empty`)
    .max(100, `${what} must be at most 100 characters`);

/** An optional identity of a list item (a scenario, a boost row): any short text, unique in its list. */
export const itemId = (what: string) =>
  z
    .string({ error: `${what} must be text` })
    .min(1, `${what} must not be empty`)
    .max(64, `${what} must be at most 64 characters`)
    .optional();

/** Whether a value is a finite number (cross-field checks read values a field check may have refused). */
export const isNum = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

/** A pressure in kPa for messages, 4 significant figures. */
export const fmtKpa = (pa: number) => `${Number((pa / 1000).toPrecision(4))} kPa`;
