/**
 * Native builds keep persisted state for the session only: the product ships on the web target
 * first, and no persistent store is bundled for native yet.
 */
const memory = new Map<string, string>();

export const persistedStorage = {
  read(key: string): string | null {
    return memory.get(key) ?? null;
  },
  write(key: string, value: string): boolean {
    memory.set(key, value);
    return true;
  },
  remove(key: string): void {
    memory.delete(key);
  },
};
