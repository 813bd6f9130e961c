import { Link } from 'react-router';
import { Button } from '../../../components/ui/button.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { useRuns } from '../api/standardizations.ts';
import { FlagBadge, StatusText } from './flag-badge.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

const MODES: Record<string, string> = {
  two_point: 'Two-point',
  one_point_factor: 'One-point factor',
  one_point_offset: 'One-point offset',
  type: 'Type',
};

export function RunsTable({ instrumentId, methodId }: { instrumentId: string; methodId?: string }) {
  const runs = useRuns(instrumentId, methodId);
  const rows = runs.data?.pages.flatMap((page) => page.data) ?? [];
  if (runs.isPending) return <Spinner label="Loading runs…" />;
  if (runs.error) return <ProblemAlert error={runs.error} />;
  if (rows.length === 0)
    return <EmptyState title="No standardization runs yet">Run one with the high and low reference samples.</EmptyState>;
  return (
    <div className="space-y-3">
      <Table head={['Measured', 'Method', 'Mode', 'Flag', 'Elements flagged', 'State', '']} caption="Standardization runs">
        {rows.map((run) => {
          const flagged = run.corrections.filter((c) => c.flag !== 'ok').map((c) => c.element);
          return (
            <tr key={run.id} data-testid="run-row">
              <td className="px-3 py-2 font-mono text-xs">
                <Timestamp value={run.measured_at} />
              </td>
              <td className="px-3 py-2">{run.method.code}</td>
              <td className="px-3 py-2">{MODES[run.mode]}</td>
              <td className="px-3 py-2">
                <FlagBadge flag={run.flag} />
              </td>
              <td className="px-3 py-2 text-xs">{flagged.length ? flagged.join(', ') : '—'}</td>
              <td className="px-3 py-2">
                <StatusText status={run.status} inForce={run.in_force} effectiveFrom={run.activation?.effective_from ?? null} />
              </td>
              <td className="px-3 py-2 text-right">
                <Link
                  className="text-sm font-medium text-copper-700 underline"
                  to={paths.driftRun(run.id)}
                  aria-label={`Open the run of ${formatInstant(run.measured_at)}`}
                >
                  Open
                </Link>
              </td>
            </tr>
          );
        })}
      </Table>
      {runs.hasNextPage && (
        <Button variant="secondary" onClick={() => runs.fetchNextPage()} disabled={runs.isFetchingNextPage}>
          Load more
        </Button>
      )}
    </div>
  );
}
