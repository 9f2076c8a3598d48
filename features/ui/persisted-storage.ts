/**
 * Web (and default): the browser's local storage. A value it refuses (private mode, a full store)
 * is kept in memory instead, so this session still finds it; native builds use the .native file.
 */
const unstored = new Map<string, string>();

export const persistedStorage = {
  read(key: string): string | null {
    const kept = unstored.get(key);
    if (kept !== undefined) return kept;
    try {
      return globalThis.localStorage?.getItem(key) ?? null;
    } catch {
      return null;
    }
  },
  /** False when only memory could take the value: it will not survive a reload. */
  write(key: string, value: string): boolean {
    try {
      if (!globalThis.localStorage) throw new Error('no local storage');
      globalThis.localStorage.setItem(key, value);
      unstored.delete(key);
      return true;
    } catch {
      unstored.set(key, value);
      return false;
    }
  },
  remove(key: string): void {
    unstored.delete(key);
    try {
      globalThis.localStorage?.removeItem(key);
    } catch {
      // Nothing to remove where storage is unavailable.
    }
  },
};
