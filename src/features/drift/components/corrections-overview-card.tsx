// The Overview's view of drift correction: per instrument, the correction set in force for each
// method, when its reference samples were measured and how long ago. A set older than a day is
// called out: labs re-standardize at least daily (common practice, no source).
import { Link } from 'react-router';
import { useInstruments, type Instrument } from '../../../api/lookups.ts';
import { ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Badge, Card } from '../../../components/ui/layout.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { formatAge } from '../../../lib/timestamp.ts';
import { useCorrectionsInForce } from '../api/standardizations.ts';
import { FlagBadge } from './flag-badge.tsx';
import { paths } from '../../../config/paths.ts';

const DAY_MS = 24 * 60 * 60 * 1000;

function InstrumentCorrections({ instrument }: { instrument: Instrument }) {
  const corrections = useCorrectionsInForce(instrument.id);
  const entries = corrections.data?.data ?? [];
  return (
    <li className="py-2" data-testid="corrections-instrument">
      <p className="font-medium text-slag-900">
        {instrument.code} <span className="font-normal text-slag-500">{instrument.name}</span>
      </p>
      {corrections.isPending && <p className="text-xs text-slag-500">Loading…</p>}
      <ProblemAlert error={corrections.error} />
      {corrections.data && entries.length === 0 && (
        <p className="text-sm text-slag-700">No correction set in force: its results are not drift-corrected.</p>
      )}
      {entries.length > 0 && (
        <ul className="mt-1 space-y-1">
          {entries.map(({ method, set }) => {
            const stale = Date.now() - Date.parse(set.measured_at) > DAY_MS;
            return (
              <li key={method.id} className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm">
                <span className="font-mono">{method.code}</span>
                <Link className="text-copper-700 underline" to={paths.driftRun(set.id)}>
                  measured <Timestamp value={set.measured_at} className="font-mono text-xs" />
                </Link>
                <Badge tone={stale ? 'accent' : 'neutral'}>
                  {formatAge(set.measured_at)} old{stale ? ' — more than a day' : ''}
                </Badge>
                <FlagBadge flag={set.flag} />
              </li>
            );
          })}
        </ul>
      )}
    </li>
  );
}

export function CorrectionsOverviewCard() {
  const instruments = useInstruments();
  return (
    <Card title="Corrections in force">
      {instruments.isPending && <Spinner label="Loading instruments…" />}
      <ProblemAlert error={instruments.error} />
      {instruments.data?.length === 0 && <p className="text-sm text-slag-500">No instruments set up yet.</p>}
      {instruments.data && instruments.data.length > 0 && (
        <ul className="divide-y divide-ash-100" aria-label="Corrections in force">
          {instruments.data.map((instrument) => (
            <InstrumentCorrections key={instrument.id} instrument={instrument} />
          ))}
        </ul>
      )}
      <Link to={paths.drift} className="mt-3 inline-block text-sm text-copper-700 underline">
        Drift charts and runs →
      </Link>
    </Card>
  );
}
