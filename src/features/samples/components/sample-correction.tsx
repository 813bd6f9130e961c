import { Link } from 'react-router';
import type { Sample } from '../api/samples.ts';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

/** Which drift correction produced the results: the set(s), how they were chosen, and on what. */
export function SampleCorrection({ correction }: { correction: Sample['correction'] }) {
  if (!correction) {
    return (
      <p className="mt-3 text-sm" data-testid="sample-correction">
        <span className="text-slag-500">Drift correction:</span> none — no correction set was in force for these burns; results are the
        measured values.
      </p>
    );
  }
  const sets = correction.set_id ? [correction.set_id] : correction.set_ids;
  return (
    <div className="mt-3 text-sm" data-testid="sample-correction">
      <p>
        <span className="text-slag-500">Drift correction:</span> slope·x + offset applied to each burn&apos;s {correction.applied_to}, with{' '}
        {sets.length === 0
          ? 'no set (recomputed without correction)'
          : sets.map((id, i) => (
              <span key={id}>
                {i > 0 && ', '}
                <Link to={paths.driftRun(id)} className="font-mono text-copper-700 underline">
                  {id}
                </Link>
              </span>
            ))}
        {correction.selection === 'measurement_time' ? ' — the set in force when each burn was measured.' : ' — chosen on request.'}
      </p>
      {correction.selection === 'requested' && (
        <p className="mt-1 text-xs text-slag-500">
          Recomputed by {correction.recomputed_by} at <Timestamp value={correction.recomputed_at} seconds className="font-mono" />: “
          {correction.reason}”
        </p>
      )}
    </div>
  );
}
