import { Router } from 'express';
import { HttpError } from '../http/errors';

// Placeholder until the matching engine lands: POST /api/compute.
export function computeRouter(): Router {
  const router = Router();
  router.post('/', () => {
    throw new HttpError(501, 'not_implemented', 'The compute endpoint is not available yet.');
  });
  return router;
}
