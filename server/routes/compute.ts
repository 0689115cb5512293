import { Router } from 'express';
import { rateLimit } from 'express-rate-limit';
import { ComputeError, runComputeRequest } from '../../shared/matching/run-compute';
import { computeRequestSchema } from '../../shared/schemas/compute';
import { HttpError, parseOr400 } from '../http/errors';

/**
 * POST /api/compute: the compute contract, open without sign-in. Rate-limited per client here;
 * the body size is limited by the app's JSON parser (1 MB).
 */
export function computeRouter({ rateLimitPerMinute = 300 }: { rateLimitPerMinute?: number } = {}): Router {
  const router = Router();
  router.use(
    rateLimit({
      windowMs: 60_000,
      limit: rateLimitPerMinute,
      standardHeaders: 'draft-8',
      legacyHeaders: false,
      handler: (_req, _res, next) => next(new HttpError(429, 'rate_limited', 'Too many compute requests; try again in a minute.')),
    }),
  );
  router.post('/', (req, res) => {
    const input = parseOr400(computeRequestSchema, req.body ?? {}, 'compute request');
    try {
      res.json(runComputeRequest(input));
    } catch (err) {
      // A point the schema let through but with no physical state: still the client's input.
      if (err instanceof ComputeError) throw new HttpError(400, 'invalid_input', `Invalid compute request: ${err.message}`);
      throw err;
    }
  });
  return router;
}
