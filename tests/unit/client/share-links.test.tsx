import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { json, recordFetch, type RecordedRequest } from './fetch-recorder';
import type { Me, Role } from '#shared/schemas/account';
import { shareLinksQueryOptions, type ShareLink } from '#src/features/studies/api/get-share-links';
import { SharePanel } from '#src/features/studies/components/workspace/SharePanel';
import { meQueryOptions } from '#src/lib/session';

// The share links of a study: the expiry choice when making one, and for owners the choice to
// keep a link working after its maker leaves. The list comes from the query cache; fetch records
// the requests these tests check and answers as docs/api.md says the server does.
let requests: RecordedRequest[] = [];
beforeEach(() => {
  // Keeping answers as the server does; refetches after a change stay pending (the list shown is the cached one).
  requests = recordFetch(({ method, body }) => (method === 'PUT' ? json(200, { kept: (body as { kept: boolean }).kept }) : null));
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const inAMonth = new Date(Date.now() + 30 * 86_400_000).toISOString();
const links: ShareLink[] = [
  { id: 'l1', createdAt: '2025-03-01T10:00:00Z', createdBy: 'Rafael', expiresAt: inAMonth, revokedAt: null, kept: false },
  { id: 'l2', createdAt: '2025-03-02T10:00:00Z', createdBy: 'Mei', expiresAt: null, revokedAt: null, kept: true },
  { id: 'l3', createdAt: '2025-02-01T10:00:00Z', createdBy: 'Rafael', expiresAt: inAMonth, revokedAt: '2025-02-02T10:00:00Z', kept: false },
];

function renderPanel(role: Role) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  const me: Me = {
    user: { id: 'u1', email: 'ada@example.test', name: 'Ada', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor: false },
    teams: [{ id: 't1', name: 'Hill-climb build', personal: false, role }],
  };
  queryClient.setQueryData(meQueryOptions().queryKey, me);
  queryClient.setQueryData(shareLinksQueryOptions('t1', 's1').queryKey, links);
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>
        <SharePanel teamId="t1" studyId="s1" />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const rows = () => screen.getAllByTestId('share-link');
const made = () => requests.filter((r) => r.method === 'POST');

describe('keeping a share link when its maker leaves', () => {
  it('gives an owner a switch on each active link, showing whether it is kept', () => {
    renderPanel('owner');
    const [first, second, revoked] = rows();
    expect(within(first).getByRole('switch', { name: 'Keep when its maker leaves' }).getAttribute('aria-checked')).toBe('false');
    expect(within(first).getByText('Stops if Rafael leaves the team.')).toBeTruthy();
    expect(within(second).getByRole('switch', { name: 'Keep when its maker leaves' }).getAttribute('aria-checked')).toBe('true');
    expect(within(second).getByText('Goes on working if Mei leaves the team.')).toBeTruthy();
    // A revoked link is over: nothing to keep.
    expect(within(revoked).queryByRole('switch')).toBeNull();
  });

  it("sends the owner's choice for that link alone", async () => {
    renderPanel('owner');
    fireEvent.click(within(rows()[0]).getByRole('switch', { name: 'Keep when its maker leaves' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PUT')).toEqual({ method: 'PUT', url: '/api/teams/t1/studies/s1/share-links/l1/kept', body: { kept: true } }),
    );
    // Until the list is read again, that switch shows where it is going and the others wait.
    expect(within(rows()[0]).getByRole('switch').getAttribute('aria-checked')).toBe('true');
    expect((within(rows()[1]).getByRole('switch') as HTMLButtonElement).disabled).toBe(true);
  });

  it('lets an owner stop keeping a kept link', async () => {
    renderPanel('owner');
    fireEvent.click(within(rows()[1]).getByRole('switch', { name: 'Keep when its maker leaves' }));
    await waitFor(() =>
      expect(requests.find((r) => r.method === 'PUT')).toEqual({ method: 'PUT', url: '/api/teams/t1/studies/s1/share-links/l2/kept', body: { kept: false } }),
    );
  });

  it('shows an editor the state in words, with no switch', () => {
    renderPanel('editor');
    expect(screen.queryByRole('switch')).toBeNull();
    expect(rows()[0].textContent).toContain('stops if its maker leaves the team');
    expect(rows()[1].textContent).toContain('an owner keeps it if its maker leaves the team');
  });
});

describe('how long a new share link works', () => {
  it('asks for 30 days when the days are left empty, as the hint says', async () => {
    renderPanel('editor');
    expect(screen.getByLabelText('Expires after (days)').getAttribute('placeholder')).toBe('30');
    expect(screen.getByText(/Left empty, a link works for 30 days/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Make a share link' }));
    // 30 days: the default of createShareLinkSchema and docs/api.md.
    await waitFor(() => expect(made()).toEqual([{ method: 'POST', url: '/api/teams/t1/studies/s1/share-links', body: { expiresInDays: 30 } }]));
  });

  it('asks for the days given, or for never', async () => {
    renderPanel('editor');
    fireEvent.change(screen.getByLabelText('Expires after (days)'), { target: { value: '7' } });
    fireEvent.click(screen.getByRole('button', { name: 'Make a share link' }));
    await waitFor(() => expect(made().at(-1)?.body).toEqual({ expiresInDays: 7 }));
    cleanup();
    renderPanel('editor');
    fireEvent.click(screen.getByLabelText('Never expires'));
    expect((screen.getByLabelText('Expires after (days)') as HTMLInputElement).disabled).toBe(true);
    fireEvent.click(screen.getByRole('button', { name: 'Make a share link' }));
    await waitFor(() => expect(made().at(-1)?.body).toEqual({ expiresInDays: null }));
  });

  it('refuses days that are not a whole number from 1 to 365, and sends nothing', async () => {
    renderPanel('editor');
    for (const value of ['0', '366', '2.5', 'ten']) {
      fireEvent.change(screen.getByLabelText('Expires after (days)'), { target: { value } });
      fireEvent.click(screen.getByRole('button', { name: 'Make a share link' }));
      expect((await screen.findByRole('alert')).textContent).toContain('Days must be a whole number from 1 to 365');
    }
    expect(made()).toEqual([]);
  });
});
