import { ProblemAlert, Spinner } from '../../../components/ui/feedback.tsx';
import { Badge, Card } from '../../../components/ui/layout.tsx';
import { type InstrumentFeed, useInstrumentFeeds } from '../api/instrument-feeds.ts';
import { summarizeFeed } from '../feed-summary.ts';
import { Timestamp } from '../../../components/ui/timestamp.tsx';

function FeedRow({ feed }: { feed: InstrumentFeed }) {
  const summary = summarizeFeed(feed);
  return (
    <li className="py-3" data-testid={`feed-${feed.instrument.code}`}>
      <div className="flex flex-wrap items-center gap-2">
        <span className="font-mono font-semibold">{feed.instrument.code}</span>
        <Badge tone={summary.tone}>{summary.label}</Badge>
        {summary.waiting && <span className="text-xs text-slag-500">{summary.waiting}</span>}
      </div>
      <p className="mt-1 text-xs text-slag-500">{summary.explanation}</p>
      {feed.state !== 'no_agent' && (
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-xs">
          <dt className="text-slag-500">Last file</dt>
          <dd>
            {feed.last_file ? (
              <>
                {feed.last_file.name} at <Timestamp value={feed.last_file.at} seconds />
              </>
            ) : (
              'none delivered yet'
            )}
          </dd>
          <dt className="text-slag-500">Last report</dt>
          <dd>
            <Timestamp value={feed.reported_at} seconds />
            {feed.agent && (
              <span className="text-slag-500">
                {' '}
                — agent {feed.agent.version}
                {feed.agent.host ? ` on ${feed.agent.host}` : ''}
              </span>
            )}
          </dd>
          {feed.last_error && (
            <>
              <dt className="text-oxide-600">Last error</dt>
              <dd className="text-oxide-600">
                {feed.last_error.message}{' '}
                <span className="text-slag-500">
                  (<Timestamp value={feed.last_error.at} seconds />)
                </span>
              </dd>
            </>
          )}
        </dl>
      )}
    </li>
  );
}

/** Whether each instrument's results arrive by themselves (the agent on its PC, agent/). */
export function InstrumentFeedsCard() {
  const feeds = useInstrumentFeeds();
  return (
    <Card title="Instrument feeds">
      {feeds.isPending && <Spinner label="Loading instrument feeds…" />}
      <ProblemAlert error={feeds.error} />
      {feeds.data && feeds.data.data.length === 0 && (
        <p className="text-sm text-slag-500">
          No instruments yet. Once an instrument is registered and its PC runs the agent, its feed shows here.
        </p>
      )}
      {feeds.data && feeds.data.data.length > 0 && (
        <ul className="divide-y divide-ash-200" aria-label="Instrument feeds">
          {feeds.data.data.map((feed) => (
            <FeedRow key={feed.instrument.id} feed={feed} />
          ))}
        </ul>
      )}
    </Card>
  );
}
