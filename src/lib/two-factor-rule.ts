import { useSyncExternalStore } from 'react';
import type { Me, TeamSummary } from '#shared/schemas/account';
import { useMe } from './session';

/** The user's teams that ask for a second factor they have not turned on (their data is closed to them). */
export function teamsAskingForSecondFactor(me: Me | null | undefined): TeamSummary[] {
  if (!me || me.user.twoFactor) return [];
  return me.teams.filter((team) => team.requireTwoFactor && team.role !== null);
}

export function useTeamsAskingForSecondFactor(): TeamSummary[] {
  return teamsAskingForSecondFactor(useMe().data);
}

const names = new Intl.ListFormat('en', { style: 'long', type: 'conjunction' });

/** "A asks its members to use a second factor", "A and B ask their members…". */
export function askingTitle(teams: readonly TeamSummary[]): string {
  const who = names.format(teams.map((team) => team.name));
  return `${who} ${teams.length === 1 ? 'asks its' : 'ask their'} members to use a second factor`;
}

// How many notices that explain the rule in full are on screen: while one is, the short banner
// above every page steps aside rather than say the same thing twice.
let fullNotices = 0;
const listeners = new Set<() => void>();

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function changeFullNotices(by: number): void {
  fullNotices += by;
  for (const listener of listeners) listener();
}

/** Marks a full notice as shown (call from an effect; the returned function takes it back). */
export function showFullNotice(): () => void {
  changeFullNotices(1);
  return () => changeFullNotices(-1);
}

export function useFullNoticeShown(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => fullNotices > 0,
    () => false,
  );
}
