import { Button } from '../../../components/ui/button.tsx';
import { Drawer } from '../../../components/ui/drawer.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { useDelivery, type WebhookAttempt } from '../api/deliveries.ts';
import { DeliveryStatus } from './delivery-status.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

const OUTCOME: Record<WebhookAttempt['outcome'], string> = {
  delivered: '✓ Delivered',
  retry: '↻ Will be retried',
  failed: '✕ Failed, no more attempts',
  gone: '✕ 410 Gone: endpoint disabled',
};

/** One delivery with every attempt: time, HTTP status, duration, the start of the answer, the error. */
export function DeliveryDrawer({
  deliveryId,
  canRetry,
  retrying,
  onRetry,
  onClose,
}: {
  deliveryId: string | null;
  canRetry: boolean;
  retrying: boolean;
  onRetry: (id: string) => void;
  onClose: () => void;
}) {
  const delivery = useDelivery(deliveryId);
  const d = delivery.data;
  return (
    <Drawer open={!!deliveryId} title={d ? `Delivery of ${d.event_type}` : 'Delivery'} onClose={onClose}>
      {delivery.isPending && <Spinner label="Loading the attempts…" />}
      <ProblemAlert error={delivery.error} />
      {d && (
        <div className="space-y-4">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-slag-500">Status</dt>
            <dd>
              <DeliveryStatus status={d.status} />
            </dd>
            <dt className="text-slag-500">webhook-id</dt>
            <dd className="font-mono text-xs">{d.event_id}</dd>
            <dt className="text-slag-500">Next attempt</dt>
            <dd>
              <Timestamp value={d.next_attempt_at} seconds />
            </dd>
          </dl>
          {canRetry && d.status === 'failed' && (
            <Button onClick={() => onRetry(d.id)} disabled={retrying}>
              Retry now
            </Button>
          )}
          {d.attempt_log.length === 0 && <EmptyState title="No attempt yet">The first attempt is on its way.</EmptyState>}
          <ol className="space-y-3">
            {d.attempt_log.map((attempt) => (
              <li key={attempt.number} data-testid="attempt" className="rounded-md border border-ash-200 bg-white p-3 text-sm">
                <p className="font-medium">
                  Attempt {attempt.number} · <Timestamp value={attempt.started_at} seconds /> · {OUTCOME[attempt.outcome]}
                </p>
                <p className="mt-1 font-mono text-xs text-slag-700">
                  HTTP {attempt.status_code ?? '—'} · {Math.round(attempt.duration_ms)} ms
                </p>
                {attempt.error && <p className="mt-1 text-xs text-oxide-600">Error: {attempt.error}</p>}
                {attempt.response_excerpt && (
                  <pre className="mt-2 max-h-40 overflow-auto rounded bg-ash-100 p-2 text-xs">{attempt.response_excerpt}</pre>
                )}
              </li>
            ))}
          </ol>
        </div>
      )}
    </Drawer>
  );
}
