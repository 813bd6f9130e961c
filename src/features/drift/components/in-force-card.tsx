import { Link } from 'react-router';
import { Card } from '../../../components/ui/layout.tsx';
import { useCorrectionsInForce } from '../api/standardizations.ts';
import { FlagBadge } from './flag-badge.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

/** The set in force now for an instrument and method, or a plain statement that there is none. */
export function InForceCard({ instrumentId, methodId }: { instrumentId: string; methodId: string }) {
  const corrections = useCorrectionsInForce(instrumentId);
  const entry = corrections.data?.data.find((d) => d.method.id === methodId);
  return (
    <Card title="Correction set in force" className="min-w-72">
      {corrections.isPending ? (
        <p className="text-sm text-slag-500">Loading…</p>
      ) : !entry ? (
        <p className="text-sm text-slag-800" data-testid="in-force">
          None: results of this instrument and method are not drift-corrected.
        </p>
      ) : (
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm" data-testid="in-force">
          <dt className="text-slag-500">Measured</dt>
          <dd className="font-mono text-xs">
            <Timestamp value={entry.set.measured_at} />
          </dd>
          <dt className="text-slag-500">In force since</dt>
          <dd className="font-mono text-xs">
            <Timestamp value={entry.set.activation?.effective_from} />
          </dd>
          <dt className="text-slag-500">Activated by</dt>
          <dd>{entry.set.activation?.activated_by}</dd>
          <dt className="text-slag-500">Flag</dt>
          <dd>
            <FlagBadge flag={entry.set.flag} />
          </dd>
          <dd className="col-span-2 pt-1">
            <Link className="text-copper-700 underline" to={paths.driftRun(entry.set.id)}>
              Open the set
            </Link>
          </dd>
        </dl>
      )}
    </Card>
  );
}
