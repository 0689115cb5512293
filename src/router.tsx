import { createBrowserRouter, Navigate } from 'react-router';
import { Loading } from './components/Page';
import { paths } from './lib/paths';
import { queryClient } from './lib/query-client';
import { meQueryOptions } from './lib/session';
import { AdminLayout } from './routes/admin-layout';
import { AdminOutboxMessageRoute } from './routes/admin-outbox-message';
import { AdminOutboxRoute } from './routes/admin-outbox';
import { AdminTeamsRoute } from './routes/admin-teams';
import { AdminUsersRoute } from './routes/admin-users';
import { ForgotPasswordRoute } from './routes/forgot-password';
import { RequireAdmin, RequireSignedIn, RequireSignedOut } from './routes/guards';
import { HomeRoute } from './routes/home';
import { InvitationRoute } from './routes/invitation';
import { AppLayout, PublicLayout, RootLayout, SessionLayout } from './routes/layouts';
import { MapsRoute } from './routes/maps';
import { NotFoundRoute } from './routes/not-found';
import { ResetPasswordRoute } from './routes/reset-password';
import { RouteError } from './routes/route-error';
import { SettingsRoute } from './routes/settings';
import { SessionsRoute } from './routes/sessions';
import { ConfirmEmailRoute } from './routes/confirm-email';
import { SignInRoute } from './routes/sign-in';
import { SignUpRoute } from './routes/sign-up';
import { StudiesRoute } from './routes/studies';
import { TeamRoute } from './routes/team';
import { TeamsRoute } from './routes/teams';

// Route paths are absolute (from lib/paths); React Router accepts them in nested routes
// because each starts with its parent's path.
export const routes = [
  {
    path: '/',
    element: <RootLayout />,
    errorElement: <RouteError />,
    hydrateFallbackElement: <Loading />,
    // Knowing who is signed in before the first paint lets every guard decide at once.
    loader: async () => {
      await queryClient.ensureQueryData(meQueryOptions());
      return null;
    },
    children: [
      {
        element: <PublicLayout />,
        children: [
          { index: true, element: <HomeRoute /> },
          {
            element: <RequireSignedOut />,
            children: [
              { path: paths.signIn.path, element: <SignInRoute /> },
              { path: paths.signUp.path, element: <SignUpRoute /> },
            ],
          },
        ],
      },
      {
        element: <SessionLayout />,
        children: [
          { path: paths.forgotPassword.path, element: <ForgotPasswordRoute /> },
          { path: paths.resetPassword.path, element: <ResetPasswordRoute /> },
          { path: paths.confirmEmail.path, element: <ConfirmEmailRoute /> },
          { path: paths.invitation.path, element: <InvitationRoute /> },
        ],
      },
      {
        element: <RequireSignedIn />,
        children: [
          { path: paths.teamStudyReport.path, lazy: () => import('./routes/report').then((m) => ({ Component: m.ReportRoute })) },
          {
            element: <AppLayout />,
            children: [
              { path: paths.studies.path, element: <StudiesRoute /> },
              // The study pages load with their own code (engine, units, table and plots) on first use.
              { path: paths.teamStudies.path, lazy: () => import('./routes/studies-team').then((m) => ({ Component: m.StudiesTeamRoute })) },
              { path: paths.teamStudy.path, lazy: () => import('./routes/study').then((m) => ({ Component: m.StudyRoute })) },
              { path: paths.maps.path, element: <MapsRoute /> },
              // The map pages load with their own code (the map reader, units and plots) on first use.
              { path: paths.teamMaps.path, lazy: () => import('./routes/maps-library').then((m) => ({ Component: m.MapsLibraryRoute })) },
              { path: paths.teamMap.path, lazy: () => import('./routes/maps-detail').then((m) => ({ Component: m.MapsDetailRoute })) },
              { path: paths.teamTracer.path, lazy: () => import('./routes/tracer').then((m) => ({ Component: m.TracerRoute })) },
              { path: paths.teamTracerDraft.path, lazy: () => import('./routes/tracer-draft').then((m) => ({ Component: m.TracerDraftRoute })) },
              { path: paths.learn.path, lazy: () => import('./routes/learn').then((m) => ({ Component: m.LearnRoute })) },
              { path: paths.teamStudyDrive.path, lazy: () => import('./routes/drive').then((m) => ({ Component: m.DriveRoute })) },
              { path: paths.teamStudyCompare.path, lazy: () => import('./routes/compare').then((m) => ({ Component: m.CompareRoute })) },
              { path: paths.teamStudyLogs.path, lazy: () => import('./routes/study-logs').then((m) => ({ Component: m.StudyLogsRoute })) },
              { path: paths.teamStudyCandidates.path, lazy: () => import('./routes/candidates').then((m) => ({ Component: m.CandidatesRoute })) },
              { path: paths.teams.path, element: <TeamsRoute /> },
              { path: paths.team.path, element: <TeamRoute /> },
              { path: paths.settings.path, element: <SettingsRoute /> },
              { path: paths.sessions.path, element: <SessionsRoute /> },
              {
                path: paths.admin.path,
                element: <RequireAdmin />,
                children: [
                  {
                    element: <AdminLayout />,
                    children: [
                      { index: true, element: <Navigate to={paths.adminTeams.href()} replace /> },
                      { path: paths.adminTeams.path, element: <AdminTeamsRoute /> },
                      { path: paths.adminUsers.path, element: <AdminUsersRoute /> },
                      { path: paths.adminOutbox.path, element: <AdminOutboxRoute /> },
                      { path: paths.adminOutboxMessage.path, element: <AdminOutboxMessageRoute /> },
                    ],
                  },
                ],
              },
            ],
          },
        ],
      },
      { path: paths.share.path, lazy: () => import('./routes/share').then((m) => ({ Component: m.ShareRoute })) },
      { path: paths.shareReport.path, lazy: () => import('./routes/share-report').then((m) => ({ Component: m.ShareReportRoute })) },
      {
        element: <SessionLayout />,
        children: [{ path: '*', element: <NotFoundRoute /> }],
      },
    ],
  },
];

export function createRouter() {
  return createBrowserRouter(routes);
}
