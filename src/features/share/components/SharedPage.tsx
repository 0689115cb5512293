import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { BrandMark, BrandWord } from '#src/components/Brand';
import { SkipLink } from '#src/components/Nav';
import { paths } from '#src/lib/paths';
import type { UnitSystem } from '#src/lib/quantities';

/** SI or US customary for whoever opened the link (not remembered: they may not have an account). */
export function ViewerUnitSwitch({ value, onChange }: { value: UnitSystem; onChange: (system: UnitSystem) => void }) {
  const options: { value: UnitSystem; label: string; name: string }[] = [
    { value: 'si', label: 'SI', name: 'SI units' },
    { value: 'us', label: 'US', name: 'US customary units' },
  ];
  return (
    <div role="group" aria-label="Units" className="inline-flex overflow-hidden rounded-md border border-ink/25 bg-white/70">
      {options.map((o) => (
        <button
          key={o.value}
          type="button"
          aria-pressed={value === o.value}
          aria-label={o.name}
          onClick={() => onChange(o.value)}
          className={`px-2.5 py-1 text-xs font-bold ${value === o.value ? 'bg-teal text-white' : 'text-ink-soft hover:bg-paper-deep'}`}
        >
          {o.label}
        </button>
      ))}
    </div>
  );
}

/** The frame of a shared study: the brand, a line saying it is read-only, and the page. */
export function SharedPage({ end, children }: { end?: ReactNode; children: ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col">
      <SkipLink />
      <header className="border-b border-ink/15 bg-paper/90">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center justify-between gap-3 px-4 py-2">
          <Link to={paths.home.href()} className="flex items-center gap-2 rounded-md py-1 pr-1 no-underline hover:no-underline" aria-label="Spoolbook home">
            <BrandMark />
            <BrandWord />
          </Link>
          {end && <div className="flex flex-wrap items-center gap-3">{end}</div>}
        </div>
      </header>
      <main id="main" tabIndex={-1} className="flex-1 px-4 py-8 focus:outline-none">
        {children}
      </main>
    </div>
  );
}

/** What a revoked, expired or unknown link shows: plainly that it no longer works, and what to do. */
export function LinkGone() {
  return (
    <div className="mx-auto max-w-xl space-y-4 py-10 text-center" data-testid="share-link-gone">
      <h1 className="text-3xl font-semibold tracking-tight text-ink">This shared study is not available</h1>
      <p className="text-ink-soft">
        The link was revoked by the team, it expired, or it was copied incompletely. Nothing is wrong on your side: ask whoever sent it for a new link.
      </p>
      <p>
        <Link to={paths.signIn.href()}>Sign in to Spoolbook</Link> if you are a member of the team.
      </p>
    </div>
  );
}
