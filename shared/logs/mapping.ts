/**
 * A column mapping: which column of a log is which quantity, in which unit, and for pressures
 * whether absolute or gauge. Kept with the stored log and as a team's named preset.
 */
import { z } from 'zod';
import { unitConverter } from '../units';
import { DEFAULT_GAUGE_REFERENCE, LOG_QUANTITIES, LOG_QUANTITY_INFO, REQUIRED_QUANTITIES, type LogQuantity } from './quantities';

const logColumnMappingSchema = z
  .strictObject({
    /** The column's name as the header gives it (units in brackets included). */
    column: z.string().min(1, 'is required').max(200),
    quantity: z.enum(LOG_QUANTITIES, { error: `must be one of ${LOG_QUANTITIES.join(', ')}` }),
    unit: z.string().min(1, 'is required').max(20),
    /** Pressures only: how the logger reads it. */
    reference: z.enum(['absolute', 'gauge']).optional(),
  })
  .superRefine((c, ctx) => {
    const info = LOG_QUANTITY_INFO[c.quantity];
    if (!info.units.some((u) => u.unit === c.unit))
      ctx.addIssue({
        code: 'custom',
        path: ['unit'],
        message: `"${c.unit}" is not a unit of ${info.label.toLowerCase()}; use one of ${info.units.map((u) => u.unit).join(', ')}`,
      });
    if (c.reference && !info.pressure)
      ctx.addIssue({ code: 'custom', path: ['reference'], message: `applies to pressures only, not ${info.label.toLowerCase()}` });
  });
export type LogColumnMapping = z.output<typeof logColumnMappingSchema>;

export const logMappingSchema = z
  .strictObject({
    columns: z.array(logColumnMappingSchema).min(1, 'map at least one column').max(64),
    /** Barometric pressure a gauge reading is added to when none is logged, Pa absolute. */
    gaugeReference: z.number().min(40_000, 'is in Pa absolute: at least 40 000').max(110_000, 'is in Pa absolute: at most 110 000').optional(),
  })
  .superRefine((m, ctx) => {
    const seen = new Map<LogQuantity, number>();
    const columns = new Set<string>();
    m.columns.forEach((c, i) => {
      const before = seen.get(c.quantity);
      if (before !== undefined)
        ctx.addIssue({
          code: 'custom',
          path: ['columns', i, 'quantity'],
          message: `${LOG_QUANTITY_INFO[c.quantity].label.toLowerCase()} is already mapped to column "${m.columns[before].column}"`,
        });
      else seen.set(c.quantity, i);
      if (columns.has(c.column)) ctx.addIssue({ code: 'custom', path: ['columns', i, 'column'], message: `column "${c.column}" is mapped twice` });
      columns.add(c.column);
    });
    for (const q of REQUIRED_QUANTITIES)
      if (!seen.has(q))
        ctx.addIssue({ code: 'custom', path: ['columns'], message: `map a column as ${LOG_QUANTITY_INFO[q].label.toLowerCase()}: it is required` });
  });
export type LogMapping = z.output<typeof logMappingSchema>;

const TIME_SCALE: Record<string, number> = { s: 1, ms: 1e-3, min: 60 };
const FRACTION_SCALE: Record<string, number> = { percent: 0.01, fraction: 1 };

/** The column's values to SI as a straight line, SI = scale·value + offset (gauge pressures get their reference added later). */
export function columnToSI(quantity: LogQuantity, unit: string): { scale: number; offset: number } {
  const info = LOG_QUANTITY_INFO[quantity];
  if (info.kind === 'time') return { scale: TIME_SCALE[unit] ?? Number.NaN, offset: 0 };
  if (info.kind === 'fraction') return { scale: FRACTION_SCALE[unit] ?? Number.NaN, offset: 0 };
  if (info.kind === 'count') return { scale: 1, offset: 0 };
  const line = unitConverter(unit, info.kind);
  const offset = line.toSI(0);
  return { scale: line.toSI(1) - offset, offset };
}

/** The gauge reference a mapping uses when no barometric pressure column is mapped, Pa. */
export function gaugeReferenceOf(mapping: LogMapping): number {
  return mapping.gaugeReference ?? DEFAULT_GAUGE_REFERENCE;
}
