// The columns the server flagged as often misread, each with a choice (ignore, another element,
// an identification field, keep), saved into an import profile; the preview then runs again.
import { useState } from 'react';
import { Button } from '../../../components/ui/button.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import { TextField } from '../../../components/ui/field.tsx';
import type { ImportProfile } from '../../../api/lookups.ts';
import type { ImportPreview } from '../api/imports.ts';
import { useSaveColumnDecisions } from '../api/save-column-decisions.ts';
import {
  blocksImport,
  type ColumnDecision,
  decisionProblem,
  needsDecision,
  type PreviewColumn,
  suggestedFieldKey,
} from '../column-decisions.ts';
import { ColumnDecisionChoice } from './column-decision-choice.tsx';

function initialDecision(column: PreviewColumn): ColumnDecision | undefined {
  // An element the method does not list is kept unless someone decides otherwise; a computed
  // index or the balance element has no default: a person must choose.
  return blocksImport(column) ? undefined : { action: 'keep' };
}

export function ColumnDecisionsPanel({
  preview,
  profile,
  fileName,
  onSaved,
}: {
  preview: ImportPreview;
  profile: ImportProfile | undefined;
  fileName: string;
  onSaved: (profile: ImportProfile) => void;
}) {
  const flagged = preview.layout.columns.filter(needsDecision);
  const [decisions, setDecisions] = useState<Record<string, ColumnDecision | undefined>>(() =>
    Object.fromEntries(flagged.map((c) => [c.header, initialDecision(c)])),
  );
  const [name, setName] = useState(`Columns of ${fileName}`.slice(0, 100));
  const [tried, setTried] = useState(false);
  const save = useSaveColumnDecisions();
  if (flagged.length === 0) return null;

  const headerRow = preview.warnings.find((w) => w.column === flagged[0].header)?.line ?? 1;
  const problems = flagged.map((c) => decisionProblem(decisions[c.header]));
  const nameProblem = !profile && name.trim() === '' ? 'Name the new import profile.' : undefined;

  function submit() {
    setTried(true);
    if (problems.some(Boolean) || nameProblem) return;
    save.mutate(
      {
        profile,
        name: name.trim(),
        layout: preview.layout.layout,
        headerRow,
        decisions: flagged.map((column) => ({ column, decision: decisions[column.header]! })),
      },
      { onSuccess: onSaved },
    );
  }

  const blocking = flagged.filter(blocksImport).length;
  return (
    <section
      aria-labelledby="column-decisions-heading"
      className="space-y-4 rounded-lg border border-ember-500/50 bg-ember-500/5 p-5"
      data-testid="column-decisions"
    >
      <div className="space-y-1">
        <h3 id="column-decisions-heading" className="text-base font-semibold text-slag-900">
          ⚠ {flagged.length === 1 ? '1 column needs' : `${flagged.length} columns need`} a decision before import
        </h3>
        <p className="text-sm text-slag-700">
          These headers are often read wrongly. Say what each one holds; the choices are saved in an import profile, so files of this kind
          are read the same way next time.
          {blocking > 0 && ' The import waits until the columns marked “required” are decided.'}
        </p>
      </div>
      <div className="space-y-3">
        {flagged.map((column, i) => (
          <ColumnDecisionChoice
            key={column.header}
            column={column}
            decision={decisions[column.header]}
            suggestedKey={suggestedFieldKey(column)}
            problem={tried ? problems[i] : null}
            disabled={save.isPending}
            onChange={(decision) => setDecisions((d) => ({ ...d, [column.header]: decision }))}
          />
        ))}
      </div>
      <div className="flex flex-wrap items-end justify-end gap-3">
        {!profile && (
          <div className="w-full max-w-sm">
            <TextField
              label="Name of the new import profile"
              value={name}
              maxLength={100}
              onChange={(e) => setName(e.target.value)}
              error={tried ? nameProblem : undefined}
              disabled={save.isPending}
            />
          </div>
        )}
        <Button onClick={submit} disabled={save.isPending}>
          {save.isPending ? 'Saving…' : profile ? `Save the choices into “${profile.name}”` : 'Save the choices as a new profile'}
        </Button>
      </div>
      <ProblemAlert error={save.error} />
    </section>
  );
}
