import { useEffect, useState } from 'react';
import type { AdminUser } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Badge } from '#src/components/Badge';
import { ConfirmButton } from '#src/components/ConfirmButton';
import { Loading } from '#src/components/Page';
import { Table, td, th } from '#src/components/Table';
import { TextField } from '#src/components/TextField';
import { formatDateTime } from '#src/lib/format';
import { useMe } from '#src/lib/session';
import { useEndUserSessions } from '../api/end-user-sessions';
import { useUsers } from '../api/get-users';

/** The server answers at most this many users per search (docs/api.md). */
const MOST_LISTED = 100;
/** Typing settles this long before the search goes out. */
const SEARCH_PAUSE_MS = 300;

const sessionsWord = (n: number) => (n === 1 ? '1 session' : `${n} sessions`);

/**
 * Every account on the site, with what a site admin checks when something looks wrong: the
 * address confirmed, the second factor, where it is signed in. "End all sessions" signs the user
 * out everywhere.
 */
export function UsersTable() {
  const [typed, setTyped] = useState('');
  const [search, setSearch] = useState('');
  useEffect(() => {
    const timer = setTimeout(() => setSearch(typed.trim()), SEARCH_PAUSE_MS);
    return () => clearTimeout(timer);
  }, [typed]);
  const users = useUsers(search);
  const end = useEndUserSessions();
  const [ended, setEnded] = useState<{ name: string; count: number } | null>(null);
  const myId = useMe().data?.user.id ?? null;

  return (
    <div className="space-y-4">
      <TextField
        label="Search by name or e-mail"
        name="q"
        type="search"
        value={typed}
        onChange={(event) => setTyped(event.target.value)}
        autoComplete="off"
        className="max-w-md"
      />
      {ended && (
        <Alert tone="success" title={`${ended.name} is signed out everywhere`}>
          {ended.count === 0 ? 'No session was left to end.' : `${sessionsWord(ended.count)} ended.`}
        </Alert>
      )}
      {users.data === undefined ? (
        users.isError ? (
          <Alert tone="error">{users.error.message}</Alert>
        ) : (
          <Loading label="Loading users…" />
        )
      ) : users.data.length === 0 ? (
        <p className="text-ink-soft">No user’s name or e-mail holds “{search}”.</p>
      ) : (
        <Table
          caption={
            users.data.length >= MOST_LISTED
              ? `The first ${MOST_LISTED} users by e-mail: search to find others`
              : `${users.data.length} ${users.data.length === 1 ? 'user' : 'users'}${search ? ` matching “${search}”` : ''}`
          }
          head={
            <tr className="hidden md:table-row">
              <th scope="col" className={th}>
                User
              </th>
              <th scope="col" className={`${th} hidden md:table-cell`}>
                Address
              </th>
              <th scope="col" className={`${th} hidden md:table-cell`}>
                Second factor
              </th>
              <th scope="col" className={`${th} text-right`}>
                Sessions
              </th>
              <th scope="col" className={`${th} hidden md:table-cell`}>
                Last used
              </th>
              <th scope="col" className={th}>
                <span className="sr-only">Actions</span>
              </th>
            </tr>
          }
        >
          {users.data.map((user) => (
            <UserRow
              key={user.id}
              user={user}
              isYou={user.id === myId}
              onEnd={async () => {
                setEnded(null);
                const count = await end.mutateAsync(user.id);
                setEnded({ name: user.name, count });
              }}
            />
          ))}
        </Table>
      )}
    </div>
  );
}

function UserRow({ user, isYou, onEnd }: { user: AdminUser; isYou: boolean; onEnd: () => Promise<void> }) {
  return (
    // On a phone each user is a block: the facts in one line under the name, the button below.
    <tr className="block md:table-row">
      <th scope="row" className={`${td} block font-normal md:table-cell`}>
        <span className="flex flex-wrap items-center gap-1.5 font-semibold text-ink">
          {user.name}
          {user.isAdmin && <Badge tone="teal">site admin</Badge>}
          {isYou && <Badge tone="copper">you</Badge>}
        </span>
        <span className="block text-ink-soft">{user.email}</span>
        <span className="block text-ink-soft md:hidden">
          {user.emailConfirmed ? 'Address confirmed' : 'Address not confirmed'} · second factor {user.twoFactor ? 'on' : 'off'} · {sessionsWord(user.sessions)}
          {user.lastSeenAt && `, last used ${formatDateTime(user.lastSeenAt)}`}
        </span>
      </th>
      <td className={`${td} hidden whitespace-nowrap md:table-cell`}>{user.emailConfirmed ? 'Confirmed' : <Badge tone="copper">Not confirmed</Badge>}</td>
      <td className={`${td} hidden whitespace-nowrap md:table-cell`}>{user.twoFactor ? 'On' : <span className="text-ink-soft">Off</span>}</td>
      <td className={`${td} hidden text-right tabular-nums md:table-cell`}>{user.sessions}</td>
      <td className={`${td} hidden whitespace-nowrap text-ink-soft md:table-cell`}>
        {user.lastSeenAt ? <time dateTime={user.lastSeenAt}>{formatDateTime(user.lastSeenAt)}</time> : '—'}
      </td>
      <td className={`${td} block pt-0 md:table-cell md:pt-2.5 md:text-right`}>
        <ConfirmButton
          title={`End every session of ${user.name}?`}
          description={
            <>
              {user.name} ({user.email}) is signed out at once in every browser: {sessionsWord(user.sessions)}. Signing in again needs their password
              {user.twoFactor ? ' and second factor' : ''}; if the account may be in someone else’s hands, have the password reset too.
              {isYou && ' This includes the session you are using: you will be signed out.'}
            </>
          }
          confirmLabel="End all sessions"
          cancelLabel="Keep them"
          aria-label={`End all sessions of ${user.name}`}
          disabled={user.sessions === 0}
          onConfirm={onEnd}
        >
          End all sessions
        </ConfirmButton>
      </td>
    </tr>
  );
}
