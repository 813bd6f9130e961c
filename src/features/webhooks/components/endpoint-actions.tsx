import { useState } from 'react';
import { useNavigate } from 'react-router';
import { Button } from '../../../components/ui/button.tsx';
import { ConfirmDialog, Dialog } from '../../../components/ui/dialog.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SecretOnce } from '../../../components/ui/secret-once.tsx';
import { paths } from '../../../config/paths.ts';
import { useDeleteEndpoint, useRotateSecret, useUpdateEndpoint, type WebhookEndpoint } from '../api/endpoints.ts';
import { useSendTestEvent } from '../api/deliveries.ts';
import { EditEndpointDialog } from './edit-endpoint-dialog.tsx';
import { WEBHOOK_SECRET_WARNING } from './webhook-secret-warning.ts';

const OVERLAP_MINUTES = 24 * 60;

/** What a webhooks:write caller can do to an endpoint: edit, enable or disable, test, rotate, delete. */
export function EndpointActions({ endpoint }: { endpoint: WebhookEndpoint }) {
  const navigate = useNavigate();
  const [dialog, setDialog] = useState<'edit' | 'rotate' | 'delete' | null>(null);
  const update = useUpdateEndpoint(endpoint.id);
  const remove = useDeleteEndpoint(endpoint.id);
  const rotate = useRotateSecret(endpoint.id);
  const test = useSendTestEvent(endpoint.id);
  const close = () => {
    rotate.reset();
    setDialog(null);
  };
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => setDialog('edit')}>
          Edit
        </Button>
        <Button variant="secondary" onClick={() => update.mutate({ enabled: !endpoint.enabled })} disabled={update.isPending}>
          {endpoint.enabled ? 'Disable' : 'Enable'}
        </Button>
        <Button variant="secondary" onClick={() => test.mutate()} disabled={test.isPending || !endpoint.enabled}>
          Send test event
        </Button>
        <Button variant="secondary" onClick={() => setDialog('rotate')}>
          Rotate secret
        </Button>
        <Button variant="danger" onClick={() => setDialog('delete')}>
          Delete
        </Button>
      </div>
      <ProblemAlert error={update.error ?? test.error ?? remove.error} />
      {test.isSuccess && (
        <Alert tone="success" title="Test event queued">
          A meltwire.test delivery appears in the table below.
        </Alert>
      )}
      <EditEndpointDialog endpoint={endpoint} open={dialog === 'edit'} onClose={() => setDialog(null)} />
      <ConfirmDialog
        open={dialog === 'delete'}
        title="Delete this endpoint?"
        confirmLabel="Delete endpoint"
        busy={remove.isPending}
        onConfirm={() => remove.mutate(undefined, { onSuccess: () => void navigate(paths.webhooks) })}
        onClose={() => setDialog(null)}
      >
        <p>
          No more events are sent to <code>{endpoint.url}</code> and its delivery log is deleted. The events stay in the events feed.
        </p>
      </ConfirmDialog>
      {rotate.data ? (
        <Dialog open={dialog === 'rotate'} title="New signing secret" onClose={close}>
          <SecretOnce secret={rotate.data.secret} warning={WEBHOOK_SECRET_WARNING} testId="webhook-secret" onDone={close} />
        </Dialog>
      ) : (
        <ConfirmDialog
          open={dialog === 'rotate'}
          title="Rotate the signing secret?"
          confirmLabel="Rotate secret"
          busy={rotate.isPending}
          onConfirm={() => rotate.mutate(OVERLAP_MINUTES)}
          onClose={close}
        >
          <p>
            A new secret is made and shown once. For the next 24 hours every delivery carries two signatures, one with the new secret and
            one with the old, so the receiver keeps verifying while you switch it over. After that only the new secret signs.
          </p>
          <ProblemAlert error={rotate.error} />
        </ConfirmDialog>
      )}
    </div>
  );
}
