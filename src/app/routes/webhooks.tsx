import { useState } from 'react';
import { Link } from 'react-router';
import { Button } from '../../components/ui/button.tsx';
import { PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { paths } from '../../config/paths.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { CreateEndpointDialog } from '../../features/webhooks/components/create-endpoint-dialog.tsx';
import { EndpointsTable } from '../../features/webhooks/components/endpoints-table.tsx';

export function WebhooksPage() {
  const { data: me } = useMe();
  const canWrite = hasScope(me, 'webhooks:write');
  const [creating, setCreating] = useState(false);
  return (
    <RequireScope scope="webhooks:read">
      <PageHeader
        title="Webhooks"
        description={
          <>
            Meltwire POSTs each event to the endpoints subscribed to its type, signed under Standard Webhooks, and retries for about a day.
            The same events, in the same order, are in the{' '}
            <Link to={paths.events} className="text-copper-700 underline">
              events feed
            </Link>
            .
          </>
        }
        actions={canWrite && <Button onClick={() => setCreating(true)}>Add an endpoint</Button>}
      />
      <EndpointsTable />
      {canWrite && <CreateEndpointDialog open={creating} onClose={() => setCreating(false)} />}
    </RequireScope>
  );
}
