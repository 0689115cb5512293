import { Navigate } from 'react-router';
import { homeAfterSignIn, paths } from '../lib/paths';
import { useMe } from '../lib/session';

/** `/`: the Studies area when signed in, sign-in otherwise. */
export function HomeRoute() {
  const me = useMe();
  return <Navigate to={me.data ? homeAfterSignIn : paths.signIn.href()} replace />;
}
