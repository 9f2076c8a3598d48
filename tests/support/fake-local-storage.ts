import { afterEach, beforeEach, vi } from 'vitest';

/** A Storage stand-in for unit tests (Node has no localStorage); `refuse` makes writes throw like a full store. */
export function fakeLocalStorage() {
  const items = new Map<string, string>();
  let refuse = false;
  const storage = {
    getItem: (key: string) => items.get(key) ?? null,
    setItem: (key: string, value: string) => {
      if (refuse) throw new Error('QuotaExceededError');
      items.set(key, value);
    },
    removeItem: (key: string) => void items.delete(key),
    clear: () => items.clear(),
    key: (index: number) => [...items.keys()][index] ?? null,
    get length() {
      return items.size;
    },
  };
  return {
    storage,
    items,
    refuseWrites(value: boolean) {
      refuse = value;
    },
  };
}

/**
 * One fake local storage for a test file, emptied and installed as `localStorage` before each
 * test and taken away after it.
 */
export function withFakeLocalStorage() {
  const local = fakeLocalStorage();
  beforeEach(() => {
    local.items.clear();
    local.refuseWrites(false);
    vi.stubGlobal('localStorage', local.storage);
  });
  afterEach(() => {
    vi.unstubAllGlobals();
  });
  return local;
}
