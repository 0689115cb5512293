import { NavLink, Outlet } from 'react-router';
import { paths } from '../lib/paths';

const tabClass = ({ isActive }: { isActive: boolean }) =>
  `rounded-md px-3 py-1.5 text-sm font-semibold no-underline hover:no-underline ${
    isActive ? 'bg-ink text-paper' : 'text-ink-soft hover:bg-paper-deep hover:text-ink'
  }`;

/** The site-admin area: a row of links above its pages. */
export function AdminLayout() {
  return (
    <div className="space-y-6">
      <nav aria-label="Site admin" className="mx-auto flex max-w-5xl gap-2">
        <NavLink to={paths.adminTeams.href()} className={tabClass}>
          All teams
        </NavLink>
        <NavLink to={paths.adminUsers.href()} className={tabClass}>
          Users
        </NavLink>
        <NavLink to={paths.adminOutbox.href()} className={tabClass}>
          Outbox
        </NavLink>
      </nav>
      <Outlet />
    </div>
  );
}
