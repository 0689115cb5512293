import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import type { ReactNode } from 'react';
import { MemoryRouter } from 'react-router';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { json, recordFetch, type RecordedRequest } from './fetch-recorder';
import { z } from 'zod';
import type { Me, Role, TeamDetail, TeamSummary } from '#shared/schemas/account';
import { SecondFactorBanner } from '#src/components/SecondFactorNotice';
import { MapLibrary } from '#src/features/maps/components/MapLibrary';
import { teamQueryOptions } from '#src/features/team/api/get-team';
import { TeamView } from '#src/features/team/components/TeamView';
import { api } from '#src/lib/api-client';
import { installTwoFactorRuleWatch, meQueryOptions } from '#src/lib/session';

// The team's second-factor rule: the owner's switch, the state every member reads, and what a
// member without a second factor meets instead of the team's data. Screens render from the query
// cache; where a request is part of what is checked, fetch records it (and answers as the API
// reference, docs/api.md, says the server does).
let requests: RecordedRequest[] = [];
let answer: (request: RecordedRequest) => Response | null = () => null;
beforeEach(() => {
  answer = () => null;
  requests = recordFetch((request) => answer(request));
});
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function team(role: Role, requireTwoFactor: boolean): TeamSummary {
  return { id: 't1', name: 'Hill-climb build', personal: false, role, requireTwoFactor };
}

function me(role: Role, { twoFactor, requireTwoFactor }: { twoFactor: boolean; requireTwoFactor: boolean }): Me {
  return {
    user: { id: 'u1', email: 'ada@example.test', name: 'Ada', isAdmin: false, unitSystem: 'si', emailConfirmed: true, twoFactor },
    teams: [team(role, requireTwoFactor)],
  };
}

function detail(role: Role, requireTwoFactor: boolean): TeamDetail {
  return {
    team: team(role, requireTwoFactor),
    members: [
      { userId: 'u1', email: 'ada@example.test', name: 'Ada', role, joinedAt: '2025-01-02T10:00:00Z' },
      { userId: 'u2', email: 'ben@example.test', name: 'Ben', role: 'owner', joinedAt: '2025-01-01T10:00:00Z' },
    ],
    invitations: [],
  };
}

function renderWith(ui: ReactNode, { who, team: cached, at = '/teams/t1' }: { who: Me; team?: TeamDetail; at?: string }) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { staleTime: Infinity, retry: false } } });
  queryClient.setQueryData(meQueryOptions().queryKey, who);
  if (cached) queryClient.setQueryData(teamQueryOptions('t1').queryKey, cached);
  render(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter initialEntries={[at]}>{ui}</MemoryRouter>
    </QueryClientProvider>,
  );
  return queryClient;
}

const teamPage = <TeamView teamId="t1" onGone={() => undefined} />;

describe("the team's second-factor switch", () => {
  it('lets an owner with a second factor ask every member for one, with a plain word on what members without one meet', async () => {
    answer = ({ method }) => (method === 'PUT' ? json(200, { team: team('owner', true) }) : null);
    renderWith(teamPage, { who: me('owner', { twoFactor: true, requireTwoFactor: false }), team: detail('owner', false) });
    const rule = screen.getByRole('switch', { name: 'Members must use a second factor' });
    expect(rule.getAttribute('aria-checked')).toBe('false');
    expect(screen.getByText(/Members without one cannot open the team’s studies, maps or members/)).toBeTruthy();
    fireEvent.click(rule);
    await waitFor(() => expect(requests.find((r) => r.method === 'PUT')).toEqual({ method: 'PUT', url: '/api/teams/t1/two-factor', body: { required: true } }));
    // While the answer comes, the switch shows where it is going.
    expect(screen.getByRole('switch', { name: 'Members must use a second factor' }).getAttribute('aria-checked')).toBe('true');
  });

  it('shows an owner the switch on, and turning it off asks for nothing more', async () => {
    answer = ({ method }) => (method === 'PUT' ? json(200, { team: team('owner', false) }) : null);
    renderWith(teamPage, { who: me('owner', { twoFactor: true, requireTwoFactor: true }), team: detail('owner', true) });
    const rule = screen.getByRole('switch', { name: 'Members must use a second factor' });
    expect(rule.getAttribute('aria-checked')).toBe('true');
    fireEvent.click(rule);
    await waitFor(() => expect(requests.find((r) => r.method === 'PUT')?.body).toEqual({ required: false }));
  });

  it('keeps the switch off for an owner without a second factor and says where to turn theirs on', () => {
    renderWith(teamPage, { who: me('owner', { twoFactor: false, requireTwoFactor: false }), team: detail('owner', false) });
    const rule = screen.getByRole('switch', { name: 'Members must use a second factor' }) as HTMLButtonElement;
    expect(rule.disabled).toBe(true);
    expect(screen.getByText(/Turn on your own second factor first/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'set up a second factor' }).getAttribute('href')).toBe('/settings#second-factor');
  });

  it('shows the error the server gives, and the switch back where it was', async () => {
    answer = ({ method }) =>
      method === 'PUT'
        ? json(400, {
            error: {
              code: 'two_factor_needed',
              message: 'Turn on your own second factor first (Account → Second factor), or you would lock yourself out of this team.',
            },
          })
        : null;
    renderWith(teamPage, { who: me('owner', { twoFactor: true, requireTwoFactor: false }), team: detail('owner', false) });
    fireEvent.click(screen.getByRole('switch', { name: 'Members must use a second factor' }));
    expect((await screen.findByRole('alert')).textContent).toContain('you would lock yourself out of this team');
    expect(screen.getByRole('switch', { name: 'Members must use a second factor' }).getAttribute('aria-checked')).toBe('false');
  });

  it.each(['editor', 'viewer'] as const)('shows a %s which way the rule is set, with no switch', (role) => {
    renderWith(teamPage, { who: me(role, { twoFactor: true, requireTwoFactor: true }), team: detail(role, true) });
    expect(screen.queryByRole('switch')).toBeNull();
    expect(screen.getByTestId('team-two-factor-state').textContent).toContain('This team asks every member to use a second factor');
    cleanup();
    renderWith(teamPage, { who: me(role, { twoFactor: false, requireTwoFactor: false }), team: detail(role, false) });
    expect(screen.getByTestId('team-two-factor-state').textContent).toContain('This team does not ask its members to use a second factor');
  });
});

