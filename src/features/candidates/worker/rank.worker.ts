/// <reference lib="webworker" />
/** The Candidates ranking off the main thread: the page stays responsive and shows progress. */
import { mapModelCache } from '#shared/study/run';
import type { RankMessage, RankRequest } from './protocol';
import { rankInSteps } from './rank';

// Models are kept while the worker lives, so a second ranking (another order, a new plan) reuses them.
const cache = mapModelCache();
const post = (message: RankMessage) => (self as unknown as DedicatedWorkerGlobalScope).postMessage(message);

self.onmessage = (event: MessageEvent<RankRequest>) => {
  const request = event.data;
  let last = 0;
  try {
    const result = rankInSteps(
      request,
      (done, total) => {
        // Progress at most every 50 ms (and at the end), so messages never outnumber the maps' work.
        const now = performance.now();
        if (done === total || now - last > 50) {
          last = now;
          post({ id: request.id, type: 'progress', done, total });
        }
      },
      cache,
    );
    post({ id: request.id, type: 'done', ...result });
  } catch (err) {
    post({ id: request.id, type: 'error', message: err instanceof Error ? err.message : String(err) });
  }
};
