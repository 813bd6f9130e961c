// What an attempt's outcome means: delivered (2xx), retried later (network error, timeout, 429,
// 5xx — honouring Retry-After), failed for good (any other status, a refused address), or gone
// (410: the receiver asks us to stop, so the endpoint is disabled). Retries follow
// WEBHOOK_RETRY_DELAYS: one entry per attempt, in seconds after the previous one.
export type Outcome = 'delivered' | 'retry' | 'failed' | 'gone';

export interface AttemptResult {
  status?: number;
  error?: string;
  /** A failure no retry can mend (an address the SSRF guard refuses, an event already deleted). */
  permanent?: boolean;
  retryAfterSeconds?: number;
}

/** Retry-After never holds a delivery back longer than a day. */
const MAX_RETRY_AFTER_SECONDS = 24 * 60 * 60;

export function classify(result: AttemptResult): Exclude<Outcome, 'retry'> | 'retryable' {
  if (result.status === undefined) return result.permanent ? 'failed' : 'retryable';
  if (result.status >= 200 && result.status < 300) return 'delivered';
  if (result.status === 410) return 'gone';
  if (result.status === 429 || result.status >= 500) return 'retryable';
  return 'failed';
}

/** The header's delay in seconds (a number of seconds or an HTTP date), if it has one. */
export function parseRetryAfter(header: string | undefined, now = Date.now()): number | undefined {
  if (!header) return undefined;
  const text = header.trim();
  if (/^\d+$/.test(text)) return Math.min(Number(text), MAX_RETRY_AFTER_SECONDS);
  const at = Date.parse(text);
  if (Number.isNaN(at)) return undefined;
  return Math.min(Math.max(0, Math.ceil((at - now) / 1000)), MAX_RETRY_AFTER_SECONDS);
}

/**
 * After attempt number `attempts` (1-based): the outcome to record and, for a retry, when.
 * `delays[i]` is the wait before attempt i + 1, so there are as many attempts as delays.
 */
export function nextStep(
  result: AttemptResult,
  attempts: number,
  delays: number[],
  now: Date,
): { outcome: Outcome; nextAt: string | null } {
  const kind = classify(result);
  if (kind !== 'retryable') return { outcome: kind, nextAt: null };
  if (attempts >= delays.length) return { outcome: 'failed', nextAt: null };
  const seconds = Math.max(delays[attempts], result.retryAfterSeconds ?? 0);
  return { outcome: 'retry', nextAt: new Date(now.getTime() + seconds * 1000).toISOString() };
}
