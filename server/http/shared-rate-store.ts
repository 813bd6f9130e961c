// express-rate-limit's budgets kept in PostgreSQL, so every node counts against one budget: a
// Store backed by rate-limiter-flexible's RateLimiterPostgres (one atomic upsert per request on
// the rate_limit_counters table the migrations create). express-rate-limit keeps doing the rest:
// draft-8 RateLimit headers, the 429 problem, skip and key rules. SQLite (one process) keeps the
// memory store.
import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import { RateLimiterPostgres } from 'rate-limiter-flexible';
import type { Db } from '../db/knex.ts';

export class SharedRateStore implements Store {
  readonly localKeys = false;
  readonly prefix: string;
  private limiter: RateLimiterPostgres | undefined;

  constructor(
    private readonly db: Db,
    identifier: string,
  ) {
    this.prefix = `${identifier}:`;
  }

  init(options: Options): void {
    this.limiter = new RateLimiterPostgres({
      storeClient: this.db,
      storeType: 'knex',
      tableName: 'rate_limit_counters',
      tableCreated: true,
      keyPrefix: this.prefix,
      // express-rate-limit compares the hits with its own limit; this store only counts.
      points: Number.MAX_SAFE_INTEGER,
      duration: Math.ceil(options.windowMs / 1000),
    });
  }

  private counter(): RateLimiterPostgres {
    if (!this.limiter) throw new Error('SharedRateStore used before init');
    return this.limiter;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const res = await this.counter().penalty(key, 1);
    return { totalHits: res.consumedPoints, resetTime: new Date(Date.now() + res.msBeforeNext) };
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const res = await this.counter().get(key);
    return res ? { totalHits: res.consumedPoints, resetTime: new Date(Date.now() + res.msBeforeNext) } : undefined;
  }

  async decrement(key: string): Promise<void> {
    await this.counter().reward(key, 1);
  }

  async resetKey(key: string): Promise<void> {
    await this.counter().delete(key);
  }
}
