import { Link } from 'react-router';
import { Button } from '../../../components/ui/button.tsx';
import { CodeBlock } from '../../../components/ui/code-block.tsx';
import { Alert, ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Badge } from '../../../components/ui/layout.tsx';
import { useReplay, useRequestLogEntry, type RequestLogEntry } from '../api/request-log.ts';
import { curlCommand } from '../../../lib/curl.ts';
import { StatusBadge } from './status-badge.tsx';
import { paths } from '../../../config/paths.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

type Message = RequestLogEntry['request'];

function prettyBody(message: Message): string {
  if (message.body === null)
    return message.body_kind === 'none' ? '(no body)' : `(${message.body_kind} body of ${message.body_size} bytes, not kept)`;
  if (message.body_kind === 'json' && !message.body_truncated) {
    try {
      return JSON.stringify(JSON.parse(message.body), null, 2);
    } catch {
      // shown as stored
    }
  }
  return message.body;
}

function MessagePanel({ title, message }: { title: string; message: Message }) {
  return (
    <section className="space-y-2">
      <h3 className="text-sm font-semibold uppercase tracking-wide text-slag-500">{title}</h3>
      <details className="text-xs">
        <summary className="cursor-pointer text-copper-700">Headers ({Object.keys(message.headers).length})</summary>
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-4 gap-y-0.5 rounded bg-white p-2 font-mono">
          {Object.entries(message.headers).map(([name, value]) => (
            <div key={name} className="contents">
              <dt className="text-slag-500">{name}</dt>
              <dd className="break-all">{value}</dd>
            </div>
          ))}
        </dl>
      </details>
      {message.body_truncated && (
        <p className="text-xs text-ember-700">Cut at the log&apos;s size limit: {message.body_size} bytes in the original.</p>
      )}
      <pre
        className="max-h-80 overflow-auto rounded-md border border-ash-200 bg-white p-3 text-xs"
        data-testid={`${title.toLowerCase()}-body`}
      >
        {prettyBody(message)}
      </pre>
    </section>
  );
}

function ReplayPanel({ entry }: { entry: RequestLogEntry }) {
  const replay = useReplay();
  if (!entry.replayable) {
    return (
      <Alert tone="info" title="This call cannot be replayed">
        {entry.not_replayable_reason}
      </Alert>
    );
  }
  return (
    <section className="space-y-2 rounded-lg border border-ash-200 bg-white p-4">
      <div className="flex items-center justify-between gap-4">
        <p className="text-sm text-slag-700">
          Replay sends this call again <strong>as you</strong>, with your scopes. Writes carry their original Idempotency-Key, if any.
        </p>
        <Button onClick={() => replay.mutate(entry.id)} disabled={replay.isPending}>
          {replay.isPending ? 'Replaying…' : 'Replay'}
        </Button>
      </div>
      <ProblemAlert error={replay.error} />
      {replay.data && (
        <div role="status" className="flex flex-wrap items-center gap-3 rounded bg-ash-100 px-3 py-2 text-sm" data-testid="replay-result">
          <span>Replayed:</span>
          <StatusBadge status={replay.data.status} />
          <span className="font-mono text-xs">{replay.data.duration_ms.toFixed(1)} ms</span>
          <Link to={paths.requestLogEntry(replay.data.id)} className="text-copper-700 underline">
            Open the new entry
          </Link>
        </div>
      )}
    </section>
  );
}

/** One call; links to other entries go through the page's `?entry=` parameter. */
export function RequestLogDetail({ id }: { id: string }) {
  const entry = useRequestLogEntry(id);
  if (entry.isPending) return <Spinner label="Loading the call…" />;
  if (entry.error) return <ProblemAlert error={entry.error} />;
  const e = entry.data;
  return (
    <div className="space-y-5">
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm">
        <dt className="text-slag-500">Status</dt>
        <dd>
          <StatusBadge status={e.status} /> <span className="ml-2 font-mono text-xs">{e.duration_ms.toFixed(1)} ms</span>
        </dd>
        <dt className="text-slag-500">When</dt>
        <dd className="font-mono text-xs">
          <Timestamp value={e.occurred_at} seconds />
        </dd>
        <dt className="text-slag-500">Caller</dt>
        <dd>
          {e.caller.label ?? 'anonymous'} <span className="text-slag-500">({e.caller.type.replace('_', ' ')})</span>
        </dd>
        <dt className="text-slag-500">Request id</dt>
        <dd className="font-mono text-xs">{e.request_id}</dd>
        {e.replay_of && (
          <>
            <dt className="text-slag-500">Replay of</dt>
            <dd>
              <Link to={paths.requestLogEntry(e.replay_of)} className="font-mono text-xs text-copper-700 underline">
                {e.replay_of}
              </Link>{' '}
              <Badge tone="accent">replay</Badge>
            </dd>
          </>
        )}
      </dl>
      <ReplayPanel key={e.id} entry={e} />
      <CodeBlock
        label="Equivalent curl (set MELTWIRE_KEY to your key first)"
        code={curlCommand(e, window.location.origin)}
        testId="curl-command"
      />
      <MessagePanel title="Request" message={e.request} />
      <MessagePanel title="Response" message={e.response} />
    </div>
  );
}
