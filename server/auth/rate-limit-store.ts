/**
 * An express-rate-limit store in PostgreSQL, so that N instances behind a load balancer count
 * one limit, not N: each hit is one atomic upsert that starts a new window when the old one
 * has ended. Same semantics as the library's memory store (fixed windows, per key).
 */
import type { Knex } from 'knex';
import type { IncrementResponse, Options, Store } from 'express-rate-limit';

export class PostgresRateLimitStore implements Store {
  localKeys = false;
  private windowMs = 60_000;
  private hitsSinceSweep = 0;

  constructor(
    private readonly db: Knex,
    /** one per limiter, so two limiters never share a counter */
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async increment(key: string): Promise<IncrementResponse> {
    const r = await this.db.raw(
      `insert into rate_limits (key, hits, reset_at)
         values (?, 1, now() + make_interval(secs => ?))
       on conflict (key) do update set
         hits = case when rate_limits.reset_at <= now() then 1 else rate_limits.hits + 1 end,
         reset_at = case when rate_limits.reset_at <= now() then excluded.reset_at
                         else rate_limits.reset_at end
       returning hits, reset_at`,
      [this.prefix + key, this.windowMs / 1000],
    );
    if (++this.hitsSinceSweep >= 1000) {
      this.hitsSinceSweep = 0;
      void this.db('rate_limits')
        .where('reset_at', '<', this.db.fn.now())
        .delete()
        .catch(() => 0);
    }
    const row = r.rows[0] as { hits: number; reset_at: Date };
    return { totalHits: Number(row.hits), resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await this.db('rate_limits')
      .where({ key: this.prefix + key })
      .where('hits', '>', 0)
      .decrement('hits', 1);
  }

  async resetKey(key: string): Promise<void> {
    await this.db('rate_limits')
      .where({ key: this.prefix + key })
      .delete();
  }
}

/** A store for one named limiter. */
export type LimitStore = (name: string) => Store;

/** Stores for the limiters of one app: `scope` keeps a test's counters apart from another's. */
export const postgresLimitStores =
  (db: Knex, scope = ''): LimitStore =>
  (name) =>
    new PostgresRateLimitStore(db, `${scope}${name}:`);
