import { useId, useState } from 'react';
import { createShareLinkSchema } from '#shared/schemas/study';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { Button } from '#src/components/Button';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading } from '#src/components/Page';
import { Switch } from '#src/components/Switch';
import { inputClass } from '#src/components/TextField';
import { isApiError } from '#src/lib/api-client';
import { formatDateTime } from '#src/lib/format';
import { useCreateShareLink } from '#src/features/studies/api/create-share-link';
import { useKeepShareLink } from '#src/features/studies/api/keep-share-link';
import { useShareLinks, type ShareLink } from '#src/features/studies/api/get-share-links';
import { useRevokeShareLink } from '#src/features/studies/api/revoke-share-link';
import { useTeamAccess } from '#src/lib/team-access';

function linkState(link: ShareLink): { label: string; tone: 'teal' | 'neutral' | 'copper' } {
  if (link.revokedAt) return { label: 'revoked', tone: 'neutral' };
  if (link.expiresAt && new Date(link.expiresAt).getTime() <= Date.now()) return { label: 'expired', tone: 'neutral' };
  return { label: 'active', tone: 'teal' };
}

/**
 * Read-only links to the study for people outside the team. The address is shown once, when
 * the link is made (only a hash of its token is kept); links can be revoked at any time.
 */
export function SharePanel({ teamId, studyId }: { teamId: string; studyId: string }) {
  const daysId = useId();
  const links = useShareLinks(teamId, studyId);
  const create = useCreateShareLink(teamId, studyId);
  const revoke = useRevokeShareLink(teamId, studyId);
  const keep = useKeepShareLink(teamId, studyId);
  const canKeep = useTeamAccess(teamId).can('share-links:keep');
  const [days, setDays] = useState('');
  const [never, setNever] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const [fresh, setFresh] = useState<string | null>(null);
  const [copied, setCopied] = useState(false);

  async function make(event: React.FormEvent) {
    event.preventDefault();
    setError(null);
    // Empty days: the server's default of 30; "never" only when ticked.
    const input = never ? { expiresInDays: null } : days.trim() === '' ? {} : { expiresInDays: Number(days) };
    const parsed = createShareLinkSchema.safeParse(input);
    if (!parsed.success || (!never && days.trim() !== '' && !/^\d+$/.test(days.trim())))
      return setError('Days must be a whole number from 1 to 365 (empty means 30), or tick "Never expires".');
    try {
      const link = await create.mutateAsync(parsed.data);
      setFresh(link.url ?? null);
      setCopied(false);
    } catch (e) {
      setError(isApiError(e) ? e.message : 'The link could not be made.');
    }
  }

  return (
    <div className="space-y-4" data-testid="share-panel">
      <p className="text-sm text-ink-soft">
        Anyone with a share link can open this study read-only, without signing in: the inputs, plots, results and findings of its latest saved revision.
      </p>
      <form onSubmit={make} className="flex flex-wrap items-end gap-2" noValidate>
        <div className="space-y-1">
          <label htmlFor={daysId} className="block text-sm font-semibold text-ink">
            Expires after (days)
          </label>
          <input
            id={daysId}
            inputMode="numeric"
            value={days}
            onChange={(e) => setDays(e.target.value)}
            placeholder="30"
            disabled={never}
            aria-describedby={`${daysId}-hint`}
            className={`${inputClass} w-32`}
          />
        </div>
        <label className="flex items-center gap-2 pb-2 text-sm">
          <input type="checkbox" checked={never} onChange={(e) => setNever(e.target.checked)} />
          Never expires
        </label>
        <Button type="submit" variant="primary" pending={create.isPending}>
          Make a share link
        </Button>
        <p id={`${daysId}-hint`} className="w-full text-sm text-ink-soft">
          Left empty, a link works for 30 days; any number from 1 to 365 works too. A link that never expires lasts until it is revoked.
        </p>
      </form>
      {error && <Alert tone="error">{error}</Alert>}
      {fresh && (
        <div className="space-y-2 rounded-md border border-teal/40 bg-teal-light/40 p-3" role="status">
          <p className="text-sm font-semibold text-ink">Copy the link now: it is shown only this once.</p>
          <div className="flex flex-wrap items-center gap-2">
            <input
              readOnly
              value={fresh}
              aria-label="New share link"
              onFocus={(e) => e.target.select()}
              className={`${inputClass} min-w-0 flex-1 font-mono text-xs`}
              data-testid="share-url"
            />
            <Button
              onClick={async () => {
                try {
                  await navigator.clipboard.writeText(fresh);
                  setCopied(true);
                } catch {
                  setError('The browser did not allow copying: select the link and copy it by hand.');
                }
              }}
            >
              {copied ? 'Copied' : 'Copy'}
            </Button>
          </div>
        </div>
      )}
      {keep.isError && <Alert tone="error">{keep.error.message}</Alert>}
      {links.isPending ? (
        <Loading label="Loading the share links…" />
      ) : links.isError ? (
        <Alert tone="error">{links.error.message}</Alert>
      ) : links.data.length === 0 ? (
        <p className="text-sm text-ink-soft">No share links yet.</p>
      ) : (
        <ul className="divide-y divide-paper-line rounded-md border border-paper-line bg-white/80">
          {links.data.map((link) => {
            const state = linkState(link);
            return (
              <li key={link.id} className="flex flex-wrap items-center justify-between gap-x-4 gap-y-2 px-3 py-2 text-sm" data-testid="share-link">
                <div className="min-w-0 space-y-2">
                  <p>
                    <Badge tone={state.tone}>{state.label}</Badge> made {formatDateTime(link.createdAt)}
                    {link.createdBy ? ` by ${link.createdBy}` : ''}
                    <span className="block text-ink-soft">
                      {link.revokedAt
                        ? `Revoked ${formatDateTime(link.revokedAt)}`
                        : link.expiresAt
                          ? `Expires ${formatDateTime(link.expiresAt)}`
                          : 'Does not expire'}
                      {/* Owners read it off their switch below. */}
                      {!link.revokedAt &&
                        !(canKeep && state.label === 'active') &&
                        (link.kept ? ' · an owner keeps it if its maker leaves the team' : ' · stops if its maker leaves the team')}
                    </span>
                  </p>
                  {canKeep && state.label === 'active' && <KeepSwitch link={link} keep={keep} />}
                </div>
                {state.label === 'active' && (
                  <ConfirmButton
                    variant="quiet"
                    title="Revoke this share link?"
                    description="Anyone holding it loses access at once. Make a new link to share again."
                    confirmLabel="Revoke link"
                    cancelLabel="Keep it"
                    onConfirm={() => revoke.mutateAsync(link.id)}
                  >
                    Revoke
                  </ConfirmButton>
                )}
              </li>
            );
          })}
        </ul>
      )}
    </div>
  );
}

/**
 * An owner's choice for one link: a link stops when the member who made it leaves the team,
 * unless an owner keeps it (for a customer who should go on seeing the study).
 */
function KeepSwitch({ link, keep }: { link: ShareLink; keep: ReturnType<typeof useKeepShareLink> }) {
  const pending = keep.isPending && keep.variables?.linkId === link.id;
  const kept = pending ? keep.variables!.kept : (link.kept ?? false);
  const maker = link.createdBy ?? 'its maker';
  return (
    <Switch
      label="Keep when its maker leaves"
      description={kept ? `Goes on working if ${maker} leaves the team.` : `Stops if ${maker} leaves the team.`}
      checked={kept}
      pending={pending}
      disabled={keep.isPending && !pending}
      onChange={(next) => keep.mutate({ linkId: link.id, kept: next })}
    />
  );
}
