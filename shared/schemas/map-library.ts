import { z } from 'zod';
import { mapMetadataUpdateSchema, mapNameSchema, mapNotesSchema } from './map';

// Requests of the map library API (the map file itself is validated by shared/maps; the name and
// notes rules are those of shared/schemas/map.ts).

export { mapNameSchema, mapNotesSchema };

export const uploadMapFieldsSchema = z.strictObject({
  name: mapNameSchema.optional(),
  notes: mapNotesSchema.optional(),
});

export const updateMapSchema = mapMetadataUpdateSchema;

export const mapKindQuerySchema = z.strictObject({ kind: z.enum(['compressor', 'turbine']).optional() });
