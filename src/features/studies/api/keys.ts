/**
 * Query keys of the studies feature, one tree per team, so that a save can refresh the list and
 * the history of one study without touching other teams' or other studies' data.
 */
export const studyKeys = {
  all: (teamId: string) => ['studies', teamId] as const,
  lists: (teamId: string) => ['studies', teamId, 'list'] as const,
  detail: (teamId: string, studyId: string) => ['studies', teamId, 'detail', studyId] as const,
  revisions: (teamId: string, studyId: string) => ['studies', teamId, 'detail', studyId, 'revisions'] as const,
  shareLinks: (teamId: string, studyId: string) => ['studies', teamId, 'detail', studyId, 'share-links'] as const,
};

/** The URL prefix of one team's studies. */
export function studiesUrl(teamId: string): string {
  return `/api/teams/${encodeURIComponent(teamId)}/studies`;
}

/** The URL of one study. */
export function studyUrl(teamId: string, studyId: string): string {
  return `${studiesUrl(teamId)}/${encodeURIComponent(studyId)}`;
}
