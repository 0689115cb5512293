import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { MemoryRouter } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Me, Role } from '#shared/schemas/account';
import { parseMapFile } from '#shared/maps/parse';
import { mapQueryOptions } from '#src/features/maps/api/get-map';
import { mapsQueryOptions } from '#src/features/maps/api/get-maps';
import type { MapDetail, MapSummary } from '#src/features/maps/api/schemas';
import { MapLibrary } from '#src/features/maps/components/MapLibrary';
import { MapProblemList } from '#src/features/maps/components/MapProblemList';
import { MapUpload } from '#src/features/maps/components/MapUpload';
import { MapView } from '#src/features/maps/components/MapView';
import { meQueryOptions } from '#src/lib/session';

// plotly.js does not run under jsdom: the lazy plot is replaced by a marker. The screens are
// rendered from data already in the query cache; no request may leave these tests.
vi.mock('#src/components/plots/Plot', () => ({
  Plot: ({ height }: { height: number }) => <div data-testid="plot" style={{ height }} />,
  PlotPlaceholder: () => null,
  loadPlotly: () => Promise.reject(new Error('plotly is not loaded in unit tests')),
}));

beforeEach(() => {
  vi.stubGlobal(
    'fetch',
    vi.fn(() => Promise.reject(new Error('no request is expected in this test'))),
  );
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const root = path.resolve(import.meta.dirname, '..', '..', '..');

function fileFrom(relative: string): File {
  const bytes = readFileSync(path.join(root, relative));
  return new File([bytes], path.basename(relative), { type: 'text/csv' });
}

function renderWith(ui: React.ReactNode, role: Role = 'owner') {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  const me: Me = {
    user: { id: 'u1', email: 'ada@example.test', name: 'Ada', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor: false },
    teams: [{ id: 't1', name: 'Hill-climb build', personal: false, role }],
  };
  queryClient.setQueryData(meQueryOptions().queryKey, me);
  const maps: MapSummary[] = [
    {
      id: 'm1',
      kind: 'compressor',
      name: 'Workshop wheel',
      notes: '',
      builtin: false,
      createdBy: 'Ada',
      updatedAt: '2025-03-01T10:00:00Z',
      summary: { curves: 15, topSpeed: 135_000, maxSpeed: 135_000, housing: null, areaRatio: null },
    },
    {
      id: 'builtin-turbine-t64',
      kind: 'turbine',
      name: 'Demo turbine',
      notes: '',
      builtin: true,
      createdBy: null,
      updatedAt: null,
      summary: { curves: 4, topSpeed: null, maxSpeed: null, housing: 'divided', areaRatio: 0.64 },
    },
  ];
  queryClient.setQueryData(mapsQueryOptions('t1').queryKey, maps);
  const parsed = parseMapFile(readFileSync(path.join(root, 'data', 'maps', 'compressor-m58.csv'), 'utf8'));
  if (!parsed.ok) throw new Error('the M58 demo map does not read');
  const detail: MapDetail = {
    ...maps[0],
    notes: 'Digitised from the workshop copy.',
    fileName: 'workshop-wheel.csv',
    revision: 2,
    createdAt: '2025-03-01T10:00:00Z',
    map: parsed.map,
  };
  queryClient.setQueryData(mapQueryOptions('t1', 'm1').queryKey, detail);
  queryClient.setQueryData(mapQueryOptions('t1', 'builtin-m58').queryKey, { ...detail, id: 'builtin-m58', builtin: true, createdBy: null, updatedAt: null });
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
}

function choose(file: File) {
  fireEvent.change(screen.getByLabelText('Choose a map file'), { target: { files: [file] } });
}

describe('problem list of a refused map file', () => {
  it('says where each problem is, in words, and quotes the line', () => {
    render(
      <MapProblemList
        title="“x.csv” has 3 problems."
        problems={[
          { code: 'empty-file', line: null, column: null, message: 'the file is empty' },
          { code: 'unknown-key', line: 4, column: null, message: 'unknown key "refrence temperature"' },
          { code: 'decimal-comma', line: 6, column: 3, message: 'write numbers with a decimal point (0.10)' },
        ]}
        lines={[
          '# spoolbook-map: 1',
          '',
          '',
          '# refrence temperature: 298 K',
          'curve,label,flow,pressure_ratio,efficiency,speed',
          'speed,80000,"0,10",1.17,72,80000',
        ]}
      />,
    );
    const items = within(screen.getByRole('list', { name: 'Problems in the file' })).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual([
      'Whole file: the file is empty',
      'Line 4: unknown key "refrence temperature"The line reads: # refrence temperature: 298 K',
      'Line 6, column 3: write numbers with a decimal point (0.10)The line reads: speed,80000,"0,10",1.17,72,80000',
    ]);
  });
});

describe('adding a map', () => {
  it('lists every problem of a broken file by line and column, and offers no save', async () => {
    renderWith(<MapUpload teamId="t1" />);
    choose(fileFrom('tests/fixtures/maps/bad/decimal-comma-quoted.csv'));
    const list = await screen.findByRole('list', { name: 'Problems in the file' });
    // tests/fixtures/maps/bad/expected.json: the one problem of this file.
    expect(within(list).getByRole('listitem').textContent).toContain(
      'Line 17, column 3: flow "0,10" uses a decimal comma; write numbers with a decimal point (0.10)',
    );
    expect(screen.getByRole('heading', { name: '“decimal-comma-quoted.csv” has 1 problem. Nothing was saved.' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save to library' })).toBeNull();
  });

  it('refuses a file over the size limit without reading it', async () => {
    renderWith(<MapUpload teamId="t1" />);
    // 3 MiB of text: over the 2 MiB limit of docs/map-format.md.
    choose(new File([new Uint8Array(3 * 1024 * 1024).fill(0x41)], 'huge.csv', { type: 'text/csv' }));
    const list = await screen.findByRole('list', { name: 'Problems in the file' });
    expect(within(list).getByRole('listitem').textContent).toBe('Whole file: the file is 3.0 MB; the limit is 2.0 MB and 50,000 rows');
  });

  it('previews a good file with its name and notes ready to save', async () => {
    renderWith(<MapUpload teamId="t1" />);
    choose(fileFrom('data/maps/compressor-m58.csv'));
    expect(await screen.findByText('“compressor-m58.csv” reads as a compressor map with no problems.')).toBeTruthy();
    expect(screen.getByTestId('plot')).toBeTruthy();
    // The demo file's islands meet on the surge line: the preview says how those places are read (docs/map-format.md).
    expect(screen.getByText(/^Whole file: \d+ places hold points with different efficiencies \(\d+ rows\); each place is read as one point/)).toBeTruthy();
    expect((screen.getByLabelText('Name') as HTMLInputElement).value).toBe('Spoolbook demo compressor M58');
    expect((screen.getByLabelText('Notes') as HTMLTextAreaElement).value).toContain('Invented for Spoolbook');
    expect(screen.getByRole('button', { name: 'Save to library' })).toBeTruthy();
    // Rated speed from the file's header, 135000 rpm (data/maps/compressor-m58.csv).
    expect(screen.getByText('135 krpm')).toBeTruthy();
  });
});

describe('map library by role', () => {
  it('shows a viewer the maps and no upload at all', () => {
    renderWith(<MapLibrary teamId="t1" />, 'viewer');
    expect(screen.getByRole('link', { name: 'Workshop wheel' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Demo turbine' })).toBeTruthy();
    expect(screen.queryByRole('heading', { name: 'Add a map' })).toBeNull();
    expect(screen.queryByLabelText('Choose a map file')).toBeNull();
  });

  it.each(['editor', 'owner'] as const)('gives an %s the upload', (role) => {
    renderWith(<MapLibrary teamId="t1" />, role);
    expect(screen.getByRole('heading', { name: 'Add a map' })).toBeTruthy();
    expect(screen.getByLabelText('Choose a map file')).toBeTruthy();
  });

  it('filters by kind', () => {
    renderWith(<MapLibrary teamId="t1" />, 'viewer');
    fireEvent.click(screen.getByLabelText('Turbine'));
    expect(screen.queryByRole('link', { name: 'Workshop wheel' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Demo turbine' })).toBeTruthy();
  });
});

describe('one map by role', () => {
  it('shows a viewer the plot, the facts, the notes and the download, and nothing to change', () => {
    renderWith(<MapView teamId="t1" mapId="m1" onDeleted={() => undefined} />, 'viewer');
    expect(screen.getByRole('heading', { level: 1, name: 'Workshop wheel' })).toBeTruthy();
    expect(screen.getByTestId('plot')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Download CSV' }).getAttribute('href')).toBe('/api/teams/t1/maps/m1/file');
    expect(screen.getByText('Digitised from the workshop copy.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save name and notes' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete map' })).toBeNull();
  });

  it('gives an editor the name and notes form and delete', () => {
    renderWith(<MapView teamId="t1" mapId="m1" onDeleted={() => undefined} />, 'editor');
    expect((screen.getByLabelText('Name') as HTMLInputElement).value).toBe('Workshop wheel');
    expect(screen.getByRole('button', { name: 'Save name and notes' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Delete map' })).toBeTruthy();
  });

  it('keeps a built-in demo map read-only even for an owner', () => {
    renderWith(<MapView teamId="t1" mapId="builtin-m58" onDeleted={() => undefined} />, 'owner');
    expect(screen.getByText('Built-in demo map')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save name and notes' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete map' })).toBeNull();
  });
});
