import { z } from 'zod';

/** The error body every API failure answers with. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.unknown().optional(),
  }),
});

/** Field issues as the server reports them in `error.details.issues`. */
export const fieldIssuesSchema = z.object({
  issues: z.array(z.object({ path: z.string(), message: z.string() })),
});

export const idSchema = z.string().min(1).max(64);
