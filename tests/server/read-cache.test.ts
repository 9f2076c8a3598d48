import { describe, expect, it } from 'vitest';
import { createReadCache } from '../../server/read-cache';

const clockAt = (start: number) => {
  let t = start;
  return { now: () => t, advance: (ms: number) => (t += ms) };
};

describe('the read cache', () => {
  it('answers a repeat from memory and asks again once the time limit has passed', async () => {
    const clock = clockAt(1_000);
    const cache = createReadCache<string>({ max: 10, ttlMs: 500, now: clock.now });
    let asked = 0;
    const fetch = async () => `answer ${++asked}`;
    expect(await cache.load('k', fetch)).toBe('answer 1');
    expect(await cache.load('k', fetch)).toBe('answer 1');
    clock.advance(499);
    expect(await cache.load('k', fetch)).toBe('answer 1');
    clock.advance(1);
    expect(await cache.load('k', fetch)).toBe('answer 2');
  });

  it('keeps an entry no longer than its own limit when that comes first', async () => {
    const clock = clockAt(0);
    const cache = createReadCache<{ until: number }>({ max: 10, ttlMs: 1_000, now: clock.now });
    await cache.load('k', async () => ({ until: 200 }), (value) => value.until);
    expect(cache.get('k')).toEqual({ until: 200 });
    clock.advance(200);
    expect(cache.get('k')).toBeUndefined();
    // Already past its limit: not kept at all.
    await cache.load('late', async () => ({ until: 100 }), (value) => value.until);
    expect(cache.size).toBe(0);
  });

  it('never keeps a miss, so a row that appears later is seen at once', async () => {
    const cache = createReadCache<string>({ max: 10, ttlMs: 60_000 });
    let row: string | null = null;
    expect(await cache.load('k', async () => row)).toBeNull();
    row = 'now here';
    expect(await cache.load('k', async () => row)).toBe('now here');
  });

  it('does not keep an answer read before a change that was forgotten while it was on its way', async () => {
    const cache = createReadCache<string>({ max: 10, ttlMs: 60_000 });
    let release!: (value: string) => void;
    const inFlight = cache.load('role', () => new Promise<string>((resolve) => (release = resolve)));
    // The write lands and forgets while the read is still waiting for the database.
    cache.forget('role');
    release('owner (stale)');
    expect(await inFlight).toBe('owner (stale)');
    expect(cache.get('role')).toBeUndefined();
    expect(await cache.load('role', async () => 'viewer')).toBe('viewer');
  });

  it('drops the oldest entry when full, and forgets by key or by a predicate', async () => {
    const cache = createReadCache<number>({ max: 3, ttlMs: 60_000 });
    for (const [key, value] of [['a', 1], ['b', 2], ['c', 3], ['d', 4]] as const) cache.set(key, value);
    expect([cache.get('a'), cache.get('b'), cache.get('d'), cache.size]).toEqual([undefined, 2, 4, 3]);
    cache.forget('b');
    expect(cache.get('b')).toBeUndefined();
    cache.forgetWhere((_key, value) => value > 3);
    expect([cache.get('c'), cache.get('d')]).toEqual([3, undefined]);
  });
});
