// Confirms an activation. When an element is flagged fail, the override reason is required and
// the dialog says which elements fail and that the reason is recorded.
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog } from '../../../components/ui/dialog.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { type Standardization, useActivateRun } from '../api/standardizations.ts';

export function ActivateDialog({ run, open, onClose }: { run: Standardization; open: boolean; onClose: () => void }) {
  const [reason, setReason] = useState('');
  const activate = useActivateRun();
  const failing = run.corrections.filter((c) => c.flag === 'fail').map((c) => c.element);
  const needsReason = failing.length > 0;

  function close() {
    activate.reset();
    setReason('');
    onClose();
  }

  function submit(event: FormEvent) {
    event.preventDefault();
    activate.mutate({ id: run.id, override_reason: needsReason ? reason : undefined }, { onSuccess: close });
  }

  return (
    <Dialog open={open} title={needsReason ? 'Activate with an override' : 'Activate this correction set'} onClose={close}>
      <form onSubmit={submit} className="space-y-4" noValidate>
        <p className="text-sm text-slag-800">
          From now on every burn measured on <strong>{run.instrument.code}</strong> with <strong>{run.method.code}</strong> is corrected
          with this set. Results already stored are not changed.
        </p>
        {needsReason && (
          <>
            <Alert title={`${failing.join(', ')} ${failing.length === 1 ? 'is' : 'are'} flagged Fail`}>
              Activate only if the correction is acceptable anyway. Your reason is recorded with the activation and in the audit trail.
            </Alert>
            <div className="space-y-1">
              <label htmlFor="override-reason" className="block text-sm font-medium text-slag-800">
                Override reason
              </label>
              <textarea
                id="override-reason"
                className="w-full rounded-md border border-ash-200 bg-white px-3 py-2 text-sm focus:border-ember-500 focus:outline-none"
                rows={3}
                required
                minLength={3}
                value={reason}
                onChange={(e) => setReason(e.target.value)}
              />
            </div>
          </>
        )}
        <ProblemAlert error={activate.error} />
        <div className="flex justify-end gap-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" disabled={activate.isPending || (needsReason && reason.trim().length < 3)}>
            {needsReason ? 'Activate with override' : 'Activate'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
