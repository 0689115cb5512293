import { useEffect } from 'react';
import { Link, useLocation } from 'react-router';
import { paths } from '../lib/paths';
import { askingTitle, showFullNotice, useFullNoticeShown, useTeamsAskingForSecondFactor } from '../lib/two-factor-rule';
import { Alert } from './Alert';
import { ButtonLink } from './Button';
import { Page } from './Page';

/**
 * What a member sees where a team's page or data would be: the team asks for a second factor
 * they have not turned on, what that closes, and the way to the set-up. Never a bare "not found".
 */
export function SecondFactorNeeded({ teamName }: { teamName: string | null }) {
  useEffect(showFullNotice, []);
  return (
    <div className="space-y-4" data-testid="second-factor-needed">
      <Alert tone="info" title={`${teamName ?? 'This team'} asks its members to use a second factor`}>
        <p>
          Until you turn one on, its studies, maps and members stay closed to you. Setting it up takes a minute: your password, then a code from an
          authenticator app on your phone.
        </p>
      </Alert>
      <ButtonLink variant="primary" to={paths.settings.href('second-factor')}>
        Set up a second factor
      </ButtonLink>
    </div>
  );
}

/**
 * A line above every signed-in page while some of the user's teams ask for a second factor they
 * lack: pages of those teams would otherwise only say they could not load. It steps aside on the
 * settings page (the set-up is there) and where a page explains the rule in full.
 */
export function SecondFactorBanner() {
  const teams = useTeamsAskingForSecondFactor();
  const fullNoticeShown = useFullNoticeShown();
  const { pathname } = useLocation();
  if (teams.length === 0 || fullNoticeShown || pathname === paths.settings.path) return null;
  return (
    <div className="mx-auto mb-6 max-w-5xl" data-testid="second-factor-banner">
      <Alert tone="info" title={askingTitle(teams)}>
        <p>
          {teams.length === 1 ? 'Its' : 'Their'} studies and maps stay closed to you until you turn one on.{' '}
          <Link to={paths.settings.href('second-factor')}>Set up a second factor</Link>
        </p>
      </Alert>
    </div>
  );
}

/** A team's page that its rule closes to this member: the page's own title, then the notice. */
export function SecondFactorNeededPage({ title, teamName }: { title: string; teamName: string | null }) {
  return (
    <Page eyebrow={teamName ?? 'Team'} title={title} width="narrow">
      <SecondFactorNeeded teamName={teamName} />
    </Page>
  );
}
