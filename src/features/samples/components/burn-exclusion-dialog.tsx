import { useState, type FormEvent } from 'react';
import { isProblem } from '../../../api/problem.ts';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog } from '../../../components/ui/dialog.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextAreaField } from '../../../components/ui/field.tsx';
import { useBurnExclusionPreview, useSetBurnExclusion, type Burn } from '../api/samples.ts';
import type { OutputUnit } from '../filters.ts';
import { ExclusionPreview } from './exclusion-preview.tsx';

/** The server's own minimum (SetBurnExclusionRequest.reason), checked here first to say it sooner. */
const MIN_REASON = 3;

export function BurnExclusionDialog({
  sampleId,
  burn,
  unit,
  onClose,
}: {
  sampleId: string;
  burn: Burn | null;
  unit: OutputUnit;
  onClose: () => void;
}) {
  const [reason, setReason] = useState('');
  const [tooShort, setTooShort] = useState(false);
  const change = useSetBurnExclusion();
  const preview = useBurnExclusionPreview(sampleId, burn, unit);
  const refused = preview.data?.allowed === false;
  const excluding = !burn?.excluded;

  function close() {
    change.reset();
    setReason('');
    setTooShort(false);
    onClose();
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    if (!burn) return;
    if (reason.trim().length < MIN_REASON) {
      setTooShort(true);
      return;
    }
    change.mutate({ sampleId, burn: burn.number, excluded: excluding, reason: reason.trim() }, { onSuccess: close });
  }

  const conflict = isProblem(change.error, 409) ? change.error : null;
  const fieldError = tooShort
    ? `Say why, in a few words (at least ${MIN_REASON} characters).`
    : isProblem(change.error)
      ? change.error.fieldError('reason')
      : undefined;

  return (
    <Dialog open={!!burn} title={burn ? `${excluding ? 'Exclude' : 'Include'} burn ${burn.number}` : ''} onClose={close}>
      <form onSubmit={submit} className="space-y-4" noValidate>
        <p className="text-sm text-slag-700">
          {excluding
            ? 'The burn stays stored with its values; it no longer counts in the mean, SD and flags. The reason, you and the time are recorded in the audit trail.'
            : 'The burn counts in the results again. The reason, you and the time are recorded in the audit trail.'}
        </p>
        <ExclusionPreview preview={preview.data} error={preview.error} pending={preview.isPending && !!burn} />
        {conflict && !refused && (
          <Alert title="This burn cannot be changed">
            <p>{conflict.message}</p>
          </Alert>
        )}
        {!conflict && <ProblemAlert error={change.error} fields={['reason']} />}
        <TextAreaField
          label="Reason (required)"
          rows={3}
          value={reason}
          onChange={(e) => {
            setReason(e.target.value);
            setTooShort(false);
          }}
          error={fieldError}
          placeholder={excluding ? 'e.g. spark on a pore, burn mark off-centre' : 'e.g. excluded by mistake'}
          maxLength={500}
          required
        />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" variant={excluding ? 'danger' : 'primary'} disabled={change.isPending || refused}>
            {change.isPending ? 'Saving…' : excluding ? 'Exclude burn' : 'Include burn'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
