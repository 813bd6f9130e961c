// Regrading: every grade of the sample's matrix that its results meet, the most comfortable first,
// for a heat that missed its grade. The results are sent as they are judged: corrected means, or bounds.
import { useMutation } from '@tanstack/react-query';
import { api, unwrap } from '../../../api/client.ts';
import { Button } from '../../../components/ui/button.tsx';
import { ProblemAlert } from '../../../components/ui/feedback.tsx';
import type { Sample } from '../api/samples.ts';

function compositionOf(sample: Sample): Record<string, string> {
  const composition: Record<string, string> = {};
  for (const r of sample.results) {
    if (r.qualifier && r.reported !== null) composition[r.element] = `${r.qualifier}${r.reported}`;
    else if (r.mean !== null) composition[r.element] = String(r.mean);
  }
  return composition;
}

export function OtherGrades({ sample }: { sample: Sample }) {
  const match = useMutation({ mutationFn: () => unwrap(api.POST('/grades/match', { body: { composition: compositionOf(sample) } })) });
  return (
    <div className="space-y-2" data-testid="other-grades">
      <Button variant="secondary" onClick={() => match.mutate()} disabled={match.isPending}>
        {match.isPending ? 'Looking…' : 'Find another grade it meets'}
      </Button>
      <ProblemAlert error={match.error} />
      {match.data && match.data.data.length === 0 && <p className="text-sm text-slag-500">No grade of this matrix is met.</p>}
      {match.data && match.data.data.length > 0 && (
        <ul className="list-disc pl-5 text-sm">
          {match.data.data.map((m) => (
            <li key={m.grade.code}>
              <span className="font-mono">{m.grade.code}</span> (version {m.grade.version}) — {m.grade.title}; smallest margin{' '}
              <span className="font-mono">{m.smallest_margin ?? '—'}</span> %
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
