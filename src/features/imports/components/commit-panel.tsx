import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/feedback.tsx';
import type { ImportMode, ImportPreview } from '../api/imports.ts';
import { blocksImport } from '../column-decisions.ts';
import { importPlan } from '../import-plan.ts';

const MODES: { value: ImportMode; title: string; text: string }[] = [
  {
    value: 'all_or_nothing',
    title: 'Whole file or nothing (recommended)',
    text: 'The file is stored only if every line can be read. If one cannot, nothing is stored and the lines are listed, so the file can be corrected and uploaded again.',
  },
  {
    value: 'per_sample',
    title: 'Sample by sample',
    text: 'A sample with a line that cannot be read is left out and listed in the report; the other samples are stored.',
  },
];

/** Step 2: choose how strictly to import, read what will happen to the lab's data, then import. */
export function CommitPanel({
  preview,
  mode,
  onMode,
  onCommit,
  onRestart,
  busy,
}: {
  preview: ImportPreview;
  mode: ImportMode;
  onMode: (mode: ImportMode) => void;
  onCommit: () => void;
  onRestart: () => void;
  busy: boolean;
}) {
  const undecided = preview.layout.columns.filter(blocksImport).map((c) => c.header);
  const outsideMethod = preview.layout.columns.filter((c) => c.attention && !blocksImport(c)).map((c) => `“${c.header}”`);
  const plan = importPlan(preview, mode);
  const blocked = undecided.length > 0 && !preview.duplicate_of;
  return (
    <section aria-labelledby="commit-heading" className="space-y-4 rounded-lg border border-ash-200 bg-white p-5">
      <h2 id="commit-heading" className="text-lg font-semibold">
        Import
      </h2>
      <fieldset className="space-y-2" disabled={busy}>
        <legend className="mb-1 text-sm font-medium text-slag-800">When a line cannot be read</legend>
        {MODES.map((m) => (
          <label
            key={m.value}
            className="flex cursor-pointer gap-3 rounded-md border border-ash-200 p-3 text-sm has-[:checked]:border-ember-500 has-[:checked]:bg-ember-500/5"
          >
            <input
              type="radio"
              name="import-mode"
              value={m.value}
              checked={mode === m.value}
              onChange={() => onMode(m.value)}
              className="mt-0.5 accent-ember-600"
            />
            <span>
              <span className="block font-medium">{m.title}</span>
              <span className="block text-slag-700">{m.text}</span>
            </span>
          </label>
        ))}
      </fieldset>
      {blocked ? (
        <Alert tone="caution" title="Decide the flagged columns first">
          The file is not imported until you say what {undecided.map((h) => `“${h}”`).join(' and ')}{' '}
          {undecided.length === 1 ? 'holds' : 'hold'} and save the choices above.
        </Alert>
      ) : (
        <Alert tone={plan.canProceed ? 'info' : 'caution'} title={plan.title}>
          <span data-testid="import-plan">{plan.text}</span>
          {outsideMethod.length > 0 && !preview.duplicate_of && (
            <span className="mt-1 block" data-testid="import-plan-kept">
              {outsideMethod.join(', ')} {outsideMethod.length === 1 ? 'is' : 'are'} not in the method and will be kept as read unless you
              save other choices above.
            </span>
          )}
        </Alert>
      )}
      <div className="flex flex-wrap justify-end gap-2">
        <Button variant="secondary" onClick={onRestart} disabled={busy}>
          Choose another file
        </Button>
        <Button onClick={onCommit} disabled={busy || blocked || !plan.canProceed}>
          {plan.button}
        </Button>
      </div>
    </section>
  );
}
