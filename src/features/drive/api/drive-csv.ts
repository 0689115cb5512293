import { studyUrl } from '#src/features/studies/api';

/** The saved study's drive figures and spool estimate as CSV: plain download links (the browser sends the session cookie). */
export function driveCsvHref(teamId: string, studyId: string, which: 'drive' | 'spool'): string {
  return `${studyUrl(teamId, studyId)}/${which}.csv`;
}
