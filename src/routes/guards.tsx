import { Navigate, Outlet, useLocation, useSearchParams } from 'react-router';
import { Alert } from '../components/Alert';
import { Button } from '../components/Button';
import { Loading, Page } from '../components/Page';
import { paths, safeNext } from '../lib/paths';
import { useMe } from '../lib/session';

/** Pages for signed-in users: anyone else goes to sign-in, with `next` to come back here. */
export function RequireSignedIn() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <Loading />;
  if (me.data === undefined) return <SessionUnknown error={me.error} retry={() => me.refetch()} />;
  if (me.data === null) {
    return <Navigate to={paths.signIn.href(`${location.pathname}${location.search}${location.hash}`)} replace />;
  }
  return <Outlet />;
}

/** Sign-in and sign-up: a signed-in visitor goes on to `next` (or home). */
export function RequireSignedOut() {
  const me = useMe();
  const [searchParams] = useSearchParams();
  if (me.data) return <Navigate to={safeNext(searchParams.get('next'))} replace />;
  return <Outlet />;
}

/** Site-admin pages. The server checks too; this only keeps others from a page of errors. */
export function RequireAdmin() {
  const me = useMe();
  if (!me.data?.user.isAdmin) {
    return (
      <Page title="Site admin only">
        <Alert tone="error">This part of Spoolbook is for site administrators.</Alert>
      </Page>
    );
  }
  return <Outlet />;
}

function SessionUnknown({ error, retry }: { error: Error | null; retry: () => void }) {
  return (
    <Page title="Cannot reach Spoolbook" width="narrow">
      <Alert tone="error">{error?.message ?? 'Could not find out whether you are signed in.'}</Alert>
      <Button variant="primary" onClick={retry}>
        Try again
      </Button>
    </Page>
  );
}
