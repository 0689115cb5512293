import { z } from 'zod';
import {
  COMPRESSOR_CURVE_KINDS,
  EFFICIENCY_SCALES,
  FORMULA_START,
  HOUSINGS,
  MAX_LABEL_LENGTH,
  MAX_MAP_NAME_LENGTH,
  MAX_NOTES_LENGTH,
  SCROLL_FEEDS,
  TURBINE_CURVE_KINDS,
  TURBINE_EFFICIENCY_KINDS,
} from '../maps/format';
import type { SpoolbookMap } from '../maps/types';
import { readUnit, type MapQuantity } from '../maps/units';

// ---------------------------------------------------------------------------------------------
// What the map library API accepts about a map besides its file: its name and notes.

/** A map's name: what the library lists; refused when a spreadsheet would run it as a formula. */
export const mapNameSchema = z
  .string()
  .trim()
  .min(1, 'is required')
  .max(MAX_MAP_NAME_LENGTH, `must be at most ${MAX_MAP_NAME_LENGTH} characters`)
  .refine((name) => !/[\u0000-\u001f\u007f]/.test(name), 'must be one line of text')
  .refine((name) => !FORMULA_START.test(name), 'must not start with =, +, -, @ or a tab (a spreadsheet would run it as a formula)');

/** Free-text notes; each line becomes a `# note:` line when the map file is written. */
export const mapNotesSchema = z
  .string()
  .max(MAX_NOTES_LENGTH, `must be at most ${MAX_NOTES_LENGTH} characters`)
  .refine((notes) => !/[\u0000-\u0009\u000b-\u001f\u007f]/.test(notes.replace(/\r\n/g, '\n')), 'must be plain text (line breaks are fine)');

/** Name and notes, both required (creating). */
export const mapMetadataSchema = z.strictObject({ name: mapNameSchema, notes: mapNotesSchema });

/** Name and/or notes (editing). */
export const mapMetadataUpdateSchema = z
  .strictObject({ name: mapNameSchema.optional(), notes: mapNotesSchema.optional() })
  .refine((v) => v.name !== undefined || v.notes !== undefined, 'give a name or notes to change');

// ---------------------------------------------------------------------------------------------
// The parsed map as JSON (shared/maps/types.ts), so that the server can store it as jsonb and the
// client can trust what it reads back. SI units throughout; see the model's doc comments.

const positive = z.number().positive();
const efficiency = z.number().gt(0, 'must be above 0').lte(1, 'must be at most 1 (a fraction)');
const label = z
  .string()
  .max(MAX_LABEL_LENGTH)
  .refine((text) => !FORMULA_START.test(text), 'must not start with =, +, -, @ or a tab');

function unitText(kind: MapQuantity) {
  return z
    .string()
    .min(1)
    .max(40)
    .superRefine((text, ctx) => {
      const reading = readUnit(text, kind);
      if (!reading.ok) ctx.addIssue({ code: 'custom', message: reading.message });
    });
}

export const mapReferenceSchema = z.strictObject({
  /** K */
  temperature: positive,
  /** Pa absolute */
  pressure: positive,
});

export const compressorMapPointSchema = z.strictObject({
  correctedMassFlow: positive,
  pressureRatio: z.number().min(1),
  efficiency: efficiency.nullable(),
  speed: positive.nullable(),
});

export const compressorCurveSchema = z.strictObject({
  kind: z.enum(COMPRESSOR_CURVE_KINDS),
  label,
  points: z.array(compressorMapPointSchema).min(2),
});

export const compressorFileUnitsSchema = z
  .strictObject({
    flowAxis: z.enum(['corrected-mass', 'volume']),
    flowUnit: z.string().min(1).max(40),
    referenceTemperatureUnit: unitText('temperature'),
    referencePressureUnit: unitText('pressure'),
    efficiency: z.enum(EFFICIENCY_SCALES),
    speedUnit: unitText('speed'),
    maxSpeedUnit: unitText('speed'),
  })
  .superRefine((units, ctx) => {
    const reading = readUnit(units.flowUnit, units.flowAxis === 'volume' ? 'volumeFlow' : 'massFlow');
    if (!reading.ok) ctx.addIssue({ code: 'custom', path: ['flowUnit'], message: reading.message });
  });

