// Release and amend a sample from its page. Release asks for a comment, and for a concession when
// the sample does not conform or cannot be judged; an amendment asks for the reason and the burns
// to exclude or include again. The server's answer (four eyes, concession, conflicts) is shown as is.
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog } from '../../../components/ui/dialog.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextAreaField, TextField } from '../../../components/ui/field.tsx';
import type { Sample } from '../api/samples.ts';
import { useAmendSample, useReleaseSample } from '../api/release.ts';
import { ControlAcknowledgement, useControlAcknowledgement } from './control-acknowledgement.tsx';

export function ReleaseDialog({ sample, open, onClose }: { sample: Sample; open: boolean; onClose: () => void }) {
  const [comment, setComment] = useState('');
  const [concede, setConcede] = useState(false);
  const release = useReleaseSample();
  const acknowledgement = useControlAcknowledgement(sample, release.error);
  const needsConcession = sample.conformance?.conforms !== true;
  const close = () => {
    release.reset();
    setComment('');
    setConcede(false);
    acknowledgement.reset();
    onClose();
  };
  function submit(event: FormEvent) {
    event.preventDefault();
    const body = {
      ...(comment.trim() ? { comment: comment.trim() } : {}),
      accept_nonconforming: needsConcession && concede,
      ...acknowledgement.body,
    };
    release.mutate({ id: sample.id, body }, { onSuccess: close });
  }
  return (
    <Dialog open={open} title={`Release ${sample.sample_code}`} onClose={close}>
      <form onSubmit={submit} className="space-y-4" noValidate>
        <p className="text-sm text-slag-700">
          Releasing authorises these results: they no longer change except through an amendment, which keeps this revision. Release under
          your laboratory&apos;s accredited review procedure.
        </p>
        {needsConcession && (
          <Alert
            tone="caution"
            title={sample.conformance ? 'This sample does not meet its grade, or cannot be judged' : 'This sample has no verdict'}
          >
            <label className="mt-2 flex items-center gap-2 text-sm">
              <input type="checkbox" checked={concede} onChange={(e) => setConcede(e.target.checked)} /> Release as a concession (a comment
              is required)
            </label>
          </Alert>
        )}
        <ControlAcknowledgement state={acknowledgement} />
        <ProblemAlert error={release.error} fields={['comment']} />
        <TextAreaField
          label={needsConcession ? 'Comment (required for a concession)' : 'Comment (optional)'}
          rows={3}
          value={comment}
          onChange={(e) => setComment(e.target.value)}
          maxLength={2000}
        />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" disabled={release.isPending || acknowledgement.blocking}>
            {release.isPending ? 'Releasing…' : 'Release'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}

const burnList = (text: string) =>
  text
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(Number)
    .filter((n) => Number.isInteger(n) && n > 0);

export function AmendDialog({ sample, open, onClose }: { sample: Sample; open: boolean; onClose: () => void }) {
  const [reason, setReason] = useState('');
  const [exclude, setExclude] = useState('');
  const [include, setInclude] = useState('');
  const amend = useAmendSample();
  const close = () => {
    amend.reset();
    setReason('');
    setExclude('');
    setInclude('');
    onClose();
  };
  function submit(event: FormEvent) {
    event.preventDefault();
    const body = {
      reason: reason.trim(),
      ...(burnList(exclude).length ? { exclude_burns: burnList(exclude) } : {}),
      ...(burnList(include).length ? { include_burns: burnList(include) } : {}),
    };
    amend.mutate({ id: sample.id, body }, { onSuccess: close });
  }
  return (
    <Dialog open={open} title={`Amend ${sample.sample_code} (revision ${sample.revision})`} onClose={close}>
      <form onSubmit={submit} className="space-y-4" noValidate>
        <p className="text-sm text-slag-700">
          An amendment makes revision {sample.revision + 1}; revision {sample.revision} stays readable exactly as it was released. Who,
          when, why and what changed are recorded.
        </p>
        <ProblemAlert error={amend.error} fields={['reason']} />
        <TextAreaField
          label="Reason (required)"
          rows={3}
          value={reason}
          onChange={(e) => setReason(e.target.value)}
          maxLength={2000}
          required
        />
        <TextField label="Exclude burns (numbers)" value={exclude} onChange={(e) => setExclude(e.target.value)} placeholder="e.g. 3" />
        <TextField label="Include burns again (numbers)" value={include} onChange={(e) => setInclude(e.target.value)} />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" variant="danger" disabled={amend.isPending}>
            {amend.isPending ? 'Amending…' : 'Amend'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
