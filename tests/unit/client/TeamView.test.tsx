import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Me, Role, TeamDetail } from '#shared/schemas/account';
import { TeamView } from '#src/features/team/components/TeamView';
import { teamQueryOptions } from '#src/features/team/api/get-team';
import { meQueryOptions } from '#src/lib/session';

// The team page is rendered from data already in the query cache (as after a fetch); no request
// may leave the test, so fetch is made to fail loudly rather than answering for the server.
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

function detail(role: Role): TeamDetail {
  return {
    team: { id: 't1', name: 'Hill-climb build', personal: false, role },
    members: [
      { userId: 'u1', email: 'ada@example.test', name: 'Ada', role, joinedAt: '2025-01-02T10:00:00Z' },
      { userId: 'u2', email: 'ben@example.test', name: 'Ben', role: 'owner', joinedAt: '2025-01-01T10:00:00Z' },
    ],
    invitations:
      role === 'owner'
        ? [{ id: 'i1', email: 'cy@example.test', role: 'viewer', invitedBy: 'Ben', createdAt: '2025-01-03T10:00:00Z', expiresAt: '2025-01-10T10:00:00Z' }]
        : [],
  };
}

function renderTeam(role: Role) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  const me: Me = {
    user: { id: 'u1', email: 'ada@example.test', name: 'Ada', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor: false },
    teams: [detail(role).team],
  };
  queryClient.setQueryData(meQueryOptions().queryKey, me);
  queryClient.setQueryData(teamQueryOptions('t1').queryKey, detail(role));
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>
        <TeamView teamId="t1" onGone={() => undefined} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

describe('team page by role', () => {
  it.each(['viewer', 'editor'] as const)('shows a %s the members and Leave, and no owner controls at all', (role) => {
    renderTeam(role);
    expect(screen.getByRole('heading', { level: 1, name: 'Hill-climb build' })).toBeTruthy();
    const members = screen.getByRole('table', { name: 'Members' });
    expect(within(members).getByText('ben@example.test')).toBeTruthy();
    expect(within(members).queryByRole('combobox')).toBeNull();
    expect(screen.queryByRole('button', { name: /remove/i })).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Invitations' })).toBeNull();
    expect(screen.queryByRole('button', { name: /send invitation/i })).toBeNull();
    expect(screen.queryByRole('button', { name: /rename/i })).toBeNull();
    expect(screen.queryByRole('button', { name: /delete team/i })).toBeNull();
    expect(screen.getByRole('button', { name: 'Leave team' })).toBeTruthy();
  });

  it('gives an owner role pickers, remove, invitations, rename and delete', () => {
    renderTeam('owner');
    expect(screen.getByRole('combobox', { name: 'Role of Ben' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Remove Ben' })).toBeTruthy();
    // Owners leave by handing over and using Leave, never by removing themselves.
    expect(screen.queryByRole('button', { name: 'Remove Ada' })).toBeNull();
    expect(screen.getByRole('button', { name: 'Send invitation' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Resend link to cy@example.test' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Cancel invitation to cy@example.test' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Rename team' })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Delete team' })).toBeTruthy();
  });
});
