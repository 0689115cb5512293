import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, cleanup, render, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Me } from '#shared/schemas/account';
import { endSession, meQueryOptions, startSession, useMe } from '#src/lib/session';

// Sessions change under mounted screens (the sign-in page's guard watches `me`); these check
// that the watchers see the change. No request may leave: the cache is seeded directly.
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

function Who() {
  const me = useMe();
  return <p>{me.data ? `signed in as ${me.data.user.email}` : 'signed out'}</p>;
}

const demo: Me = {
  user: { id: 'u1', email: 'demo@spoolbook.test', name: 'Demo', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor: false },
  teams: [],
};

function renderWho(queryClient: QueryClient) {
  render(
    <QueryClientProvider client={queryClient}>
      <Who />
    </QueryClientProvider>,
  );
}

describe('session changes reach mounted screens', () => {
  it('shows the new user after sign-in while the page stays mounted', async () => {
    const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
    queryClient.setQueryData(meQueryOptions().queryKey, null);
    queryClient.setQueryData(['teams'], []);
    renderWho(queryClient);
    expect(screen.getByText('signed out')).toBeTruthy();
    await act(async () => startSession(queryClient, demo));
    expect(await screen.findByText('signed in as demo@spoolbook.test')).toBeTruthy();
    // What the previous visitor had cached is gone.
    expect(queryClient.getQueryData(['teams'])).toBeUndefined();
  });

  it('shows signed out after the session ends', async () => {
    const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
    queryClient.setQueryData(meQueryOptions().queryKey, demo);
    renderWho(queryClient);
    await act(async () => endSession(queryClient));
    expect(await screen.findByText('signed out')).toBeTruthy();
  });
});
