import { readFileSync } from 'node:fs';
import path from 'node:path';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, cleanup, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { json, recordFetch, type RecordedRequest } from './fetch-recorder';
import { parseMapFile } from '#shared/maps/parse';
import { newTraceState } from '#shared/tracer/state';
import { useMapModels, useMaps, useUpdateMap, type MapDetail, type MapSummary } from '#src/features/maps/api';
import { useSaveTraceToLibrary } from '#src/features/tracer/api';

// The study page reads the library through the maps feature's queries (its plan pickers list the
// maps of each kind; its plots and labels load each map it names). A rename on the map's page or
// a map saved from the Tracer must reach those queries, not only the library's own list. `fetch`
// answers as docs/api.md says the server does, with the library as it stands after the change.

const root = path.resolve(import.meta.dirname, '..', '..', '..');
const parsed = parseMapFile(readFileSync(path.join(root, 'data', 'maps', 'compressor-m58.csv'), 'utf8'));
if (!parsed.ok) throw new Error('the M58 demo map does not read');
const m58 = parsed.map;

function summary(id: string, name: string): MapSummary {
  return {
    id,
    kind: 'compressor',
    name,
    notes: '',
    builtin: false,
    createdBy: 'Ada',
    updatedAt: '2025-03-01T10:00:00Z',
    summary: { curves: 15, topSpeed: 135_000, maxSpeed: 135_000, housing: null, areaRatio: null },
  };
}
function detail(id: string, name: string): MapDetail {
  return { ...summary(id, name), fileName: `${id}.csv`, revision: 1, createdAt: '2025-03-01T10:00:00Z', map: { ...m58, name } };
}

/** The library on the server: its list and details answer whatever it holds now. */
let library: MapDetail[] = [];
let requests: RecordedRequest[] = [];
beforeEach(() => {
  library = [detail('m1', 'Workshop wheel')];
  requests = recordFetch(({ method, url, body }) => {
    const [pathname] = url.split('?');
    if (method === 'GET' && pathname === '/api/teams/t1/maps')
      return json(200, { maps: library.map(({ fileName: _f, revision: _r, createdAt: _c, map: _m, ...s }) => s) });
    const one = pathname.match(/^\/api\/teams\/t1\/maps\/([^/]+)$/);
    if (one && method === 'GET') {
      const found = library.find((m) => m.id === one[1]);
      return found ? json(200, { map: found }) : json(404, { error: { code: 'not_found', message: 'No such map.' } });
    }
    if (one && method === 'PATCH') {
      library = library.map((m) => (m.id === one[1] ? { ...m, ...(body as { name: string }), revision: m.revision + 1 } : m));
      return json(200, { map: library.find((m) => m.id === one[1]) });
    }
    if (method === 'POST' && pathname === '/api/teams/t1/tracer/drafts/d1/save') {
      library = [...library, detail('m2', 'Traced wheel')];
      const image = {
        id: 'i1',
        contentType: 'image/png',
        byteSize: 1000,
        width: 800,
        height: 600,
        mapId: 'm2',
        mapName: 'Traced wheel',
        createdAt: '2025-03-01T10:00:00Z',
      };
      const draft = {
        id: 'd1',
        name: 'Traced wheel',
        kind: 'compressor',
        revision: 2,
        image,
        curveCount: 0,
        pointCount: 0,
        createdBy: 'Ada',
        createdAt: '2025-03-01T10:00:00Z',
        updatedAt: '2025-03-01T10:00:00Z',
        state: newTraceState('Traced wheel'),
      };
      return json(200, { map: { id: 'm2', name: 'Traced wheel', kind: 'compressor' }, draft, notes: [] });
    }
    return null;
  });
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** What the study page reads, with the query options it uses (maps kept for the session). */
function renderStudyPageQueries(queryClient: QueryClient) {
  const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
  return renderHook(
    () => ({
      picker: useMaps('t1', 'compressor'),
      models: useMapModels('t1', ['m1']),
      rename: useUpdateMap('t1', 'm1'),
      saveTrace: useSaveTraceToLibrary('t1'),
    }),
    { wrapper },
  );
}

describe('one set of map queries for every screen', () => {
  it('shows a renamed map under its new name in a study’s plan picker and labels', async () => {
    const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    const { result } = renderStudyPageQueries(queryClient);
    await waitFor(() => expect(result.current.models.namesById.m1).toBe('Workshop wheel'));
    await waitFor(() => expect(result.current.picker.data?.map((m) => m.name)).toEqual(['Workshop wheel']));

    await act(() => result.current.rename.mutateAsync({ name: 'Workshop wheel, recut' }));

    await waitFor(() => expect(result.current.models.namesById.m1).toBe('Workshop wheel, recut'));
    await waitFor(() => expect(result.current.picker.data?.map((m) => m.name)).toEqual(['Workshop wheel, recut']));
    // The plan picker asks for its own kind only.
    expect(requests.filter((r) => r.method === 'GET' && r.url.startsWith('/api/teams/t1/maps?')).every((r) => r.url.endsWith('?kind=compressor'))).toBe(true);
  });

  it('offers a map saved from the Tracer in a study’s plan picker at once', async () => {
    const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    const { result } = renderStudyPageQueries(queryClient);
    await waitFor(() => expect(result.current.picker.data?.map((m) => m.id)).toEqual(['m1']));

    await act(() => result.current.saveTrace.mutateAsync({ draftId: 'd1', baseRevision: 1, state: newTraceState('Traced wheel') }));

    await waitFor(() => expect(result.current.picker.data?.map((m) => m.name)).toEqual(['Workshop wheel', 'Traced wheel']));
  });
});
