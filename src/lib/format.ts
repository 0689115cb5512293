const dateTime = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

/** A server timestamp (ISO 8601) in the reader's locale; the raw text if it does not parse. */
export function formatDateTime(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : dateTime.format(date);
}

export const roleNames = { owner: 'Owner', editor: 'Editor', viewer: 'Viewer' } as const;

/** What each role may do, in a line, for pickers and the invitation page. */
export const roleDescriptions = {
  owner: 'manages members, invitations and the team itself',
  editor: 'creates and changes studies and maps',
  viewer: 'reads studies and maps',
} as const;
