import { Navigate } from 'react-router';
import { Landing } from '../features/landing/components/Landing';
import { homeAfterSignIn } from '../lib/paths';
import { useMe } from '../lib/session';

/** `/`: the Studies area when signed in; what Spoolbook does, with the demo a click away, otherwise. */
export function HomeRoute() {
  const me = useMe();
  return me.data ? <Navigate to={homeAfterSignIn} replace /> : <Landing />;
}
