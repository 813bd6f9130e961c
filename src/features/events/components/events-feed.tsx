import { useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import { EventTypeValues } from '../../../api/openapi-enums.ts';
import { Button } from '../../../components/ui/button.tsx';
import { CodeBlock } from '../../../components/ui/code-block.tsx';
import { EmptyState, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { SelectField } from '../../../components/ui/field.tsx';
import { Table } from '../../../components/ui/layout.tsx';
import { useEventFeed } from '../api/events.ts';
import { resourceLink } from '../resource-link.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

/** The change feed page by page, as an integration reads it: each page starts after the cursor shown. */
export function EventsFeed() {
  const [type, setType] = useState('');
  const [chosenType, setChosenType] = useState('');
  // The cursors of the pages read so far: the last is the one this page started after.
  const [cursors, setCursors] = useState<(string | undefined)[]>([undefined]);
  const after = cursors[cursors.length - 1];
  const feed = useEventFeed(after, chosenType);
  const page = feed.data;

  function applyFilter(event: FormEvent) {
    event.preventDefault();
    setChosenType(type);
    setCursors([undefined]);
  }

  return (
    <div className="space-y-4">
      <form onSubmit={applyFilter} className="flex flex-wrap items-end gap-3">
        <div className="w-64">
          <SelectField label="Event type" value={type} onChange={(e) => setType(e.target.value)}>
            <option value="">All types</option>
            {EventTypeValues.map((t) => (
              <option key={t} value={t}>
                {t}
              </option>
            ))}
          </SelectField>
        </div>
        <Button type="submit" variant="secondary">
          Show
        </Button>
      </form>
      <CodeBlock
        label="This page starts after cursor (after=)"
        code={after ?? '(none: from the oldest event kept)'}
        testId="current-cursor"
      />
      {feed.isPending && <Spinner label="Loading events…" />}
      <ProblemAlert error={feed.error} />
      {page && page.data.length === 0 && (
        <EmptyState title={after ? 'No newer events yet' : 'No events yet'}>
          Events are recorded with each change (a sample pushed, an import finished…). An integration keeps polling with the cursor above.
        </EmptyState>
      )}
      {page && page.data.length > 0 && (
        <Table head={['Sequence', 'Type', 'Occurred (your time)', 'Resource', 'Event id']} caption="Events">
          {page.data.map((event) => {
            const link = resourceLink(event);
            return (
              <tr key={event.id} data-testid="event-row">
                <td className="px-3 py-2 text-right font-mono">{event.sequence}</td>
                <td className="px-3 py-2 font-mono text-xs">{event.type}</td>
                <td className="px-3 py-2 text-xs">
                  <Timestamp value={event.occurred_at} seconds />
                </td>
                <td className="px-3 py-2">
                  {link ? (
                    <Link to={link.to} className="text-copper-700 underline">
                      {link.label}
                    </Link>
                  ) : (
                    '—'
                  )}
                </td>
                <td className="px-3 py-2 font-mono text-xs text-slag-500">{event.id}</td>
              </tr>
            );
          })}
        </Table>
      )}
      {page?.next_cursor && (
        <p className="text-sm text-slag-700">
          Next cursor:{' '}
          <code data-testid="next-cursor" className="select-all rounded bg-ash-100 px-1 text-xs">
            {page.next_cursor}
          </code>
        </p>
      )}
      <div className="flex gap-2">
        {cursors.length > 1 && (
          <Button variant="secondary" onClick={() => setCursors(cursors.slice(0, -1))}>
            Previous page
          </Button>
        )}
        {page?.next_cursor && page.next_cursor !== after && (
          <Button variant="secondary" onClick={() => setCursors([...cursors, page.next_cursor ?? undefined])}>
            {page.has_more ? 'Next page' : 'Read on from the next cursor'}
          </Button>
        )}
      </div>
    </div>
  );
}
