import { isRouteErrorResponse, useRouteError } from 'react-router';
import { Alert } from '../components/Alert';
import { Button } from '../components/Button';
import { Page } from '../components/Page';
import { paths } from '../lib/paths';

/** What the router shows when a page throws or the start-up check of the session fails. */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Something went wrong.';
  return (
    <main id="main" className="px-4 py-12">
      <Page title="Something went wrong" width="narrow">
        <Alert tone="error">{message}</Alert>
        <div className="flex gap-3">
          <Button variant="primary" onClick={() => window.location.reload()}>
            Reload the page
          </Button>
          {/* A full page load: the router itself may be what failed. */}
          <a href={paths.home.href()} className="self-center">
            Start page
          </a>
        </div>
      </Page>
    </main>
  );
}
