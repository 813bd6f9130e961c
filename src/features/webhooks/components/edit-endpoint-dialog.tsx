import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog, DialogFooter } from '../../../components/ui/dialog.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { useUpdateEndpoint, type WebhookEndpoint } from '../api/endpoints.ts';
import { ENDPOINT_FIELDS, EndpointFields, type EndpointDraft } from './endpoint-fields.tsx';

const draftOf = (endpoint: WebhookEndpoint): EndpointDraft => ({
  url: endpoint.url,
  description: endpoint.description ?? '',
  event_types: endpoint.event_types,
  enabled: endpoint.enabled,
});

export function EditEndpointDialog({ endpoint, open, onClose }: { endpoint: WebhookEndpoint; open: boolean; onClose: () => void }) {
  const [draft, setDraft] = useState(() => draftOf(endpoint));
  const update = useUpdateEndpoint(endpoint.id);

  function close() {
    update.reset();
    setDraft(draftOf(endpoint));
    onClose();
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    update.mutate({ ...draft, description: draft.description.trim() || null }, { onSuccess: close });
  }

  return (
    <Dialog open={open} title="Edit the endpoint" onClose={close}>
      <form onSubmit={submit} className="space-y-4" noValidate>
        <ProblemAlert error={update.error} fields={ENDPOINT_FIELDS} />
        <EndpointFields draft={draft} onChange={setDraft} error={update.error} />
        <DialogFooter>
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" disabled={update.isPending}>
            Save changes
          </Button>
        </DialogFooter>
      </form>
    </Dialog>
  );
}
