import { Alert } from '#src/components/Alert';
import { Button } from '#src/components/Button';
import { Loading } from '#src/components/Page';
import { Table, td, th } from '#src/components/Table';
import { formatDateTime } from '#src/lib/format';
import { useEndOtherSessions, useEndSession, useSessions } from '../api/security';

/** Where this account is signed in: when each session began, when it was last used, from where, in which browser. */
export function SessionsList() {
  const sessions = useSessions();
  const end = useEndSession();
  const endOthers = useEndOtherSessions();
  if (!sessions.data) return <Loading label="Loading sessions…" />;
  const others = sessions.data.sessions.filter((s) => !s.current).length;
  return (
    <div className="space-y-4">
      <Table
        caption="Sessions of this account"
        captionHidden
        head={
          <tr>
            <th className={th}>Browser</th>
            <th className={th}>Address</th>
            <th className={th}>Signed in</th>
            <th className={th}>Last used</th>
            <th className={th}>
              <span className="sr-only">End</span>
            </th>
          </tr>
        }
      >
        {sessions.data.sessions.map((s) => (
          <tr key={s.id}>
            <th scope="row" className={`${td} font-medium`}>
              {s.browser}
              {s.current && <span className="ml-2 rounded bg-teal-light px-1.5 py-0.5 text-xs font-semibold text-teal-dark">this one</span>}
            </th>
            <td className={td}>{s.ip ?? '—'}</td>
            <td className={td}>{formatDateTime(s.createdAt)}</td>
            <td className={td}>{formatDateTime(s.lastSeenAt)}</td>
            <td className={`${td} text-right`}>
              {!s.current && (
                <Button
                  onClick={() => end.mutate(s.id)}
                  pending={end.isPending && end.variables === s.id}
                  aria-label={`End the session in ${s.browser} from ${s.ip ?? 'an unknown address'}`}
                >
                  End
                </Button>
              )}
            </td>
          </tr>
        ))}
      </Table>
      {endOthers.isSuccess && (
        <Alert tone="success" title="Signed out elsewhere">
          {endOthers.data.ended === 1 ? 'One other session was ended.' : `${endOthers.data.ended} other sessions were ended.`}
        </Alert>
      )}
      <Button onClick={() => endOthers.mutate()} disabled={others === 0} pending={endOthers.isPending}>
        End all other sessions
      </Button>
    </div>
  );
}
