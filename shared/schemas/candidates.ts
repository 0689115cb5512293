/** Requests of the Candidates API (candidates.csv) and of making a family member of a map. */
import { z } from 'zod';
import { mapNameSchema } from './map';

const compressorOrderSchema = z.enum(['smallest', 'surge-margin', 'efficiency', 'outlet-temperature'], {
  error: 'order must be smallest, surge-margin, efficiency or outlet-temperature',
});

/** `?kind=compressor` (default; `order` optional) or `?kind=turbine&compressorMapId=…`; `planId` names the template plan. */
export const candidatesQuerySchema = z
  .strictObject({
    kind: z.enum(['compressor', 'turbine'], { error: 'kind must be compressor or turbine' }).default('compressor'),
    compressorMapId: z.string().min(1, 'compressorMapId must not be empty').max(80, 'compressorMapId must be at most 80 characters').optional(),
    order: compressorOrderSchema.optional(),
    planId: z.string().min(1).max(64, 'planId must be at most 64 characters').optional(),
  })
  .superRefine((q, ctx) => {
    if (q.kind === 'turbine' && !q.compressorMapId)
      ctx.addIssue({
        code: 'custom',
        path: ['compressorMapId'],
        message: 'is required with kind=turbine: the compressor the turbine housings are judged with',
      });
    if (q.kind === 'compressor' && q.compressorMapId) ctx.addIssue({ code: 'custom', path: ['compressorMapId'], message: 'applies only to kind=turbine' });
    if (q.kind === 'turbine' && q.order) ctx.addIssue({ code: 'custom', path: ['order'], message: 'applies only to kind=compressor' });
  });

/** `?kind=` of the library maps the Candidates view ranks. */
export const candidateMapsQuerySchema = z.strictObject({ kind: z.enum(['compressor', 'turbine'], { error: 'kind must be compressor or turbine' }) });

/** A new map from a compressor map by a family rule (shared/maps/family/similarity.ts). */
export const familyRequestSchema = z.strictObject({
  name: mapNameSchema,
  rule: z.discriminatedUnion(
    'kind',
    [
      z.strictObject({
        kind: z.literal('diameter'),
        diameterRatio: z.number({ error: 'diameterRatio must be a number (new diameter over the parent’s)' }),
        sizeEffect: z.boolean({ error: 'sizeEffect must be true or false' }).default(false),
      }),
      z.strictObject({
        kind: z.literal('trim'),
        parentTrim: z.number({ error: 'parentTrim must be a number (percent)' }),
        trim: z.number({ error: 'trim must be a number (percent)' }),
      }),
    ],
    { error: 'rule.kind must be diameter or trim' },
  ),
});
