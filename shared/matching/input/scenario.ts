/** A Scenario: the day's ambient and the boost schedule, one operating line per row. */
import { z } from 'zod';
import { ambientSchema } from './ambient';
import { count, itemId, name, num } from './fields';
import { rpmTableSchema } from './rpm';

const MAX_BOOST_ROWS = 20;

/** Boost target, Pa gauge (manifold pressure over ambient). */
export const boostSchema = num('boost')
  .min(-200_000, 'boost is gauge pressure in Pa: at least −200 000 Pa')
  .max(1_000_000, 'boost is gauge pressure in Pa: at most 1 000 000 Pa');

/** One row of a boost schedule: its own operating line. */
const boostRowSchema = z
  .strictObject({
    /** Stable within its scenario, so history can tell a renamed row from a new one (filled on read where absent). */
    id: itemId('boost row id'),
    label: name('label'),
    kind: z.enum(['full-load', 'gear', 'part-throttle'], { error: 'row kind must be full-load, gear or part-throttle' }),
    /** Gear number when kind is "gear". */
    gear: count('gear', 12).optional(),
    /** Boost target (manifold pressure over ambient, Pa gauge) by rpm. */
    boost: rpmTableSchema(boostSchema, 'boost'),
  })
  .superRefine((row, ctx) => {
    if (row.kind === 'gear' && row.gear === undefined) ctx.addIssue({ code: 'custom', path: ['gear'], message: 'a gear row needs its gear number' });
    if (row.kind !== 'gear' && row.gear !== undefined) ctx.addIssue({ code: 'custom', path: ['gear'], message: 'gear applies only to rows of kind gear' });
  });
export type BoostRowKind = z.output<typeof boostRowSchema>['kind'];

export const scenarioSchema = z.strictObject({
  /** Stable within the study, so history can tell a renamed scenario from a new one (filled on read where absent). */
  id: itemId('scenario id'),
  name: name('scenario name'),
  ambient: ambientSchema,
  boostSchedule: z
    .array(boostRowSchema)
    .min(1, 'a scenario needs at least one boost schedule row')
    .max(MAX_BOOST_ROWS, `at most ${MAX_BOOST_ROWS} boost schedule rows`),
});
