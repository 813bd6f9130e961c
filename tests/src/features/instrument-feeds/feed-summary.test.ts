import { describe, expect, it } from 'vitest';
import type { InstrumentFeed } from '../../../../src/features/instrument-feeds/api/instrument-feeds.ts';
import { summarizeFeed } from '../../../../src/features/instrument-feeds/feed-summary.ts';

const base: InstrumentFeed = {
  instrument: { id: 'ins_1', code: 'OES-1' },
  state: 'alive',
  stale_after_minutes: 15,
  reported_at: '2026-12-03T09:00:00.000Z',
  agent: { version: '0.1.0', host: 'SPARK-PC-1', reported_by: 'key OES-1 agent' },
  queue_length: 0,
  last_success_at: '2026-12-03T08:59:00.000Z',
  last_file: { name: 'K24-0412.csv', at: '2026-12-03T08:59:00.000Z' },
  last_error: null,
};

describe('summarizeFeed', () => {
  it('calls a reporting agent without errors alive', () => {
    expect(summarizeFeed(base)).toMatchObject({ label: 'feed alive', tone: 'good', waiting: 'nothing waiting' });
  });

  it('says how many files wait, in singular and plural', () => {
    expect(summarizeFeed({ ...base, queue_length: 1 }).waiting).toBe('1 file waiting');
    expect(summarizeFeed({ ...base, queue_length: 4 }).waiting).toBe('4 files waiting');
  });

  it('flags an alive feed whose last attempt failed', () => {
    const summary = summarizeFeed({ ...base, queue_length: 3, last_error: { message: 'server unreachable', at: base.reported_at! } });
    expect(summary).toMatchObject({ label: 'alive, with an error', tone: 'accent', waiting: '3 files waiting' });
  });

  it('explains a stale feed with the configured minutes', () => {
    const summary = summarizeFeed({ ...base, state: 'stale', stale_after_minutes: 20 });
    expect(summary).toMatchObject({ label: 'stale', tone: 'bad' });
    expect(summary.explanation).toContain('more than 20 minutes');
  });

  it('shows an instrument without an agent as uploaded by hand', () => {
    const summary = summarizeFeed({ ...base, state: 'no_agent', reported_at: null, agent: null, queue_length: null, last_file: null });
    expect(summary).toMatchObject({ label: 'no agent', tone: 'neutral', waiting: null });
  });
});
