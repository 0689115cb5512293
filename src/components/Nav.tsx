import type { ReactNode } from 'react';
import { Link, NavLink, useLocation } from 'react-router';
import { BrandMark, BrandWord } from './Brand';

export interface NavItem {
  to: string;
  label: string;
  /** Which pages belong to this area; by default, paths starting with `to`. */
  isActive?: (pathname: string) => boolean;
}

const linkClass = ({ isActive }: { isActive: boolean }) =>
  `relative rounded-md px-3 py-1.5 text-sm font-semibold no-underline transition-colors hover:no-underline ${
    isActive
      ? 'bg-teal-light/70 text-teal-dark after:absolute after:inset-x-3 after:-bottom-[9px] after:h-0.5 after:bg-teal'
      : 'text-ink-soft hover:bg-paper-deep hover:text-ink'
  }`;

/**
 * The header of every signed-in page: the brand (home), the areas of the product, and a slot
 * on the right for the unit switch and the account controls.
 */
export function Nav({ homeHref, items, end }: { homeHref: string; items: readonly NavItem[]; end?: ReactNode }) {
  const { pathname } = useLocation();
  return (
    <header className="border-b border-ink/15 bg-paper/90 backdrop-blur supports-[backdrop-filter]:bg-paper/75">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
        <Link to={homeHref} className="flex items-center gap-2 rounded-md py-1 pr-1" aria-label="Spoolbook home">
          <BrandMark />
          <BrandWord />
        </Link>
        {/* On narrow screens the areas take their own row below the brand and the account. */}
        <nav aria-label="Main" className="order-last w-full md:order-none md:w-auto md:flex-1">
          <ul className="flex flex-wrap items-center gap-1">
            {items.map((item) => (
              <li key={item.to}>
                <NavLink to={item.to} className={item.isActive ? () => linkClass({ isActive: item.isActive!(pathname) }) : linkClass}>
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        {end && <div className="ml-auto flex flex-wrap items-center gap-3 md:ml-0">{end}</div>}
      </div>
    </header>
  );
}

/** A skip link, first in the tab order, for keyboard users to pass the header. */
export function SkipLink({ target = 'main', children = 'Skip to content' }: { target?: string; children?: string }) {
  return (
    <a
      href={`#${target}`}
      className="sr-only focus:not-sr-only focus:absolute focus:left-3 focus:top-3 focus:z-50 focus:rounded-md focus:bg-white focus:px-3 focus:py-2 focus:shadow"
    >
      {children}
    </a>
  );
}
