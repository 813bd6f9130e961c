import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { useDeliveries, useRetryDelivery } from '../api/deliveries.ts';
import { DeliveryDrawer } from './delivery-drawer.tsx';
import { DeliveryStatus } from './delivery-status.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

/** An endpoint's delivery log; a row opens its attempts, a failed one can be retried. */
export function DeliveriesTable({ endpointId, canWrite }: { endpointId: string; canWrite: boolean }) {
  const deliveries = useDeliveries(endpointId);
  const retry = useRetryDelivery();
  const [openId, setOpenId] = useState<string | null>(null);
  const rows = deliveries.data?.pages.flatMap((page) => page.data) ?? [];
  if (deliveries.isPending) return <Spinner label="Loading deliveries…" />;
  if (deliveries.error) return <ProblemAlert error={deliveries.error} />;
  return (
    <div className="space-y-3">
      <ProblemAlert error={retry.error} />
      {rows.length === 0 ? (
        <EmptyState title="No deliveries yet">
          Events of the subscribed types appear here as they are sent. Send a test event to try the endpoint.
        </EmptyState>
      ) : (
        <Table
          head={['Status', 'Event type', 'Attempts', 'Last HTTP status', `Next retry (your time)`, 'Created (your time)', '']}
          caption="Deliveries"
        >
          {rows.map((delivery) => (
            <tr key={delivery.id} data-testid="delivery-row">
              <td className="px-3 py-2">
                <DeliveryStatus status={delivery.status} />
              </td>
              <td className="px-3 py-2 font-mono text-xs">{delivery.event_type}</td>
              <td className="px-3 py-2 text-right font-mono">{delivery.attempts}</td>
              <td className="px-3 py-2 font-mono">{delivery.last_status_code ?? '—'}</td>
              <td className="px-3 py-2 text-xs">
                <Timestamp value={delivery.next_attempt_at} seconds />
              </td>
              <td className="px-3 py-2 text-xs text-slag-500">
                <Timestamp value={delivery.created_at} seconds />
              </td>
              <td className="whitespace-nowrap px-3 py-2 text-right">
                <Button
                  variant="ghost"
                  onClick={() => setOpenId(delivery.id)}
                  aria-label={`Attempts of the ${delivery.event_type} delivery`}
                >
                  Attempts
                </Button>
                {canWrite && delivery.status === 'failed' && (
                  <Button variant="ghost" onClick={() => retry.mutate(delivery.id)} disabled={retry.isPending}>
                    Retry
                  </Button>
                )}
              </td>
            </tr>
          ))}
        </Table>
      )}
      <LoadMore list={deliveries} />
      <DeliveryDrawer
        deliveryId={openId}
        canRetry={canWrite}
        onRetry={(id) => retry.mutate(id)}
        retrying={retry.isPending}
        onClose={() => setOpenId(null)}
      />
    </div>
  );
}
