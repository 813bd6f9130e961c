import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog, DialogFooter } from '../../../components/ui/dialog.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SecretOnce } from '../../../components/ui/secret-once.tsx';
import { useCreateEndpoint } from '../api/endpoints.ts';
import { ENDPOINT_FIELDS, EndpointFields, type EndpointDraft } from './endpoint-fields.tsx';
import { WEBHOOK_SECRET_WARNING } from './webhook-secret-warning.ts';

const EMPTY: EndpointDraft = { url: '', description: '', event_types: [], enabled: true };

export function CreateEndpointDialog({ open, onClose }: { open: boolean; onClose: () => void }) {
  const [draft, setDraft] = useState(EMPTY);
  const create = useCreateEndpoint();

  function close() {
    create.reset();
    setDraft(EMPTY);
    onClose();
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    create.mutate({ ...draft, description: draft.description.trim() || undefined });
  }

  return (
    <Dialog open={open} title={create.data ? 'Endpoint subscribed' : 'Add a webhook endpoint'} onClose={close}>
      {create.data ? (
        <SecretOnce secret={create.data.secret} warning={WEBHOOK_SECRET_WARNING} testId="webhook-secret" onDone={close} />
      ) : (
        <form onSubmit={submit} className="space-y-4" noValidate>
          <ProblemAlert error={create.error} fields={ENDPOINT_FIELDS} />
          <EndpointFields draft={draft} onChange={setDraft} error={create.error} />
          <DialogFooter>
            <Button variant="secondary" onClick={close}>
              Cancel
            </Button>
            <Button type="submit" disabled={create.isPending}>
              Add endpoint
            </Button>
          </DialogFooter>
        </form>
      )}
    </Dialog>
  );
}
