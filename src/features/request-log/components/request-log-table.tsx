import { Button } from '../../../components/ui/button.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { LoadMore } from '../../../components/ui/load-more.tsx';
import { Badge, Table } from '../../../components/ui/layout.tsx';
import { useRequestLog, type RequestLogFilters } from '../api/request-log.ts';
import { StatusBadge } from './status-badge.tsx';
import { Timestamp } from '../../../components/ui/timestamp.tsx';
import { formatInstant } from '../../../lib/timestamp.ts';

export function RequestLogTable({ filters, onOpen }: { filters: RequestLogFilters; onOpen: (id: string) => void }) {
  const log = useRequestLog(filters);
  const rows = log.data?.pages.flatMap((page) => page.data) ?? [];
  return (
    <div className="space-y-3">
      <ProblemAlert error={log.error} />
      {log.isPending && <Spinner label="Loading calls…" />}
      {!log.isPending && !log.error && rows.length === 0 && (
        <EmptyState title="No calls match">
          Calls to /api/v1 appear here as soon as they are answered. Try wider filters, or make a call with a key. The console's own calls
          are hidden unless you tick the box above.
        </EmptyState>
      )}
      {rows.length > 0 && (
        <Table head={['When', 'Method', 'Path', 'Status', 'ms', 'Caller', '']} caption="Calls to the API, newest first">
          {rows.map((entry) => (
            <tr key={entry.id} className="align-top hover:bg-ash-50" data-testid="request-log-row">
              <td className="px-2 py-2 font-mono text-xs">
                {/* Date above time, so the path keeps its width on a 1024 px tablet. */}
                <Timestamp value={entry.occurred_at} seconds stacked />
              </td>
              <td className="px-2 py-2 font-mono text-xs font-semibold">{entry.method}</td>
              <td className="min-w-40 max-w-md break-all px-2 py-2 font-mono text-xs">
                {entry.path}
                {entry.query && <span className="text-slag-500">?{entry.query}</span>}
                {entry.replay_of && (
                  <span className="ml-2">
                    <Badge tone="accent">replay</Badge>
                  </span>
                )}
                {entry.from_console && (
                  <span className="ml-2">
                    <Badge tone="neutral">console</Badge>
                  </span>
                )}
              </td>
              <td className="px-2 py-2">
                <StatusBadge status={entry.status} />
              </td>
              <td className="px-2 py-2 text-right font-mono text-xs">{entry.duration_ms.toFixed(1)}</td>
              <td className="max-w-48 break-words px-2 py-2 text-xs">
                {entry.caller.label ?? 'anonymous'} <span className="text-slag-500">({entry.caller.type.replace('_', ' ')})</span>
              </td>
              <td className="px-2 py-2 text-right">
                <Button
                  variant="ghost"
                  onClick={() => onOpen(entry.id)}
                  aria-label={`Details of ${entry.method} ${entry.path} at ${formatInstant(entry.occurred_at, { seconds: true })}`}
                >
                  Details
                </Button>
              </td>
            </tr>
          ))}
        </Table>
      )}
      <LoadMore list={log} />
    </div>
  );
}
