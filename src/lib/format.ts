const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** A server timestamp (ISO 8601) in the reader's locale; the raw text if it does not parse. */
export function formatDateTime(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTime.format(date);
}

export const roleNames = { owner: 'Owner', editor: 'Editor', viewer: 'Viewer' } as const;

/** What each role may do, to follow "can": "an editor can create and change studies and maps". */
export const roleAbilities = {
  owner: 'manage members, invitations and the team, and create and change studies and maps',
  editor: 'create and change studies and maps',
  viewer: 'read studies and maps',
} as const;
