import { Router } from 'express';
import { ComputeError, runComputeRequest } from '#shared/compute/run';
import { computeRequestSchema } from '#shared/schemas/compute';
import { clientAddress } from '../auth/session';
import { HttpError, parseOr400 } from '../http/errors';
import type { AppDeps } from '../app-deps';

/**
 * POST /api/compute: the compute contract, open without sign-in. Rate-limited per client address
 * (counted in PostgreSQL, so across instances); the body size is limited by the app's JSON parser (1 MB).
 */
export function computeRouter({ limits }: AppDeps): Router {
  const router = Router();
  router.post('/', async (req, res) => {
    await limits.computeByAddress.take(clientAddress(req));
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
