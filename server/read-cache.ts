/**
 * A small in-process cache for hot reads (sessions, roles, design lists). The embedded database
 * is one process's, and every write goes through this server's services, so a service that
 * writes can forget what it changed and the cache stays exact. The time limit is only a backstop.
 *
 * `load` guards against a read that raced a write: a load that began before any `forget` stores
 * nothing, so an answer read just before a change can never outlive it. Misses (null) are never
 * stored, so a row that appears later is seen at once.
 */
export type ReadCache<V> = {
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

export type ReadCacheOptions = {
  /** Entries kept at most; the oldest stored goes first. */
  max: number;
  /** Longest time an entry is trusted, in ms: `backstopTtlMs` unless given (Infinity for immutable rows). */
  ttlMs?: number;
  /** Epoch ms. Date.now by default, so tests that fake Date move the cache's time too. */
  now?: () => number;
};

export function createReadCache<V>({ max, ttlMs = backstopTtlMs, now = Date.now }: ReadCacheOptions): ReadCache<V> {
  const entries = new Map<string, { value: V; until: number }>();
  // Bumped by every forget: a load that saw an older generation may carry a stale answer.
  let generation = 0;

  function get(key: string): V | undefined {
    const entry = entries.get(key);
    if (!entry) return undefined;
    if (entry.until <= now()) {
      entries.delete(key);
      return undefined;
    }
    return entry.value;
  }

  function store(key: string, value: V, until: number) {
    if (until <= now()) return;
    entries.delete(key);
    if (entries.size >= max) entries.delete(entries.keys().next().value!);
    entries.set(key, { value, until });
  }

  return {
    get,
    async load(key, fetch, keepUntil) {
      const hit = get(key);
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
      for (const [key, entry] of entries) if (pick(key, entry.value)) entries.delete(key);
    },
    get size() {
      return entries.size;
    },
  };
}
