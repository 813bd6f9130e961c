import { Button } from '../../../components/ui/button.tsx';
import { Alert } from '../../../components/ui/feedback.tsx';
import type { ImportMode, ImportPreview } from '../api/imports.ts';

const MODES: { value: ImportMode; title: string; text: string }[] = [
  {
    value: 'all_or_nothing',
    title: 'All or nothing (recommended)',
    text: 'If any value in the file cannot be read, nothing is imported and the lines are listed, so the file can be corrected and uploaded whole.',
  },
  {
    value: 'per_sample',
    title: 'Per sample',
    text: 'Samples with an unreadable line are left out and listed in the report; every other sample is imported.',
  },
];

/** Step 2: choose how strictly to import, then commit. */
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
  const rejected = new Set(preview.rejected.map((issue) => issue.line)).size;
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
      {rejected > 0 && mode === 'all_or_nothing' && (
        <Alert tone="caution" title={`${rejected} rejected ${rejected === 1 ? 'line' : 'lines'} in this file`}>
          All or nothing will refuse the whole file. Choose “Per sample” to import the other samples, or correct the file first.
        </Alert>
      )}
      <div className="flex flex-wrap justify-end gap-2">
        <Button variant="secondary" onClick={onRestart} disabled={busy}>
          Choose another file
        </Button>
        <Button onClick={onCommit} disabled={busy}>
          {preview.duplicate_of
            ? 'Show the earlier import'
            : `Import ${preview.counts.samples} ${preview.counts.samples === 1 ? 'sample' : 'samples'}`}
        </Button>
      </div>
    </section>
  );
}
