import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { OutboxList } from '../../features/outbox/outbox-list.tsx';

export function OutboxPage() {
  return (
    <RequireScope scope="users:write">
      <PageHeader
        title="Outbox"
        description="Without SMTP_URL, Meltwire keeps outgoing e-mail here instead of sending it (development and demos only)."
      />
      <OutboxList />
    </RequireScope>
  );
}
