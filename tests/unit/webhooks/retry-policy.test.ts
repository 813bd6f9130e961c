import { describe, expect, it } from 'vitest';
import { classify, nextStep, parseRetryAfter } from '../../../server/domain/webhooks/retry-policy.ts';

const DELAYS = [0, 5, 300, 1800, 7200, 18000, 36000, 36000];
const now = new Date('2026-12-01T08:00:00.000Z');
const after = (seconds: number) => new Date(now.getTime() + seconds * 1000).toISOString();

describe('webhook retry policy', () => {
  it('delivers on 2xx, retries network errors, 429 and 5xx, stops on 410 and on other statuses', () => {
    expect([200, 204, 299].map((status) => classify({ status }))).toEqual(['delivered', 'delivered', 'delivered']);
    expect([{}, { status: 429 }, { status: 500 }, { status: 503 }].map(classify)).toEqual([
      'retryable',
      'retryable',
      'retryable',
      'retryable',
    ]);
    expect(classify({ status: 410 })).toBe('gone');
    expect([301, 307, 400, 401, 404].map((status) => classify({ status }))).toEqual(['failed', 'failed', 'failed', 'failed', 'failed']);
    expect(classify({ permanent: true, error: 'refused address' })).toBe('failed');
  });

  it('follows the schedule: attempt n waits delays[n] after the one before', () => {
    expect(nextStep({ status: 500 }, 1, DELAYS, now)).toEqual({ outcome: 'retry', nextAt: after(5) });
    expect(nextStep({ status: 500 }, 2, DELAYS, now)).toEqual({ outcome: 'retry', nextAt: after(300) });
    expect(nextStep({ status: 500 }, 7, DELAYS, now)).toEqual({ outcome: 'retry', nextAt: after(36000) });
    expect(nextStep({ status: 500 }, 8, DELAYS, now)).toEqual({ outcome: 'failed', nextAt: null });
    expect(DELAYS.reduce((a, b) => a + b, 0) / 3600).toBeCloseTo(27.5, 0); // "about 27.5 h in all" (docs of webhook platforms);
  });

  it('waits at least as long as Retry-After says, at most a day', () => {
    expect(nextStep({ status: 429, retryAfterSeconds: 60 }, 1, DELAYS, now)).toEqual({ outcome: 'retry', nextAt: after(60) });
    expect(nextStep({ status: 429, retryAfterSeconds: 1 }, 2, DELAYS, now).nextAt).toBe(after(300));
    expect(parseRetryAfter('120')).toBe(120);
    expect(parseRetryAfter('9999999')).toBe(86400);
    expect(parseRetryAfter(new Date(now.getTime() + 30_000).toUTCString(), now.getTime())).toBe(30);
    expect(parseRetryAfter('soon')).toBeUndefined();
    expect(parseRetryAfter(undefined)).toBeUndefined();
  });
});
