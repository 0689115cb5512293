import { useParams } from 'react-router';
import { OutboxMessageView } from '../features/admin/components/OutboxMessageView';

export function AdminOutboxMessageRoute() {
  const { messageId = '' } = useParams();
  return <OutboxMessageView key={messageId} messageId={messageId} />;
}
