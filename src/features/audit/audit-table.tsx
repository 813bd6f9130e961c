import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { api, unwrap } from '../../api/client.ts';
import { Button } from '../../components/ui/button.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../components/ui/feedback.tsx';
import { TextField } from '../../components/ui/field.tsx';
import { Table } from '../../components/ui/layout.tsx';
import { auditKeys } from '../../api/query-keys.ts';
import { Timestamp } from '../../components/ui/timestamp.tsx';

const auditQuery = (action: string, targetId: string) =>
  infiniteQueryOptions({
    queryKey: auditKeys.list({ action, targetId }),
    queryFn: ({ pageParam }) =>
      unwrap(
        api.GET('/audit-events', {
          params: { query: { limit: 50, cursor: pageParam, action: action || undefined, target_id: targetId || undefined } },
        }),
      ),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (page) => page.next_cursor ?? undefined,
  });

function Json({ value }: { value: unknown }) {
  if (value === null || value === undefined) return <span className="text-slag-300">—</span>;
  return (
    <details>
      <summary className="cursor-pointer text-xs text-copper-700">show</summary>
      <pre className="mt-1 max-w-md overflow-x-auto rounded bg-ash-100 p-2 text-xs">{JSON.stringify(value, null, 2)}</pre>
    </details>
  );
}

export function AuditTable() {
  const [action, setAction] = useState('');
  const [targetId, setTargetId] = useState('');
  const events = useInfiniteQuery(auditQuery(action.trim(), targetId.trim()));
  const rows = events.data?.pages.flatMap((page) => page.data) ?? [];
  return (
    <div className="space-y-3">
      <div className="grid max-w-xl grid-cols-2 gap-3">
        <TextField label="Action" placeholder="e.g. user.updated" value={action} onChange={(e) => setAction(e.target.value)} />
        <TextField label="Target id" placeholder="e.g. usr_…" value={targetId} onChange={(e) => setTargetId(e.target.value)} />
      </div>
      <ProblemAlert error={events.error} />
      {events.isPending && <Spinner label="Loading the audit trail…" />}
      {!events.isPending && rows.length === 0 && <EmptyState title="No audit events match" />}
      {rows.length > 0 && (
        <Table head={['When', 'Actor', 'Action', 'Target', 'Before', 'After']} caption="Audit events">
          {rows.map((event) => (
            <tr key={event.id} className="align-top">
              <td className="px-3 py-2 font-mono text-xs">
                <Timestamp value={event.occurred_at} seconds />
              </td>
              <td className="px-3 py-2 text-xs">
                {event.actor.label} <span className="text-slag-500">({event.actor.type})</span>
              </td>
              <td className="px-3 py-2 font-mono text-xs">{event.action}</td>
              <td className="px-3 py-2 font-mono text-xs">
                {event.target.type} {event.target.id}
              </td>
              <td className="px-3 py-2">
                <Json value={event.before} />
              </td>
              <td className="px-3 py-2">
                <Json value={event.after} />
              </td>
            </tr>
          ))}
        </Table>
      )}
      {events.hasNextPage && (
        <Button variant="secondary" onClick={() => events.fetchNextPage()} disabled={events.isFetchingNextPage}>
          Load older events
        </Button>
      )}
    </div>
  );
}
