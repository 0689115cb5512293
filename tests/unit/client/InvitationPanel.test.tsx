import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { InvitationPreview, Me } from '#shared/schemas/account';
import { invitationQueryOptions } from '#src/features/team/api/get-invitation';
import { InvitationPanel } from '#src/features/team/components/InvitationPanel';
import { meQueryOptions } from '#src/lib/session';

// Rendered from data already in the query cache; no request may leave the test.
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

const preview: InvitationPreview = {
  teamName: 'Harrow Hill Motorsport',
  role: 'editor',
  email: 'rider@example.test',
  invitedBy: 'Dana Whitlock',
  expiresAt: '2025-01-10T10:00:00Z',
};

function renderPanel(me: Me | null) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  queryClient.setQueryData(meQueryOptions().queryKey, me);
  queryClient.setQueryData(invitationQueryOptions('tok-1234567890').queryKey, preview);
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>
        <InvitationPanel
          token="tok-1234567890"
          signedOutActions={(email) => <p>forms for {email}</p>}
          signOutButton={<button type="button">Sign out</button>}
          onAccepted={() => undefined}
        />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

function user(email: string): Me {
  return { user: { id: 'u9', email, name: 'Rory', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor: false }, teams: [] };
}

describe('invitation page', () => {
  it('shows team, role and invited address, and offers the sign-up and sign-in forms for that address when signed out', () => {
    renderPanel(null);
    expect(screen.getByRole('heading', { level: 1, name: 'Join Harrow Hill Motorsport' })).toBeTruthy();
    expect(screen.getByText('Editor')).toBeTruthy();
    expect(screen.getByText('forms for rider@example.test')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /join/i })).toBeNull();
  });

  it('offers to join when signed in with the invited address (case aside)', () => {
    renderPanel(user('Rider@Example.test'));
    expect(screen.getByRole('button', { name: 'Join Harrow Hill Motorsport' })).toBeTruthy();
    expect(screen.queryByText(/forms for/)).toBeNull();
  });

  it('says plainly when signed in as someone else, with a way to sign out and no join button', () => {
    renderPanel(user('other@example.test'));
    expect(screen.getByRole('heading', { name: 'Signed in with another address' })).toBeTruthy();
    expect(screen.getByText('other@example.test')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Sign out' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: /join/i })).toBeNull();
  });
});
