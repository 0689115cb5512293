import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useLayoutEffect, useRef, useState } from 'react';
import type { DraftDetail } from '#shared/tracer/api';
import type { TraceState } from '#shared/tracer/state';
import { tracerKeys } from '../api/keys';
import { saveDraft, staleDraftOf } from '../api/save-draft';

export type SyncStatus =
  { kind: 'saved' } | { kind: 'pending' } | { kind: 'saving' } | { kind: 'error'; message: string } | { kind: 'conflict'; current: DraftDetail };

/** Quiet time after the last change before the draft is saved, ms. */
export const AUTOSAVE_DELAY_MS = 800;

/**
 * Keeps the server's draft in step with the trace on screen: every change is saved shortly after
 * it is made, as the next revision of the draft. Writes run one after another (an autosave and a
 * save to the library never race for the same revision). When someone else saved the draft in
 * between, saving stops and the conflict is offered to the user to settle.
 */
export function useDraftSync({ teamId, draft, state, enabled }: { teamId: string; draft: DraftDetail; state: TraceState; enabled: boolean }) {
  const queryClient = useQueryClient();
  const revision = useRef(draft.revision);
  const saved = useRef<TraceState>(draft.state);
  // The trace on screen, for the saves started from handlers and timers; written once it is rendered.
  const latest = useRef(state);
  useLayoutEffect(() => {
    latest.current = state;
  }, [state]);
  const chain = useRef<Promise<unknown>>(Promise.resolve());
  const conflicted = useRef(false);
  const [status, setStatus] = useState<SyncStatus>({ kind: 'saved' });

  /** Runs `job` after every write already queued. */
  const exclusive = useCallback(<T>(job: () => Promise<T>): Promise<T> => {
    const run = chain.current.then(job, job);
    chain.current = run.catch(() => undefined);
    return run;
  }, []);

  /** Tells the sync that a write done elsewhere (the save to the library) stored `next` as `newRevision`. */
  const stored = useCallback(
    (next: DraftDetail, sent: TraceState) => {
      revision.current = next.revision;
      saved.current = sent;
      queryClient.setQueryData(tracerKeys.draft(teamId, next.id), { ...next, state: sent });
      setStatus(latest.current === sent ? { kind: 'saved' } : { kind: 'pending' });
    },
    [queryClient, teamId],
  );

  const save = useCallback(
    (sent: TraceState) =>
      exclusive(async () => {
        if (conflicted.current || sent === saved.current) return;
        setStatus({ kind: 'saving' });
        try {
          stored(await saveDraft(teamId, draft.id, { baseRevision: revision.current, state: sent }), sent);
        } catch (error) {
          const current = staleDraftOf(error);
          if (current) {
            conflicted.current = true;
            setStatus({ kind: 'conflict', current });
          } else {
            setStatus({ kind: 'error', message: error instanceof Error ? error.message : 'The trace could not be saved.' });
          }
        }
      }),
    [exclusive, stored, teamId, draft.id],
  );

  useEffect(() => {
    if (!enabled || conflicted.current || state === saved.current) return;
    setStatus((s) => (s.kind === 'saving' ? s : { kind: 'pending' }));
    const timer = window.setTimeout(() => void save(state), AUTOSAVE_DELAY_MS);
    return () => window.clearTimeout(timer);
  }, [enabled, state, save]);

  // Leaving the page (or the app) with changes not yet on the server: save them now, and let the
  // browser ask before a reload or close throws them away.
  useEffect(() => {
    const onBeforeUnload = (event: BeforeUnloadEvent) => {
      if (enabled && latest.current !== saved.current && !conflicted.current) {
        void save(latest.current);
        event.preventDefault();
      }
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => {
      window.removeEventListener('beforeunload', onBeforeUnload);
      if (enabled && latest.current !== saved.current) void save(latest.current);
    };
  }, [enabled, save]);

  /** Settle a conflict by keeping this tab's trace over the newer one. */
  const keepMine = useCallback(() => {
    if (status.kind !== 'conflict') return;
    revision.current = status.current.revision;
    conflicted.current = false;
    saved.current = status.current.state;
    void save(latest.current);
  }, [status, save]);

  /** Settle a conflict by taking the newer trace; the caller replaces the state on screen. */
  const takeTheirs = useCallback((): DraftDetail | null => {
    if (status.kind !== 'conflict') return null;
    revision.current = status.current.revision;
    saved.current = status.current.state;
    conflicted.current = false;
    setStatus({ kind: 'saved' });
    return status.current;
  }, [status]);

  const retry = useCallback(() => void save(latest.current), [save]);

  return { status, exclusive, stored, revision: () => revision.current, keepMine, takeTheirs, retry, flush: () => save(latest.current) };
}