describe('a member without a second factor in a team that asks for one', () => {
  const refusal = {
    error: {
      code: 'two_factor_required',
      message: 'The team "Hill-climb build" asks its members to use a second factor. Turn it on under Account → Second factor, then come back.',
    },
  };

  it('meets the reason and the way to the set-up on the team page, not "not found", and may still leave', async () => {
    answer = ({ method, url }) => (method === 'GET' && url === '/api/teams/t1' ? json(403, refusal) : null);
    renderWith(
      <>
        <SecondFactorBanner />
        {teamPage}
      </>,
      { who: me('editor', { twoFactor: false, requireTwoFactor: true }) },
    );
    await screen.findByTestId('second-factor-needed');
    expect(screen.getByRole('heading', { level: 1, name: 'Hill-climb build' })).toBeTruthy();
    expect(screen.queryByText(/not found/i)).toBeNull();
    expect(screen.getByText('Hill-climb build asks its members to use a second factor')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Set up a second factor' }).getAttribute('href')).toBe('/settings#second-factor');
    expect(screen.getByRole('button', { name: 'Leave team' })).toBeTruthy();
    // The page says it in full, so the banner above every page steps aside.
    expect(screen.queryByTestId('second-factor-banner')).toBeNull();
  });

  it('meets the same in the map library instead of "not found"', async () => {
    answer = () => json(403, refusal);
    renderWith(<MapLibrary teamId="t1" />, { who: me('editor', { twoFactor: false, requireTwoFactor: true }), at: '/teams/t1/maps' });
    await screen.findByTestId('second-factor-needed');
    expect(screen.getByRole('heading', { level: 1, name: 'Map library' })).toBeTruthy();
    expect(screen.queryByText(/not found|does not exist/i)).toBeNull();
  });

  it('sees a banner on other pages naming the team, with the way to the set-up', () => {
    renderWith(<SecondFactorBanner />, { who: me('viewer', { twoFactor: false, requireTwoFactor: true }), at: '/studies' });
    const banner = screen.getByTestId('second-factor-banner');
    expect(within(banner).getByText('Hill-climb build asks its members to use a second factor')).toBeTruthy();
    expect(within(banner).getByRole('link', { name: 'Set up a second factor' }).getAttribute('href')).toBe('/settings#second-factor');
  });

  it('sees no banner once the second factor is on, nor on the settings page where the set-up is', () => {
    renderWith(<SecondFactorBanner />, { who: me('viewer', { twoFactor: true, requireTwoFactor: true }), at: '/studies' });
    expect(screen.queryByTestId('second-factor-banner')).toBeNull();
    cleanup();
    renderWith(<SecondFactorBanner />, { who: me('viewer', { twoFactor: false, requireTwoFactor: true }), at: '/settings' });
    expect(screen.queryByTestId('second-factor-banner')).toBeNull();
  });

  it('has `me` read again when any request meets the rule, so the notices appear without a reload', async () => {
    answer = () => json(403, refusal);
    const queryClient = new QueryClient();
    queryClient.setQueryData(meQueryOptions().queryKey, me('viewer', { twoFactor: false, requireTwoFactor: false }));
    const stop = installTwoFactorRuleWatch(queryClient);
    try {
      await expect(api.get('/api/teams/t1/studies', z.unknown())).rejects.toMatchObject({ code: 'two_factor_required' });
      expect(queryClient.getQueryState(meQueryOptions().queryKey)?.isInvalidated).toBe(true);
    } finally {
      stop();
    }
  });
});