export const compressorMapSchema = z
  .strictObject({
    kind: z.literal('compressor'),
    formatVersion: z.literal(1),
    name: z.string().min(1).max(MAX_MAP_NAME_LENGTH),
    notes: z.array(z.string()),
    reference: mapReferenceSchema,
    maxSpeed: positive.nullable(),
    rotorInertia: positive.max(0.01).optional(),
    curves: z.array(compressorCurveSchema).min(4),
    fileUnits: compressorFileUnitsSchema,
    estimate: z.strictObject({ parentId: z.string().min(1).max(80), parentName: z.string().max(MAX_MAP_NAME_LENGTH), rule: z.string().max(500) }).optional(),
  })
  .superRefine((map, ctx) => {
    // What compressorModelFromMap relies on: one surge and one choke line with PR rising, and at
    // least two speed lines whose points carry their speed with flow rising.
    for (const kind of ['surge', 'choke'] as const) {
      const lines = map.curves.filter((c) => c.kind === kind);
      if (lines.length !== 1) ctx.addIssue({ code: 'custom', path: ['curves'], message: `needs exactly one ${kind} line (found ${lines.length})` });
      for (const line of lines) {
        if (line.points.some((p, i) => i > 0 && !(p.pressureRatio > line.points[i - 1].pressureRatio))) {
          ctx.addIssue({ code: 'custom', path: ['curves'], message: `the ${kind} line's pressure ratio must rise from point to point` });
        }
      }
    }
    const speedLines = map.curves.filter((c) => c.kind === 'speed');
    if (speedLines.length < 2) ctx.addIssue({ code: 'custom', path: ['curves'], message: 'needs at least two speed lines' });
    for (const line of speedLines) {
      if (line.points.some((p) => p.speed === null || p.speed !== line.points[0].speed)) {
        ctx.addIssue({ code: 'custom', path: ['curves'], message: `speed line "${line.label}" must give one speed on every point` });
      }
      if (line.points.some((p, i) => i > 0 && !(p.correctedMassFlow > line.points[i - 1].correctedMassFlow))) {
        ctx.addIssue({ code: 'custom', path: ['curves'], message: `speed line "${line.label}" must have its flow rising from point to point` });
      }
    }
  });

export const turbineMapPointSchema = z.strictObject({
  expansionRatio: z.number().min(1),
  /** kg·K^0.5/(s·Pa) */
  flowParameter: z.number().min(0),
  efficiency: efficiency.nullable(),
  speed: positive.nullable(),
});

export const turbineCurveSchema = z.strictObject({
  kind: z.enum(TURBINE_CURVE_KINDS),
  label,
  points: z.array(turbineMapPointSchema).min(2),
});

export const turbineFileUnitsSchema = z.strictObject({
  flowParameterUnit: unitText('flowParameter'),
  efficiency: z.enum(EFFICIENCY_SCALES),
  speedUnit: unitText('speed'),
});

export const turbineMapSchema = z
  .strictObject({
    kind: z.literal('turbine'),
    formatVersion: z.literal(1),
    name: z.string().min(1).max(MAX_MAP_NAME_LENGTH),
    notes: z.array(z.string()),
    housing: z.enum(HOUSINGS),
    scrollFeed: z.enum(SCROLL_FEEDS).nullable(),
    areaRatio: positive.nullable(),
    efficiencyKind: z.enum(TURBINE_EFFICIENCY_KINDS).optional(),
    curves: z.array(turbineCurveSchema).min(1),
    fileUnits: turbineFileUnitsSchema,
  })
  .superRefine((map, ctx) => {
    if ((map.housing === 'divided') !== (map.scrollFeed !== null)) {
      ctx.addIssue({ code: 'custom', path: ['scrollFeed'], message: 'is given for a divided housing and only for one' });
    }
  });

/** A parsed Spoolbook map as stored and sent: compressor or turbine. */
export const spoolbookMapSchema = z.discriminatedUnion('kind', [compressorMapSchema, turbineMapSchema]);

// The schema and the hand-written model must describe the same thing; this fails to compile if they drift.
type Same<A, B> = (<T>() => T extends A ? 1 : 2) extends <T>() => T extends B ? 1 : 2 ? true : false;
type Assert<T extends true> = T;
/** @public A check for the compiler, used by nothing else. */
export type SpoolbookMapSchemaMatchesModel = Assert<Same<z.infer<typeof spoolbookMapSchema>, SpoolbookMap>>;
