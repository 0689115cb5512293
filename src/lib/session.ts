import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { sessionStateSchema, type Me } from '#shared/schemas/account';
import { api, onTwoFactorRequired, onUnauthorized } from './api-client';

/**
 * Who is signed in, or null when nobody is. Shared by every feature (features may not import
 * each other, and the unit system, the navigation and the guards all need it).
 */
export async function getMe(): Promise<Me | null> {
  // The session endpoint answers 200 signed out too, so a visitor's console shows no 401.
  return (await getSessionState()).me;
}

/** Who is signed in and whether the one-click demo sign-in is open (a development server). */
export function getSessionState() {
  return api.get('/api/auth/session', sessionStateSchema);
}

/** Whether this server offers the one-click demo sign-in (asked once per page load); null until it answers. */
export function useDemoAvailable(): boolean | null {
  const state = useQuery({ queryKey: ['session-state'] as const, queryFn: getSessionState, staleTime: Infinity });
  return state.data ? state.data.demo : state.isError ? false : null;
}

export const meQueryOptions = () =>
  queryOptions({
    queryKey: ['auth', 'me'] as const,
    queryFn: getMe,
    staleTime: 5 * 60_000,
    // Coming back to the tab re-checks the session, so an expired one sends the user to sign-in.
    refetchOnWindowFocus: true,
  });

export function useMe() {
  return useQuery(meQueryOptions());
}

/** Stores a fresh `me` after signing in or up; drops everything cached for whoever came before. */
export function startSession(queryClient: QueryClient, me: Me): void {
  // Not queryClient.clear(): mounted observers of `me` would keep watching the removed query
  // and never see the new user.
  forgetUserData(queryClient);
  queryClient.setQueryData(meQueryOptions().queryKey, me);
}

function forgetUserData(queryClient: QueryClient): void {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== meQueryOptions().queryKey[0] });
}

/** Forgets the signed-in user and every cached answer that belonged to them. */
export function endSession(queryClient: QueryClient): void {
  forgetUserData(queryClient);
  queryClient.setQueryData(meQueryOptions().queryKey, null);
}

/** When any request finds the session gone, forget the user; the route guards do the rest. */
export function installSessionExpiry(queryClient: QueryClient): () => void {
  return onUnauthorized(() => {
    if (queryClient.getQueryData(meQueryOptions().queryKey)) endSession(queryClient);
  });
}

/**
 * When a team refuses its data for want of a second factor, fetch `me` again: an owner may have
 * turned the rule on since it was read, and `me` says which teams ask (the notices follow it).
 */
export function installTwoFactorRuleWatch(queryClient: QueryClient): () => void {
  return onTwoFactorRequired(() => void queryClient.invalidateQueries({ queryKey: meQueryOptions().queryKey }));
}
