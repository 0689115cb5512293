import { useEffect, useRef, useState } from 'react';
import type { CompressorCandidate, TurbineCandidate } from '#shared/candidates';
import type { RankMessage, RankRequest } from './worker/protocol';

type RankInput = RankRequest extends infer R ? (R extends RankRequest ? Omit<R, 'id'> : never) : never;

export interface RankingState {
  status: 'idle' | 'running' | 'done' | 'error';
  done: number;
  total: number;
  compressors: CompressorCandidate[];
  turbines: TurbineCandidate[];
  error: string | null;
}

const IDLE: RankingState = { status: 'idle', done: 0, total: 0, compressors: [], turbines: [], error: null };

/**
 * Runs the ranking in a Web Worker whenever `input` changes (null: nothing to rank yet), with its
 * progress. One worker per page; an answer to an older request is ignored.
 */
export function useRanking(input: RankInput | null): RankingState {
  const [state, setState] = useState<RankingState>(IDLE);
  const worker = useRef<Worker | null>(null);
  const latest = useRef(0);

  useEffect(() => {
    const w = new Worker(new URL('./worker/rank.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    w.onmessage = (event: MessageEvent<RankMessage>) => {
      const m = event.data;
      if (m.id !== latest.current) return;
      if (m.type === 'progress') setState((s) => ({ ...s, done: m.done, total: m.total }));
      else if (m.type === 'done') setState((s) => ({ ...s, status: 'done', compressors: m.compressors, turbines: m.turbines, error: null }));
      else setState((s) => ({ ...s, status: 'error', error: m.message }));
    };
    w.onerror = (event) => setState((s) => ({ ...s, status: 'error', error: event.message || 'The ranking stopped.' }));
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  useEffect(() => {
    if (!input || !worker.current) return;
    const id = latest.current + 1;
    latest.current = id;
    setState({ ...IDLE, status: 'running', total: input.maps.length });
    worker.current.postMessage({ ...input, id } as RankRequest);
  }, [input]);

  return state;
}
