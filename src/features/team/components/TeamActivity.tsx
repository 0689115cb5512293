import type { AuditEventView } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Table, td, th } from '#src/components/Table';
import { formatDateTime } from '#src/lib/format';
import { useAudit } from '../api/get-audit';

const actionWords: Record<string, string> = {
  'team.created': 'created the team',
  'team.renamed': 'renamed the team',
  'team.deleted': 'deleted the team',
  'team.exported': 'downloaded the team archive',
  'team.imported': 'imported an archive',
  'member.role-changed': 'changed a role',
  'member.removed': 'removed a member',
  'member.left': 'left the team',
  'invitation.created': 'invited someone',
  'invitation.resent': 'resent an invitation',
  'invitation.cancelled': 'cancelled an invitation',
  'invitation.accepted': 'accepted an invitation',
  'map.uploaded': 'added a map',
  'map.deleted': 'deleted a map',
  'study.deleted': 'deleted a study',
  'study.copied-out': 'copied a study to another team',
  'study.copied-in': 'copied a study in from another team',
  'share-link.created': 'created a share link',
  'share-link.revoked': 'revoked a share link',
};

/** The facts of an event in a few words (names, roles, counts). */
function detailText(event: AuditEventView): string {
  const d = event.details;
  const parts: string[] = [];
  for (const key of ['name', 'title', 'email', 'role', 'from', 'to', 'kind', 'maps', 'studies', 'revisions']) {
    const v = d[key];
    if (typeof v === 'string' || typeof v === 'number') parts.push(`${key} ${v}`);
  }
  return parts.join(', ');
}

/** The team's audit record for its owners: newest first. */
export function TeamActivity({ teamId }: { teamId: string }) {
  const audit = useAudit(teamId);
  if (audit.isPending) return <p className="text-sm text-ink-soft">Loading the record…</p>;
  if (audit.isError) return <Alert tone="error">{audit.error.message}</Alert>;
  if (audit.data.events.length === 0) return <p className="text-sm text-ink-soft">Nothing recorded yet.</p>;
  return (
    <Table
      caption="Latest changes to this team (times in your time zone; stored in UTC)"
      captionHidden
      head={
        <tr>
          <th className={th}>When</th>
          <th className={th}>Who</th>
          <th className={th}>What</th>
          <th className={th}>Details</th>
        </tr>
      }
    >
      {audit.data.events.map((e) => (
        <tr key={e.id}>
          <td className={`${td} whitespace-nowrap`}>{formatDateTime(e.at)}</td>
          <td className={td}>{e.actorEmail ?? '—'}</td>
          <td className={td}>{actionWords[e.action] ?? e.action}</td>
          <td className={`${td} text-ink-soft`}>{detailText(e)}</td>
        </tr>
      ))}
    </Table>
  );
}
