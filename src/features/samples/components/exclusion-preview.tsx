// Inside the exclusion dialog: what the change would do to the results, from the server's
// preview (GET /samples/{id}/burns/{n}/exclusion-preview) — flags it clears or raises, reported
// values it moves, the verdict — so clearing "burns disagree" by excluding a burn is never silent.
import { Alert, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import type { BurnExclusionPreview } from '../api/samples.ts';
import { flagInfo } from '../result-flags.ts';

const VERDICT: Record<string, string> = { true: 'conforms', false: 'out of spec', undecided: 'cannot decide' };

function flagWords(flags: readonly string[]): string {
  return flags.map((f) => `“${flagInfo(f).label}”`).join(', ');
}

function Change({ change, unit }: { change: BurnExclusionPreview['changes'][number]; unit: string }) {
  const moved = change.reported_before !== change.reported_after;
  return (
    <li data-testid="preview-change" data-element={change.element}>
      <span className="font-mono font-semibold">{change.element}</span>
      {moved && (
        <>
          {' '}
          reported <span className="font-mono">{change.reported_before ?? 'nothing'}</span> →{' '}
          <span className="font-mono font-semibold">{change.reported_after ?? 'nothing'}</span> {unit}
        </>
      )}
      {change.flags_cleared.length > 0 && <>; clears {flagWords(change.flags_cleared)}</>}
      {change.flags_raised.length > 0 && <>; raises {flagWords(change.flags_raised)}</>}
    </li>
  );
}

export function ExclusionPreview({
  preview,
  error,
  pending,
}: {
  preview: BurnExclusionPreview | undefined;
  error: Error | null;
  pending: boolean;
}) {
  if (pending) return <Spinner label="Working out what this changes…" />;
  if (error) return <ProblemAlert error={error} />;
  if (!preview) return null;
  if (!preview.allowed)
    return (
      <Alert title="This burn cannot be changed">
        <p data-testid="preview-refusal">{preview.refusal}</p>
      </Alert>
    );
  const verdictMoves = preview.conforms_before !== preview.conforms_after;
  const clearsAttention = preview.changes.some((c) => c.flags_cleared.some((f) => flagInfo(f).tone !== 'note'));
  if (preview.changes.length === 0 && !verdictMoves)
    return (
      <p className="text-sm text-slag-700" data-testid="preview-none">
        No reported value, flag or verdict changes.
      </p>
    );
  return (
    <Alert tone="caution" title={clearsAttention ? 'This clears a flag and changes the results' : 'This changes the results'}>
      <ul className="list-disc space-y-0.5 pl-5" data-testid="exclusion-preview">
        {preview.changes.map((change) => (
          <Change key={change.element} change={change} unit={preview.unit} />
        ))}
        {verdictMoves && (
          <li data-testid="preview-verdict">
            Verdict against the grade: {VERDICT[preview.conforms_before ?? ''] ?? 'none'} →{' '}
            <strong>{VERDICT[preview.conforms_after ?? ''] ?? 'none'}</strong>
          </li>
        )}
      </ul>
      {clearsAttention && (
        <p className="mt-2">
          Exclude a burn for what was wrong with it (a pore, an off-centre burn mark), not because its flag is inconvenient: the reason is
          kept in the audit trail with the results before and after.
        </p>
      )}
    </Alert>
  );
}
