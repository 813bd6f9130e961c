// Records the disposition of a control violation: cause and action. The instrument is in control
// again for the method once it is recorded.
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog, DialogFooter } from '../../../components/ui/dialog.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextAreaField } from '../../../components/ui/field.tsx';
import { useRecordDisposition } from '../api/control-samples.ts';

interface Props {
  instrumentId: string;
  instrumentCode: string;
  methodId: string;
  open: boolean;
  onClose: () => void;
}

export function DispositionDialog({ instrumentId, instrumentCode, methodId, open, onClose }: Props) {
  const [cause, setCause] = useState('');
  const [action, setAction] = useState('');
  const record = useRecordDisposition();
  const close = () => {
    record.reset();
    setCause('');
    setAction('');
    onClose();
  };
  function submit(event: FormEvent) {
    event.preventDefault();
    record.mutate({ instrumentId, body: { method_id: methodId, cause: cause.trim(), action: action.trim() } }, { onSuccess: close });
  }
  return (
    <Dialog open={open} title={`Record a disposition for ${instrumentCode}`} onClose={close}>
      <form onSubmit={submit} className="space-y-4" noValidate>
        <p className="text-sm text-slag-700">
          Say what caused the violation and what was done. {instrumentCode} is then in control again for this method; your disposition is
          recorded in its status history and the audit trail. Follow your laboratory&apos;s procedure for results measured since the
          violation.
        </p>
        <ProblemAlert error={record.error} fields={['cause', 'action']} />
        <TextAreaField label="Cause" rows={2} value={cause} onChange={(e) => setCause(e.target.value)} maxLength={2000} required />
        <TextAreaField
          label="Action"
          hint='e.g. "electrode re-gapped, control re-run in control"'
          rows={2}
          value={action}
          onChange={(e) => setAction(e.target.value)}
          maxLength={2000}
          required
        />
        <DialogFooter>
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" disabled={record.isPending || !cause.trim() || !action.trim()}>
            {record.isPending ? 'Recording…' : 'Record disposition'}
          </Button>
        </DialogFooter>
      </form>
    </Dialog>
  );
}
