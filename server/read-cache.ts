import { LRUCache } from 'lru-cache';

/**
 * A small in-process cache for hot reads (sessions, roles, and the notebooks store's versions,
 * design teams and list pages). The embedded database is one process's, and every write goes
 * through this server, so the code that writes forgets what it changed and the cache stays exact
 * (in the notebooks store, each write declares it). The time limit is only a backstop.
 *
 * `load` guards against a read that raced a write: a load that began before any `forget` stores
 * nothing, so an answer read just before a change can never outlive it. Misses (null) are never
 * stored, so a row that appears later is seen at once.
 */
export type ReadCache<V extends NonNullable<unknown>> = {
  /** The stored value, if it has not run out. */
  get(key: string): V | undefined;
  /**
   * The stored value, or `fetch`'s answer, stored until `keepUntil(value)` (epoch ms; at most the
   * cache's time limit). Return a time in the past from `keepUntil` to store nothing.
   */
  load(key: string, fetch: () => Promise<V | null>, keepUntil?: (value: V, now: number) => number): Promise<V | null>;
  set(key: string, value: V): void;
  forget(key: string): void;
  /** Drops every entry the predicate picks (a user's sessions, a team's pages); rare, so a scan. */
  forgetWhere(pick: (key: string, value: V) => boolean): void;
  readonly size: number;
};

/**
 * The default time limit. Forgetting on write keeps every cache exact; this only bounds how long
 * a change made outside the server (a maintenance script) could go unseen.
 */
export const backstopTtlMs = 60_000;

/**
 * Who writes the database. `alone`: this process is its only writer (the embedded database), so
 * forgetting on write keeps a cache exact. `shared`: other API processes write it too (a
 * PostgreSQL server); a forget here cannot reach their memory before their next request, so a
 * cache of rows that change stores nothing. Rows that never change (versions, a design's team)
 * are exact either way and leave this out.
 */
export type Writers = 'alone' | 'shared';

export type ReadCacheOptions = {
  /** `shared`: store nothing (see Writers). Only for caches of rows that change. */
  writers?: Writers;
  /** Entries kept at most; the least recently read or stored goes first. */
  max: number;
  /** Longest time an entry is trusted, in ms: `backstopTtlMs` unless given (Infinity for immutable rows). */
  ttlMs?: number;
  /** Epoch ms. Date.now by default, so tests that fake Date move the cache's time too. */
  now?: () => number;
};

/**
 * A cache bounded by `max` entries and `ttlMs`, both kept by lru-cache; this adds the guard that
 * a load which began before a `forget` stores nothing, and never stores a miss.
 */
export function createReadCache<V extends NonNullable<unknown>>({
  max,
  ttlMs = backstopTtlMs,
  now = Date.now,
  writers = 'alone',
}: ReadCacheOptions): ReadCache<V> {
  if (writers === 'shared') return readThrough();
  const entries = new LRUCache<string, V>({
    max,
    // Every store passes its own ttl (below); a cache-wide one is what switches lru-cache's time
    // tracking on, so immutable rows get the largest it takes rather than none.
    ttl: Number.isFinite(ttlMs) ? ttlMs : Number.MAX_SAFE_INTEGER,
    // Shifted by 1 ms because lru-cache reads a start time of 0 as "no limit", and a test's clock
    // may start there; only differences of this clock are used.
    perf: { now: () => now() + 1 },
    // No memo of the clock: it costs a timer per read, and would hide a test's move of the clock.
    ttlResolution: 0,
  });
  // Bumped by every forget: a load that saw an older generation may carry a stale answer.
  let generation = 0;

  function store(key: string, value: V, until: number) {
    // lru-cache keeps an entry until *more* than `ttl` ms have passed, and reads a ttl of 0 as
    // "forever"; ours is gone at `until`, and one that would live a millisecond is not worth it.
    const ttl = until - now() - 1;
    if (!(ttl >= 1)) {
      entries.delete(key);
      return;
    }
    entries.set(key, value, { ttl: Number.isFinite(ttl) ? ttl : 0 });
  }

  return {
    get: (key) => entries.get(key),
    async load(key, fetch, keepUntil) {
      const hit = entries.get(key);
      if (hit !== undefined) return hit;
      const seen = generation;
      const value = await fetch();
      if (value !== null && seen === generation) {
        const at = now();
        store(key, value, Math.min(at + ttlMs, keepUntil ? keepUntil(value, at) : Infinity));
      }
      return value;
    },
    set(key, value) {
      store(key, value, now() + ttlMs);
    },
    forget(key) {
      generation++;
      entries.delete(key);
    },
    forgetWhere(pick) {
      generation++;
      // Collected first: deleting while lru-cache walks its list would skip entries.
      const picked = [...entries.entries()].filter(([key, value]) => pick(key, value)).map(([key]) => key);
      for (const key of picked) entries.delete(key);
    },
    get size() {
      return entries.size;
    },
  };
}

/** A cache that keeps nothing: every read goes to the database. */
function readThrough<V extends NonNullable<unknown>>(): ReadCache<V> {
  return {
    get: () => undefined,
    load: (_key, fetch) => fetch(),
    set: () => undefined,
    forget: () => undefined,
    forgetWhere: () => undefined,
    size: 0,
  };
}
