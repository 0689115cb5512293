import { z } from 'zod';

// Requests of the map library API (the map file itself is validated by shared/maps).

export const mapNameSchema = z.string().trim().min(1, 'is required').max(120, 'must be at most 120 characters');
export const mapNotesSchema = z.string().max(5000, 'must be at most 5000 characters');

export const uploadMapFieldsSchema = z.strictObject({
  name: mapNameSchema.optional(),
  notes: mapNotesSchema.optional(),
});

export const updateMapSchema = z
  .strictObject({ name: mapNameSchema.optional(), notes: mapNotesSchema.optional() })
  .refine((v) => v.name !== undefined || v.notes !== undefined, 'give a name or notes to change');

export const mapKindQuerySchema = z.strictObject({ kind: z.enum(['compressor', 'turbine']).optional() });
