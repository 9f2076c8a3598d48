import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { Database } from '../../db/client';
import { rateLimitCounters } from '../../db/schema';

/** Makes the store for one named limit ('sign-in', 'solve'…); its keys never meet another's. */
export type CounterStores = (name: string) => Store;

/** Every this-many counts, one also deletes the counters that ran out (their rows are dead weight). */
const sweepEvery = 500;

/**
 * express-rate-limit's counters in PostgreSQL (the `rate_limit_counters` table), so a limit holds
 * across every API process that shares the server: the tenth sign-in from an address counts as
 * the tenth whichever process answers it. One statement per count, atomic on the server: it
 * starts the window over when the old one has passed, else adds one. The window's clock is the
 * database's (`now()`), one clock for every process.
 */
export function databaseCounterStores(db: Database): CounterStores {
  let counted = 0;
  return (name) => {
    let windowMs = 60_000;
    // A client's key can carry whatever a body held (an e-mail of any length, a NUL PostgreSQL
    // refuses in text): stored as its SHA-256, every key is 64 plain characters.
    const keyOf = (key: string) => `${name}|${createHash('sha256').update(key).digest('hex')}`;
    return {
      localKeys: false,
      prefix: `${name}|`,
      init(options: Options) {
        windowMs = options.windowMs;
      },
      async increment(key: string): Promise<ClientRateLimitInfo> {
        if (++counted % sweepEvery === 0) {
          await db.delete(rateLimitCounters).where(sql`${rateLimitCounters.resetsAt} <= now()`);
        }
        const fresh = sql`now() + make_interval(secs => ${windowMs / 1000})`;
        const [row] = await db
          .insert(rateLimitCounters)
          .values({ key: keyOf(key), hits: 1, resetsAt: fresh })
          .onConflictDoUpdate({
            target: rateLimitCounters.key,
            set: {
              hits: sql`case when ${rateLimitCounters.resetsAt} <= now() then 1 else ${rateLimitCounters.hits} + 1 end`,
              resetsAt: sql`case when ${rateLimitCounters.resetsAt} <= now() then excluded.resets_at else ${rateLimitCounters.resetsAt} end`,
            },
          })
          .returning({ hits: rateLimitCounters.hits, resetsAt: rateLimitCounters.resetsAt });
        return { totalHits: row!.hits, resetTime: row!.resetsAt };
      },
      async decrement(key: string) {
        await db
          .update(rateLimitCounters)
          .set({ hits: sql`greatest(${rateLimitCounters.hits} - 1, 0)` })
          .where(sql`${rateLimitCounters.key} = ${keyOf(key)} and ${rateLimitCounters.resetsAt} > now()`);
      },
      async resetKey(key: string) {
        await db.delete(rateLimitCounters).where(sql`${rateLimitCounters.key} = ${keyOf(key)}`);
      },
    };
  };
}
