/** Query keys and URLs of the logged runs of a study and of the team's mapping presets. */
export const logKeys = {
  list: (teamId: string, studyId: string) => ['logs', teamId, studyId, 'list'] as const,
  samples: (teamId: string, studyId: string, logId: string) => ['logs', teamId, studyId, 'samples', logId] as const,
  presets: (teamId: string) => ['logs', teamId, 'presets'] as const,
};

export function logsUrl(teamId: string, studyId: string): string {
  return `/api/teams/${encodeURIComponent(teamId)}/studies/${encodeURIComponent(studyId)}/logs`;
}

export function logUrl(teamId: string, studyId: string, logId: string): string {
  return `${logsUrl(teamId, studyId)}/${encodeURIComponent(logId)}`;
}

export function presetsUrl(teamId: string): string {
  return `/api/teams/${encodeURIComponent(teamId)}/log-presets`;
}
