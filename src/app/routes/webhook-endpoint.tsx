import { Link, useParams } from 'react-router';
import { Alert, ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { Badge, Card, PageHeader } from '../../components/ui/layout.tsx';
import { hasScope, useMe } from '../../api/me.ts';
import { paths } from '../../config/paths.ts';
import { RequireScope } from '../../features/auth/components/require-scope.tsx';
import { useWebhookEndpoint } from '../../features/webhooks/api/endpoints.ts';
import { DeliveriesTable } from '../../features/webhooks/components/deliveries-table.tsx';
import { EndpointActions } from '../../features/webhooks/components/endpoint-actions.tsx';
import { RecoverForm } from '../../features/webhooks/components/recover-form.tsx';
import { Timestamp } from '../../components/ui/timestamp.tsx';
import { formatInstant } from '../../lib/timestamp.ts';

export function WebhookEndpointPage() {
  const { id = '' } = useParams();
  const { data: me } = useMe();
  const canWrite = hasScope(me, 'webhooks:write');
  const endpoint = useWebhookEndpoint(id);
  const e = endpoint.data;
  return (
    <RequireScope scope="webhooks:read">
      <PageHeader
        title="Webhook endpoint"
        description={<span className="font-mono">{e?.url ?? id}</span>}
        actions={
          <Link to={paths.webhooks} className="text-sm text-copper-700 underline">
            ← All endpoints
          </Link>
        }
      />
      {endpoint.isPending && <Spinner label="Loading the endpoint…" />}
      <ProblemAlert error={endpoint.error} />
      {e && (
        <div className="space-y-6">
          <Card>
            <div className="space-y-3 text-sm">
              <p>
                <Badge tone={e.enabled ? 'good' : 'bad'}>{e.enabled ? '✓ Enabled' : '✕ Disabled'}</Badge>{' '}
                {e.description && <span className="ml-2">{e.description}</span>}
              </p>
              {e.disabled_reason && (
                <Alert tone="caution" title="Disabled by Meltwire">
                  {e.disabled_reason}
                </Alert>
              )}
              {e.failing_since && (
                <Alert tone="caution" title={`Every attempt has failed since ${formatInstant(e.failing_since, { seconds: true })}`} />
              )}
              {e.previous_secret_expires_at && (
                <p className="text-slag-700">
                  Also signed with the previous secret until <Timestamp value={e.previous_secret_expires_at} seconds />.
                </p>
              )}
              <div className="flex flex-wrap gap-1">
                {e.event_types.map((type) => (
                  <code key={type} className="rounded bg-ash-100 px-1 text-xs">
                    {type}
                  </code>
                ))}
              </div>
              {canWrite && <EndpointActions endpoint={e} />}
            </div>
          </Card>
          {canWrite && (
            <Card title="Recover">
              <RecoverForm endpointId={e.id} />
            </Card>
          )}
          <section className="space-y-2">
            <h2 className="text-lg font-semibold">Deliveries</h2>
            <DeliveriesTable endpointId={e.id} canWrite={canWrite} />
          </section>
        </div>
      )}
    </RequireScope>
  );
}
