import { Link } from 'react-router';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import { paths } from '../../../config/paths.ts';
import { lastDeliveryOf, useWebhookEndpoints } from '../api/endpoints.ts';
import { DeliveryStatus } from './delivery-status.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

export function EndpointsTable() {
  const endpoints = useWebhookEndpoints();
  const rows = endpoints.data?.pages.flatMap((page) => page.data) ?? [];
  if (endpoints.isPending) return <Spinner label="Loading webhook endpoints…" />;
  if (endpoints.error) return <ProblemAlert error={endpoints.error} />;
  if (rows.length === 0) {
    return (
      <EmptyState title="No webhook endpoints yet">
        <p>
          A webhook endpoint is an address in your plant system that Meltwire calls the moment something happens — a sample created,
          released or out of spec — so nobody has to poll.
        </p>
        <p className="mt-2">
          Each delivery is signed as the Standard Webhooks specification describes (headers <code>webhook-id</code>,{' '}
          <code>webhook-timestamp</code>, <code>webhook-signature</code>). See <code>examples/webhook-receiver.ts</code> in the repository
          for a receiver that verifies signatures and ignores repeats.
        </p>
      </EmptyState>
    );
  }
  return (
    <div className="space-y-3">
      <Table head={['URL', 'Description', 'Event types', 'State', 'Last delivery', 'Created']} caption="Webhook endpoints">
        {rows.map((endpoint) => {
          const last = lastDeliveryOf(endpoint);
          return (
            <tr key={endpoint.id} data-testid="endpoint-row">
              <td className="px-3 py-2 font-mono text-xs">
                <Link to={paths.webhookEndpoint(endpoint.id)} className="text-copper-700 underline">
                  {endpoint.url}
                </Link>
              </td>
              <td className="px-3 py-2">{endpoint.description ?? '—'}</td>
              <td className="px-3 py-2">
                <div className="flex max-w-xs flex-wrap gap-1">
                  {endpoint.event_types.map((type) => (
                    <code key={type} className="rounded bg-ash-100 px-1 text-xs">
                      {type}
                    </code>
                  ))}
                </div>
              </td>
              <td className="px-3 py-2">
                <Badge tone={endpoint.enabled ? 'good' : 'bad'}>{endpoint.enabled ? '✓ Enabled' : '✕ Disabled'}</Badge>
              </td>
              <td className="px-3 py-2">{last ? <DeliveryStatus status={last.status} /> : '—'}</td>
              <td className="px-3 py-2 text-xs text-slag-500">
                <Timestamp value={endpoint.created_at} />
              </td>
            </tr>
          );
        })}
      </Table>
      <LoadMore list={endpoints} />
    </div>
  );
}
