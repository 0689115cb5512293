import { Link } from 'react-router';
import { Alert } from '#src/components/Alert';
import { Loading } from '#src/components/Page';
import { Table, td, th } from '#src/components/Table';
import { formatDateTime } from '#src/lib/format';
import { paths } from '#src/lib/paths';
import { useOutbox } from '../api/get-outbox';

export function OutboxList() {
  const outbox = useOutbox();
  // A failed background poll keeps the list on screen; only a first load that fails shows the error.
  if (outbox.data === undefined) {
    return outbox.isError ? <Alert tone="error">{outbox.error.message}</Alert> : <Loading label="Loading the outbox…" />;
  }
  if (outbox.data.length === 0) return <p className="text-ink-soft">No mail has been sent yet.</p>;
  return (
    <Table
      caption="Captured messages, newest first"
      head={
        <tr>
          <th scope="col" className={th}>
            Received
          </th>
          <th scope="col" className={th}>
            To
          </th>
          <th scope="col" className={th}>
            Subject
          </th>
        </tr>
      }
    >
      {outbox.data.map((message) => (
        <tr key={message.id}>
          <td className={`${td} whitespace-nowrap text-ink-soft`}>
            <time dateTime={message.receivedAt}>{formatDateTime(message.receivedAt)}</time>
          </td>
          <td className={td}>{message.to}</td>
          <th scope="row" className={`${td} font-normal`}>
            <Link to={paths.adminOutboxMessage.href(message.id)}>{message.subject || '(no subject)'}</Link>
          </th>
        </tr>
      ))}
    </Table>
  );
}
