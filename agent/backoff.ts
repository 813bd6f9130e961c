// Retry timing for an unreachable or overloaded server: exponential backoff with full jitter
// (a random delay between 0 and base·2^attempt, capped), or the server's Retry-After when given.

export interface BackoffPolicy {
  baseMs: number;
  capMs: number;
}

/** Delay before retry number `attempt` (0 for the first retry). */
export function backoffDelay(policy: BackoffPolicy, attempt: number, random: () => number = Math.random): number {
  const ceiling = Math.min(policy.capMs, policy.baseMs * 2 ** Math.min(attempt, 30));
  return Math.round(random() * ceiling);
}

/** Retry-After as milliseconds from now: delta-seconds or an HTTP date (RFC 9110 §10.2.3). */
export function parseRetryAfter(value: string | null | undefined, now = Date.now()): number | undefined {
  if (!value) return undefined;
  const text = value.trim();
  if (/^\d+$/.test(text)) return Number(text) * 1000;
  const at = Date.parse(text);
  return Number.isNaN(at) ? undefined : Math.max(0, at - now);
}

/** The wait before the next attempt: the server's Retry-After when it sent one, else backoff; both capped. */
export function retryDelay(policy: BackoffPolicy, attempt: number, retryAfterMs: number | undefined, random?: () => number): number {
  if (retryAfterMs !== undefined) return Math.min(policy.capMs, retryAfterMs);
  return backoffDelay(policy, attempt, random);
}

/** Holds uploads back after a failure; each further failure doubles the backoff ceiling, a success resets it. */
export class RetryGate {
  private failures = 0;
  private notBefore = 0;

  constructor(private readonly policy: BackoffPolicy) {}

  isOpen(now = Date.now()): boolean {
    return now >= this.notBefore;
  }

  /** Records a failure; answers the wait before the next attempt and how many failures in a row. */
  hold(retryAfterMs: number | undefined, now = Date.now()): { delayMs: number; failures: number } {
    const delayMs = retryDelay(this.policy, this.failures, retryAfterMs);
    this.failures += 1;
    this.notBefore = now + delayMs;
    return { delayMs, failures: this.failures };
  }

  reset(): void {
    this.failures = 0;
    this.notBefore = 0;
  }
}
