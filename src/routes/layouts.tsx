import { Link, Outlet, ScrollRestoration } from 'react-router';
import { BrandMark, BrandWord } from '../components/Brand';
import { Nav, SkipLink, type NavItem } from '../components/Nav';
import { SecondFactorBanner } from '../components/SecondFactorNotice';
import { TeamSwitcher } from '../components/TeamSwitcher';
import { SignOutButton } from '../features/auth/components/SignOutButton';
import { UnitSwitch } from '../features/auth/components/UnitSwitch';
import { useCurrentTeamId } from '../lib/current-team';
import { UserUnitSystem } from '../lib/quantities';
import { homeAfterSignIn, paths } from '../lib/paths';
import { useMe } from '../lib/session';

// Team-scoped pages live under /teams/:teamId/…, so each area says which paths are its own
// (by prefix alone, Team would light up on every study and map page too).
const areas: readonly NavItem[] = [
  { to: paths.studies.href(), label: 'Studies', isActive: (p) => /^\/(studies|teams\/[^/]+\/studies)(\/|$)/.test(p) },
  { to: paths.maps.href(), label: 'Maps', isActive: (p) => /^\/(maps|teams\/[^/]+\/(maps|tracer))(\/|$)/.test(p) },
  { to: paths.learn.href(), label: 'Learn' },
  { to: paths.teams.href(), label: 'Team', isActive: (p) => /^\/teams(\/[^/]+)?\/?$/.test(p) },
];

/** The top of the tree: scroll restoration, and the user's unit system for every page. */
export function RootLayout() {
  return (
    <UserUnitSystem>
      <ScrollRestoration />
      <Outlet />
    </UserUnitSystem>
  );
}

/** Signed-in pages: the header with the areas, the unit switch and the account. */
export function AppLayout() {
  const me = useMe();
  const user = me.data?.user;
  // Maps opens straight in the current team's library.
  const teamId = useCurrentTeamId();
  const items = areas.map((item) => (teamId && item.to === paths.maps.href() ? { ...item, to: paths.teamMaps.href(teamId) } : item));
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <Nav
        homeHref={homeAfterSignIn}
        items={user?.isAdmin ? [...items, { to: paths.admin.href(), label: 'Admin' }] : items}
        end={
          <>
            <TeamSwitcher />
            <UnitSwitch />
            {user && <span className="hidden text-sm text-ink-soft lg:inline">{user.name}</span>}
            <Link to={paths.settings.href()} className="text-sm font-semibold">
              Account
            </Link>
            <SignOutButton />
          </>
        }
      />
      <main id="main" tabIndex={-1} className="flex-1 px-4 py-8 focus:outline-none">
        <SecondFactorBanner />
        <Outlet />
      </main>
    </div>
  );
}

/** Pages for visitors (sign-in, password reset): the brand and one column. */
export function PublicLayout() {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <header className="px-4 py-4">
        <div className="mx-auto flex max-w-5xl items-center">
          <Link to={paths.home.href()} className="flex items-center gap-2 rounded-md py-1 pr-1 no-underline hover:no-underline" aria-label="Spoolbook home">
            <BrandMark className="size-8" />
            <BrandWord className="text-2xl" />
          </Link>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="flex-1 px-4 pb-12 pt-4 focus:outline-none">
        <Outlet />
      </main>
    </div>
  );
}

/** Pages anyone may open (an invitation, a reset link): the app's header when signed in. */
export function SessionLayout() {
  const me = useMe();
  return me.data ? <AppLayout /> : <PublicLayout />;
}
