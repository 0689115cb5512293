// Every route path of the client in one place: `path` for the router, `href()` for links.

export const paths = {
  home: { path: '/', href: () => '/' },

  signIn: {
    path: '/sign-in',
    href: (next?: string | null) => (next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'),
  },
  signUp: {
    path: '/sign-up',
    href: (next?: string | null) => (next ? `/sign-up?next=${encodeURIComponent(next)}` : '/sign-up'),
  },
  forgotPassword: { path: '/forgot-password', href: () => '/forgot-password' },
  /** The link the password-reset mail carries: `/reset-password?token=…`. */
  resetPassword: {
    path: '/reset-password',
    href: (token?: string) => (token ? `/reset-password?token=${encodeURIComponent(token)}` : '/reset-password'),
  },
  /** The link the invitation mail carries. */
  invitation: {
    path: '/invitations/:token',
    href: (token: string) => `/invitations/${encodeURIComponent(token)}`,
  },

  studies: { path: '/studies', href: () => '/studies' },
  maps: { path: '/maps', href: () => '/maps' },
  learn: { path: '/learn', href: () => '/learn' },
  teams: { path: '/teams', href: () => '/teams' },
  team: { path: '/teams/:teamId', href: (teamId: string) => `/teams/${encodeURIComponent(teamId)}` },
  /** A team's map library (its maps and the built-in demo maps). */
  teamMaps: { path: '/teams/:teamId/maps', href: (teamId: string) => `/teams/${encodeURIComponent(teamId)}/maps` },
  teamMap: {
    path: '/teams/:teamId/maps/:mapId',
    href: (teamId: string, mapId: string) => `/teams/${encodeURIComponent(teamId)}/maps/${encodeURIComponent(mapId)}`,
  },
  /** The Tracer: turn a picture of a map into a map file; and one trace in progress. */
  teamTracer: { path: '/teams/:teamId/tracer', href: (teamId: string) => `/teams/${encodeURIComponent(teamId)}/tracer` },
  teamTracerDraft: {
    path: '/teams/:teamId/tracer/:draftId',
    href: (teamId: string, draftId: string) => `/teams/${encodeURIComponent(teamId)}/tracer/${encodeURIComponent(draftId)}`,
  },
  teamStudy: {
    path: '/teams/:teamId/studies/:studyId',
    href: (teamId: string, studyId: string) => `/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}`,
  },
  /** A team's study list. */
  teamStudies: { path: '/teams/:teamId/studies', href: (teamId: string) => `/teams/${encodeURIComponent(teamId)}/studies` },
  /** Side by side: plans and scenarios of one study on one map and in one table. */
  teamStudyDrive: {
    path: '/teams/:teamId/studies/:studyId/drive',
    href: (teamId: string, studyId: string) => `/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}/drive`,
  },
  teamStudyCompare: {
    path: '/teams/:teamId/studies/:studyId/compare',
    href: (teamId: string, studyId: string) => `/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}/compare`,
  },
  /** The logged runs of one study, beside its prediction. */
  teamStudyLogs: {
    path: '/teams/:teamId/studies/:studyId/logs',
    href: (teamId: string, studyId: string) => `/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}/logs`,
  },
  /** Candidates: every map of the library ranked against one study. */
  teamStudyCandidates: {
    path: '/teams/:teamId/studies/:studyId/candidates',
    href: (teamId: string, studyId: string) => `/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}/candidates`,
  },
  /** The printable report of one study. */
  teamStudyReport: {
    path: '/teams/:teamId/studies/:studyId/report',
    href: (teamId: string, studyId: string) => `/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}/report`,
  },
  /** A study opened through a share link (signed out, read-only). */
  share: { path: '/share/:token', href: (token: string) => `/share/${encodeURIComponent(token)}` },
  /** The printable report of a shared study. */
  shareReport: { path: '/share/:token/report', href: (token: string) => `/share/${encodeURIComponent(token)}/report` },
  /** Account settings; `second-factor` opens it at the second factor's set-up. */
  settings: { path: '/settings', href: (section?: 'second-factor') => (section ? `/settings#${section}` : '/settings') },
  /** Where this account is signed in. */
  sessions: { path: '/settings/sessions', href: () => '/settings/sessions' },
  /** The link the confirmation mail carries: `/confirm-email?token=…`. */
  confirmEmail: { path: '/confirm-email', href: () => '/confirm-email' },

  admin: { path: '/admin', href: () => '/admin' },
  adminTeams: { path: '/admin/teams', href: () => '/admin/teams' },
  adminUsers: { path: '/admin/users', href: () => '/admin/users' },
  adminOutbox: { path: '/admin/outbox', href: () => '/admin/outbox' },
  adminOutboxMessage: {
    path: '/admin/outbox/:messageId',
    href: (messageId: string) => `/admin/outbox/${encodeURIComponent(messageId)}`,
  },
} as const;

/** Where a signed-in user lands by default. */
export const homeAfterSignIn = paths.studies.href();

/**
 * The `next` parameter, if it names a page of this app; anything else (another site,
 * `//host`, `javascript:`) falls back to the default so sign-in cannot be used to bounce
 * users to a foreign page.
 */
export function safeNext(next: string | null | undefined, fallback: string = homeAfterSignIn): string {
  if (!next || !next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return fallback;
  if (next === paths.signIn.path || next.startsWith(`${paths.signIn.path}?`)) return fallback;
  return next;
}
