import type { ReactNode } from 'react';
import { Link } from 'react-router';
import type { OutboxMessage } from '#shared/schemas/account';
import { Alert } from '#src/components/Alert';
import { Card } from '#src/components/Card';
import { Loading, Page } from '#src/components/Page';
import { isApiError } from '#src/lib/api-client';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useOutboxMessage } from '../api/get-outbox-message';

/** One captured message, with its links clickable so a developer can follow reset and invitation mails. */
export function OutboxMessageView({ messageId }: { messageId: string }) {
  const message = useOutboxMessage(messageId);
  if (message.data !== undefined) return <MessageDetail message={message.data} />;
  if (message.isPending) return <Loading label="Loading the message…" />;
  const missing = isApiError(message.error) && message.error.status === 404;
  return (
    <Page title="Message">
      <Alert tone="error" title={missing ? 'No such message' : 'Could not load the message'}>
        {!missing && <p>{message.error.message}</p>}
        <p>
          <Link to={paths.adminOutbox.href()}>Back to the outbox</Link>
        </p>
      </Alert>
    </Page>
  );
}

function MessageDetail({ message }: { message: OutboxMessage }) {
  return (
    <Page eyebrow="Outbox" title={message.subject || '(no subject)'} actions={<Link to={paths.adminOutbox.href()}>Back to the outbox</Link>}>
      <Card>
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[6rem_1fr]">
          <dt className="font-semibold text-ink-soft">From</dt>
          <dd>{message.from}</dd>
          <dt className="font-semibold text-ink-soft">To</dt>
          <dd>{message.to}</dd>
          <dt className="font-semibold text-ink-soft">Received</dt>
          <dd>
            <time dateTime={message.receivedAt}>{formatDateTime(message.receivedAt)}</time>
          </dd>
        </dl>
      </Card>
      <Card title="Text">
        <pre className="overflow-x-auto whitespace-pre-wrap break-words font-mono text-sm leading-6 text-ink">{linkify(message.text)}</pre>
      </Card>
      {message.html !== null && (
        <Card title="HTML part">
          {/* An empty sandbox: the mail's HTML can neither run scripts nor reach this page. */}
          <iframe title="HTML part of the message" sandbox="" srcDoc={message.html} className="h-96 w-full rounded border border-paper-line bg-white" />
        </Card>
      )}
    </Page>
  );
}

const URL_PATTERN = /https?:\/\/[^\s<>"'`]+/g;

/**
 * The message text with its web addresses as links. Links into this app open here as app
 * pages; when the mail names another origin (for example `localhost` while the app is opened
 * as 127.0.0.1), a second link opens the same page on this origin, keeping this browser's session.
 */
export function linkify(text: string): ReactNode[] {
  const parts: ReactNode[] = [];
  let last = 0;
  for (const match of text.matchAll(URL_PATTERN)) {
    const raw = match[0].replace(/[.,;:!?)\]]+$/, '');
    const start = match.index;
    if (start > last) parts.push(text.slice(last, start));
    parts.push(<MailLink key={start} href={raw} />);
    last = start + raw.length;
  }
  if (last < text.length) parts.push(text.slice(last));
  return parts;
}

function MailLink({ href }: { href: string }) {
  let url: URL;
  try {
    url = new URL(href);
  } catch {
    return <>{href}</>;
  }
  const appPath = `${url.pathname}${url.search}${url.hash}`;
  if (url.origin === window.location.origin) {
    return <Link to={appPath}>{href}</Link>;
  }
  const isAppLink = url.pathname.startsWith(paths.resetPassword.path) || url.pathname.startsWith('/invitations/');
  return (
    <>
      <a href={href} rel="noreferrer">
        {href}
      </a>
      {isAppLink && (
        <>
          {' '}
          <Link to={appPath} className="font-sans text-xs">
            (open on this site)
          </Link>
        </>
      )}
    </>
  );
}
