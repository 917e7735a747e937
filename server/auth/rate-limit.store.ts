import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { Executor } from '../db/client.js';
import type { Clock } from '../clock.js';
import { current, forget, hit, pruneEnded, unhit } from './rate-limit.repository.js';

const PRUNE_EVERY_MS = 60_000;

/**
 * An express-rate-limit store over the signin_rate_limit table: the count lives in PostgreSQL, so it
 * holds however many server processes run. The window follows the app's clock.
 */
export class PgRateLimitStore implements Store {
  /** Counts are shared with every other instance and process using the same prefix. */
  readonly localKeys = false;
  private windowMs = 60_000;
  private lastPrune = 0;

  constructor(
    private readonly db: Executor,
    private readonly clock: Clock,
    readonly prefix = 'ip:',
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await current(this.db, this.prefix + key, this.clock.now());
    return row ? { totalHits: row.hits, resetTime: row.resetAt } : undefined;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const now = this.clock.now();
    await this.pruneNowAndThen(now);
    const row = await hit(this.db, this.prefix + key, now, this.windowMs);
    return { totalHits: row.hits, resetTime: row.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await unhit(this.db, this.prefix + key, this.clock.now());
  }

  async resetKey(key: string): Promise<void> {
    await forget(this.db, this.prefix + key);
  }

  // Rows of addresses that never come back would stay forever: a delete of ended windows at most once a minute.
  private async pruneNowAndThen(now: Date): Promise<void> {
    if (Math.abs(now.getTime() - this.lastPrune) < PRUNE_EVERY_MS) return;
    this.lastPrune = now.getTime();
    await pruneEnded(this.db, now);
  }
}
