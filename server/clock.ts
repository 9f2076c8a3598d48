/** Injected wherever time matters (token expiry, version timestamps), so tests can move it. */
export interface Clock {
  now(): Date;
}

export const systemClock: Clock = { now: () => new Date() };

/** A clock that stands still until told to move. */
export function createFixedClock(start: Date): Clock & { advance(ms: number): void; set(date: Date): void } {
  let current = start.getTime();
  return {
    now: () => new Date(current),
    advance(ms) {
      current += ms;
    },
    set(date) {
      current = date.getTime();
    },
  };
}
