import { Link } from 'react-router';
import { Alert } from '../components/Alert';
import { Page } from '../components/Page';
import { paths } from '../lib/paths';

export function NotFoundRoute() {
  return (
    <Page title="Page not found" width="narrow">
      <Alert tone="info">
        There is no page at this address. <Link to={paths.home.href()}>Go to the start page</Link>.
      </Alert>
    </Page>
  );
}
