/** Tables by engine speed and the engine speeds a study computes: their schemas, types and counts. */
import { z } from 'zod';
import { isNum, num, rpm } from './fields';

/** Most rows in one table by rpm. */
const MAX_TABLE_ROWS = 100;
/** Most points a study computes per operating line. */
export const MAX_RPM_POINTS = 400;

/** A table by rpm: rows in strictly increasing rpm. */
export function rpmTableSchema(value: z.ZodNumber, what: string) {
  return z
    .array(z.strictObject({ rpm: rpm(`${what} rpm`), value }), { error: `${what} must be a list of { rpm, value } rows` })
    .min(1, `${what} needs at least one row`)
    .max(MAX_TABLE_ROWS, `${what} has at most ${MAX_TABLE_ROWS} rows`)
    .superRefine((rows, ctx) => {
      for (let i = 1; i < rows.length; i++) {
        if (isNum(rows[i].rpm) && isNum(rows[i - 1].rpm) && !(rows[i].rpm > rows[i - 1].rpm))
          ctx.addIssue({ code: 'custom', path: [i, 'rpm'], message: `${what} rows must be in increasing rpm` });
      }
    });
}

/**
 * A table by engine speed, rows in increasing rpm: each row an rpm and the value at that speed
 * (unit set by the table). Read by linear interpolation between rows and held flat (first or last
 * value) outside their range.
 */
export type RpmTable = z.output<ReturnType<typeof rpmTableSchema>>;

/** The engine speeds to compute, rpm: an explicit list, or min to max in steps. */
export const rpmPointsSchema = z.discriminatedUnion(
  'kind',
  [
    z.strictObject({
      kind: z.literal('list'),
      values: z
        .array(rpm())
        .min(1, 'give at least one rpm')
        .max(MAX_RPM_POINTS, `at most ${MAX_RPM_POINTS} rpm points`)
        .superRefine((values, ctx) => {
          for (let i = 1; i < values.length; i++)
            if (!(values[i] > values[i - 1])) ctx.addIssue({ code: 'custom', path: [i], message: 'rpm points must be in increasing order' });
        }),
    }),
    z
      .strictObject({
        kind: z.literal('range'),
        min: rpm('min'),
        max: rpm('max'),
        step: num('step').gt(0, 'step must be above 0 rpm').max(30_000, 'step must be at most 30 000 rpm'),
      })
      .superRefine((r, ctx) => {
        if (!(r.max >= r.min)) ctx.addIssue({ code: 'custom', path: ['max'], message: 'max must be at least min' });
        else if (rpmPointCount(r) > MAX_RPM_POINTS)
          ctx.addIssue({ code: 'custom', path: ['step'], message: `the range gives more than ${MAX_RPM_POINTS} points; use a larger step` });
      }),
  ],
  { error: 'rpm kind must be list or range' },
);
export type RpmPoints = z.output<typeof rpmPointsSchema>;

/** How many points an rpm range or list gives (for validation before generating them). */
export function rpmPointCount(points: RpmPoints): number {
  if (points.kind === 'list') return points.values.length;
  return Math.floor((points.max - points.min) / points.step + 1e-9) + 1;
}
