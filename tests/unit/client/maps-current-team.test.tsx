import { describe, expect, it } from 'vitest';
import type { TeamSummary } from '#shared/schemas/account';
import { pathForTeamSwitch } from '#src/components/TeamSwitcher';
import { chooseCurrentTeam } from '#src/lib/current-team';

// Which team the Maps entry opens: the address, else the last one used, else the personal team.

const teams: TeamSummary[] = [
  { id: 'shared', name: 'Harrow Hill Motorsport', personal: false, role: 'editor' },
  { id: 'mine', name: 'Ada’s team', personal: true, role: 'owner' },
  { id: 'looked-at', name: 'Someone else', personal: false, role: null },
];

describe('current team', () => {
  it('takes the team in the address first', () => {
    expect(chooseCurrentTeam('looked-at', 'shared', teams)).toBe('looked-at');
  });
  it('then the last team used, while the user is still in it', () => {
    expect(chooseCurrentTeam(undefined, 'shared', teams)).toBe('shared');
    expect(chooseCurrentTeam(undefined, 'gone', teams)).toBe('mine');
    // A team a site admin only looked at is no place to open Maps in.
    expect(chooseCurrentTeam(undefined, 'looked-at', teams)).toBe('mine');
  });
  it('else the personal team, else the first team, else none', () => {
    expect(chooseCurrentTeam(undefined, null, teams)).toBe('mine');
    expect(chooseCurrentTeam(undefined, null, [teams[0]])).toBe('shared');
    expect(chooseCurrentTeam(undefined, null, [])).toBeNull();
  });
});

describe('switching team', () => {
  it('keeps the area and drops what belongs to the old team', () => {
    expect(pathForTeamSwitch('/teams/a/maps/m1', 'b')).toBe('/teams/b/maps');
    expect(pathForTeamSwitch('/teams/a/maps', 'b')).toBe('/teams/b/maps');
    expect(pathForTeamSwitch('/teams/a', 'b')).toBe('/teams/b');
    expect(pathForTeamSwitch('/settings', 'b')).toBeNull();
  });
});
