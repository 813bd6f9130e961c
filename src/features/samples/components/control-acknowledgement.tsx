// While the sample's instrument is `verify` for its method (a control point broke a run rule), a
// release of a sample measured after that point needs an acknowledgement saying how the result was
// checked. Shown when the instrument's status says so, or when the server answers that it is needed.
import { useState } from 'react';
import { controlOf, useInstrumentStatus } from '../../../api/instrument-status.ts';
import type { ApiProblem } from '../../../api/problem.ts';
import { Alert } from '../../../components/ui/feedback.tsx';
import { TextAreaField } from '../../../components/ui/field.tsx';
import type { Sample } from '../api/samples.ts';

export function useControlAcknowledgement(sample: Sample, error: ApiProblem | Error | null) {
  const status = useInstrumentStatus(sample.instrument.id);
  const [checked, setChecked] = useState(false);
  const [comment, setComment] = useState('');
  const control = controlOf(status.data, sample.method.id);
  const asked = !!error?.message.includes('acknowledge_control');
  const shown = control?.status === 'verify' || asked;
  return {
    shown,
    control,
    instrumentCode: sample.instrument.code,
    checked,
    setChecked,
    comment,
    setComment,
    /** Ticked without saying how the result was checked. */
    blocking: checked && comment.trim().length === 0,
    body: shown && checked && comment.trim() ? { acknowledge_control: { comment: comment.trim() } } : {},
    reset() {
      setChecked(false);
      setComment('');
    },
  };
}

export function ControlAcknowledgement({ state }: { state: ReturnType<typeof useControlAcknowledgement> }) {
  if (!state.shown) return null;
  const rules = state.control?.reason?.violations.map((v) => `${v.element}: ${v.title}`).join('; ');
  return (
    <Alert tone="caution" title={`${state.instrumentCode} is in verify: a control point broke a run rule`}>
      {rules && <p>{rules}.</p>}
      <p>Results measured since that control point must be checked before release, under your laboratory&apos;s procedure.</p>
      <label className="mt-2 flex items-center gap-2 text-sm">
        <input type="checkbox" name="acknowledge_control" checked={state.checked} onChange={(e) => state.setChecked(e.target.checked)} />I
        checked this result despite the control violation (acknowledge_control)
      </label>
      {state.checked && (
        <div className="mt-2">
          <TextAreaField
            label="How the result was checked (recorded with the release)"
            rows={2}
            value={state.comment}
            onChange={(e) => state.setComment(e.target.value)}
            maxLength={2000}
            required
          />
        </div>
      )}
    </Alert>
  );
}
