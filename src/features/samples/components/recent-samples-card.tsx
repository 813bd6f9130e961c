import { Link } from 'react-router';
import { ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Card } from '../../../components/ui/layout.tsx';
import { utcMinute } from '../../../lib/utc-time.ts';
import { useSamples } from '../api/samples.ts';
import { FlagList } from './flag-badges.tsx';
import { paths } from '../../../config/paths.ts';

const RECENT = 5;

export function RecentSamplesCard() {
  const samples = useSamples({}, '%', RECENT);
  const rows = samples.data?.pages[0]?.data ?? [];
  return (
    <Card title="Recent samples">
      {samples.isPending && <Spinner label="Loading samples…" />}
      <ProblemAlert error={samples.error} />
      {!samples.isPending && !samples.error && rows.length === 0 && <p className="text-sm text-slag-500">No samples yet.</p>}
      {rows.length > 0 && (
        <ul className="divide-y divide-ash-100 text-sm">
          {rows.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-1.5">
              <span>
                <Link to={paths.sample(s.id)} className="font-mono text-copper-700 underline">
                  {s.sample_code}
                </Link>
                <span className="ml-2 text-slag-500">{[s.heat, s.grade].filter(Boolean).join(' · ')}</span>
              </span>
              <span className="flex items-center gap-2">
                <FlagList flags={s.flags} />
                <span className="font-mono text-xs text-slag-500">{utcMinute(s.created_at)}</span>
              </span>
            </li>
          ))}
        </ul>
      )}
      <Link to={paths.samples} className="mt-3 inline-block text-sm text-copper-700 underline">
        All samples →
      </Link>
    </Card>
  );
}
