import { PageHeader } from '../../components/ui/layout.tsx';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { EventsFeed } from '../../features/events/components/events-feed.tsx';

export function EventsPage() {
  return (
    <RequireScope scope="events:read">
      <PageHeader
        title="Events feed"
        description="Every change Meltwire records, oldest first, as GET /api/v1/events hands it to integrations. Copy a cursor and pass it as after= to read on from there; webhooks carry the same events in the same order."
      />
      <EventsFeed />
    </RequireScope>
  );
}
