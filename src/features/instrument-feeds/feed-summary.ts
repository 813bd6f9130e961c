// What a person reads about one instrument's feed: a short state and the facts behind it.
import type { InstrumentFeed } from './api/instrument-feeds.ts';

export interface FeedSummary {
  label: string;
  tone: 'good' | 'bad' | 'neutral' | 'accent';
  /** Why it is in that state, in a sentence. */
  explanation: string;
  waiting: string | null;
}

export function summarizeFeed(feed: InstrumentFeed): FeedSummary {
  const waiting =
    feed.queue_length === null
      ? null
      : feed.queue_length === 0
        ? 'nothing waiting'
        : `${feed.queue_length} file${feed.queue_length === 1 ? '' : 's'} waiting`;
  switch (feed.state) {
    case 'no_agent':
      return {
        label: 'no agent',
        tone: 'neutral',
        explanation: 'No agent has reported for this instrument: its files are uploaded by hand.',
        waiting,
      };
    case 'stale':
      return {
        label: 'stale',
        tone: 'bad',
        explanation: `The agent has been silent for more than ${feed.stale_after_minutes} minutes: the instrument PC may be off, off the network, or the agent stopped.`,
        waiting,
      };
    default:
      return {
        label: feed.last_error ? 'alive, with an error' : 'feed alive',
        tone: feed.last_error ? 'accent' : 'good',
        explanation: feed.last_error ? 'The agent reports; its last attempt met an error.' : 'The agent reports and delivers.',
        waiting,
      };
  }
}
