import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { json, recordFetch, type RecordedRequest } from './fetch-recorder';
import type { AdminUser, Me } from '#shared/schemas/account';
import { usersQueryOptions } from '#src/features/admin/api/get-users';
import { UsersTable } from '#src/features/admin/components/UsersTable';
import { meQueryOptions } from '#src/lib/session';

// The site admin's Users page. The first list comes from the query cache; fetch records the
// requests these tests check and answers as docs/api.md says the server does.
const users: AdminUser[] = [
  {
    id: 'u1',
    email: 'admin@example.test',
    name: 'Ada Admin',
    isAdmin: true,
    twoFactor: true,
    emailConfirmed: true,
    sessions: 1,
    lastSeenAt: '2025-03-01T10:00:00Z',
  },
  {
    id: 'u2',
    email: 'dana@example.test',
    name: 'Dana',
    isAdmin: false,
    twoFactor: false,
    emailConfirmed: true,
    sessions: 2,
    lastSeenAt: '2025-03-02T10:00:00Z',
  },
  { id: 'u3', email: 'new@example.test', name: 'Noor', isAdmin: false, twoFactor: false, emailConfirmed: false, sessions: 0, lastSeenAt: null },
];

let requests: RecordedRequest[] = [];
beforeEach(() => {
  requests = recordFetch(({ method, url }) =>
    json(200, method === 'POST' ? { ended: 2 } : { users: users.filter((u) => u.email.includes(new URL(url, 'http://x').searchParams.get('q') ?? '')) }),
  );
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function renderUsers() {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  const me: Me = {
    user: { id: 'u1', email: 'admin@example.test', name: 'Ada Admin', isAdmin: true, unitSystem: 'si', emailConfirmed: true, twoFactor: true },
    teams: [],
  };
  queryClient.setQueryData(meQueryOptions().queryKey, me);
  queryClient.setQueryData(usersQueryOptions('').queryKey, users);
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>
        <UsersTable />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const row = (name: string) => screen.getByRole('rowheader', { name: new RegExp(`^${name}`) }).closest('tr')!;

describe('the Users page of the site admin', () => {
  it('lists each user with address, second factor, live sessions and when one was last used', () => {
    renderUsers();
    expect(screen.getByRole('table', { name: '3 users' })).toBeTruthy();
    const dana = row('Dana');
    expect(within(dana).getByText('dana@example.test')).toBeTruthy();
    expect(within(dana).getByText('Confirmed')).toBeTruthy();
    expect(within(dana).getByText('Off')).toBeTruthy();
    expect(within(dana).getByText('2')).toBeTruthy();
    expect(within(dana).getByRole('time').getAttribute('dateTime')).toBe('2025-03-02T10:00:00Z');
    const admin = row('Ada Admin');
    expect(within(admin).getByText('site admin')).toBeTruthy();
    expect(within(admin).getByText('you')).toBeTruthy();
    expect(within(admin).getByText('On')).toBeTruthy();
    const noor = row('Noor');
    expect(within(noor).getByText('Not confirmed')).toBeTruthy();
    // Nothing to end for a user signed in nowhere.
    expect((within(noor).getByRole('button', { name: 'End all sessions of Noor' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('searches by what is typed, once typing pauses', async () => {
    renderUsers();
    fireEvent.change(screen.getByLabelText('Search by name or e-mail'), { target: { value: ' dana ' } });
    await waitFor(() => expect(requests).toEqual([{ method: 'GET', url: '/api/admin/users?q=dana', body: undefined }]));
    expect(await screen.findByRole('table', { name: '1 user matching “dana”' })).toBeTruthy();
  });

  it('asks before ending every session of a user, then says how many ended', async () => {
    renderUsers();
    fireEvent.click(screen.getByRole('button', { name: 'End all sessions of Dana' }));
    const dialog = screen.getByRole('dialog', { name: 'End every session of Dana?' });
    expect(dialog.textContent).toContain('Dana (dana@example.test) is signed out at once in every browser: 2 sessions.');
    expect(requests.filter((r) => r.method === 'POST')).toEqual([]);
    fireEvent.click(within(dialog).getByRole('button', { name: 'End all sessions' }));
    expect(await screen.findByText('Dana is signed out everywhere')).toBeTruthy();
    expect(screen.getByText('2 sessions ended.')).toBeTruthy();
    expect(requests.filter((r) => r.method === 'POST')).toEqual([{ method: 'POST', url: '/api/admin/users/u2/end-sessions', body: {} }]);
  });

  it('warns an admin ending their own sessions that they will be signed out too', () => {
    renderUsers();
    fireEvent.click(screen.getByRole('button', { name: 'End all sessions of Ada Admin' }));
    expect(screen.getByRole('dialog').textContent).toContain('This includes the session you are using: you will be signed out.');
  });

  it('keeps a user who cancels signed in', () => {
    renderUsers();
    fireEvent.click(screen.getByRole('button', { name: 'End all sessions of Dana' }));
    fireEvent.click(screen.getByRole('button', { name: 'Keep them' }));
    expect(screen.queryByRole('dialog')).toBeNull();
    expect(requests).toEqual([]);
  });
});
