// Create a grade, or add a version to one. Limits are typed as text so their decimals survive
// ("0.40" rounds to hundredths, "0.8" to tenths); the server checks everything again.
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { Dialog } from '../../../components/ui/dialog.tsx';
import { Alert, ProblemAlert } from '../../../components/ui/feedback.tsx';
import { SelectField, TextAreaField, TextField } from '../../../components/ui/field.tsx';
import { type Grade, useSaveGrade } from '../api/grades.ts';
import { limitsText, parseLimits } from '../limits-text.ts';

export function GradeForm({ grade, open, onClose }: { grade: Grade | null; open: boolean; onClose: () => void }) {
  const [draft, setDraft] = useState(() => ({
    code: grade?.code ?? '',
    title: grade?.title ?? '',
    standard: grade?.standard ?? '',
    edition: grade?.edition ?? '',
    matrix: grade?.matrix ?? 'Fe',
    decision_rule: grade?.decision_rule ?? 'rounding',
    remainder_element: grade?.remainder_element ?? '',
    limits: grade ? limitsText(grade.limits) : '',
    others_each: grade?.others_each ?? '',
    others_total: grade?.others_total ?? '',
    source_note: grade?.source_note ?? '',
  }));
  const [limitsError, setLimitsError] = useState<string | null>(null);
  const save = useSaveGrade();
  const set = (field: keyof typeof draft) => (event: { target: { value: string } }) =>
    setDraft((d) => ({ ...d, [field]: event.target.value }));
  const close = () => {
    save.reset();
    onClose();
  };

  function submit(event: FormEvent) {
    event.preventDefault();
    const parsed = parseLimits(draft.limits);
    if ('error' in parsed) return setLimitsError(parsed.error);
    setLimitsError(null);
    const optional = (value: string) => (value.trim() ? value.trim() : undefined);
    const body = {
      code: draft.code.trim(),
      title: draft.title.trim(),
      standard: draft.standard.trim(),
      edition: optional(draft.edition) ?? null,
      matrix: draft.matrix.trim(),
      decision_rule: draft.decision_rule as Grade['decision_rule'],
      remainder_element: optional(draft.remainder_element),
      limits: parsed.limits,
      others_each: optional(draft.others_each),
      others_total: optional(draft.others_total),
      source_note: optional(draft.source_note),
    };
    save.mutate({ existing: grade?.code ?? null, body }, { onSuccess: close });
  }

  return (
    <Dialog open={open} title={grade ? `New version of ${grade.code}` : 'New grade'} onClose={close}>
      <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate aria-label="Grade">
        <TextField label="Code" value={draft.code} onChange={set('code')} disabled={!!grade} placeholder="SAE 1045" />
        <TextField label="Title" value={draft.title} onChange={set('title')} />
        <TextField label="Standard" value={draft.standard} onChange={set('standard')} placeholder="SAE J403" />
        <TextField label="Edition" value={draft.edition} onChange={set('edition')} />
        <TextField label="Matrix element" value={draft.matrix} onChange={set('matrix')} />
        <SelectField label="Decision rule" value={draft.decision_rule} onChange={set('decision_rule')}>
          <option value="rounding">Rounding (ASTM E29)</option>
          <option value="absolute">Absolute</option>
        </SelectField>
        <div className="sm:col-span-2">
          <TextAreaField
            label="Limits, % (one per line: C 0.43–0.50, P 0.040, Si >=0.40)"
            rows={6}
            value={draft.limits}
            onChange={set('limits')}
            error={limitsError ?? undefined}
          />
        </div>
        <TextField label="Remainder element (by difference)" value={draft.remainder_element} onChange={set('remainder_element')} />
        <TextField label="Others each, max %" value={draft.others_each} onChange={set('others_each')} />
        <TextField label="Others total, max %" value={draft.others_total} onChange={set('others_total')} />
        <TextField label="Source" value={draft.source_note} onChange={set('source_note')} />
        <div className="sm:col-span-2 space-y-3">
          <Alert tone="caution" title="Verify against your licensed copy of the standard">
            Meltwire judges results against the limits as you type them here.
          </Alert>
          <ProblemAlert error={save.error} />
        </div>
        <div className="flex justify-end gap-2 sm:col-span-2">
          <Button variant="secondary" onClick={close}>
            Cancel
          </Button>
          <Button type="submit" disabled={save.isPending}>
            {save.isPending ? 'Saving…' : grade ? 'Save as a new version' : 'Create grade'}
          </Button>
        </div>
      </form>
    </Dialog>
  );
}
