import type { z } from 'zod';
import { persistedStorage } from './persisted-storage';

/** What is stored under a key: the shape's version beside the value, so a reader knows what it has. */
type Envelope = { version: number; value: unknown };

/** Where an entry lived before it was kept here, read once and then removed. */
export type LegacyRead = {
  /** The value in today's shape, or null when the old keys hold nothing usable. */
  value: unknown;
  /** Every old key to remove once it has been read, usable or not. */
  keys: readonly string[];
};

type Options<T> = {
  /** Bump when the shape changes; what an older version stored then goes through `migrate`. */
  version: number;
  schema: z.ZodType<T>;
  /**
   * Turns what an older `storedVersion` kept into today's shape; undefined drops it. Without
   * `migrate`, a value of any other version is dropped on purpose.
   */
  migrate?: (stored: unknown, storedVersion: number) => unknown;
  /**
   * Reads the old, unversioned keys for `key` when nothing is stored under it yet; `readOld`
   * gives an old key's JSON, undefined when it is absent and null when it is not JSON.
   */
  legacy?: (key: string, readOld: (oldKey: string) => unknown) => LegacyRead | null;
};

export type PersistedState<T> = {
  /** The value kept under `key`, or null when there is none or it does not parse (it is dropped). */
  read(key: string): T | null;
  /** False when the value could only be kept in memory (it will not survive a reload). */
  write(key: string, value: T): boolean;
  remove(key: string): void;
};

function readOld(oldKey: string): unknown {
  const raw = persistedStorage.read(oldKey);
  if (raw === null) return undefined;
  try {
    return JSON.parse(raw) as unknown;
  } catch {
    return null;
  }
}

function parseEnvelope(raw: string): Envelope | null {
  try {
    const parsed: unknown = JSON.parse(raw);
    if (typeof parsed !== 'object' || parsed === null) return null;
    const { version, value } = parsed as Partial<Envelope>;
    return Number.isInteger(version) ? { version: version as number, value } : null;
  } catch {
    return null;
  }
}

/**
 * One kind of value kept across reloads (on the web, in local storage), checked by its zod
 * schema on every read: a value that does not parse is removed rather than crashed on, and a
 * value an older version wrote is migrated or dropped, never read as if it were current.
 */
export function persistedState<T>({ version, schema, migrate, legacy }: Options<T>): PersistedState<T> {
  const write = (key: string, value: T) =>
    persistedStorage.write(key, JSON.stringify({ version, value } satisfies Envelope));

  /** Parses a migrated value and stores it under `key`; null (and `key` removed) when it fails. */
  const adopt = (key: string, candidate: unknown): { value: T; stored: boolean } | null => {
    const parsed = schema.safeParse(candidate);
    if (!parsed.success) {
      persistedStorage.remove(key);
      return null;
    }
    return { value: parsed.data, stored: write(key, parsed.data) };
  };

  return {
    read(key) {
      const raw = persistedStorage.read(key);
      if (raw === null) {
        const old = legacy?.(key, readOld);
        if (!old) return null;
        const adopted = old.value === null ? null : adopt(key, old.value);
        // The old keys go only once the value is safely under the new one (or is unusable).
        if (!adopted || adopted.stored) for (const oldKey of old.keys) persistedStorage.remove(oldKey);
        return adopted?.value ?? null;
      }
      const envelope = parseEnvelope(raw);
      // A newer release wrote this (another tab, after an update): not ours to read or remove.
      if (envelope && envelope.version > version) return null;
      if (envelope?.version === version) {
        const parsed = schema.safeParse(envelope.value);
        if (parsed.success) return parsed.data;
      } else if (envelope && migrate) {
        const migrated = migrate(envelope.value, envelope.version);
        if (migrated !== undefined) return adopt(key, migrated)?.value ?? null;
      }
      persistedStorage.remove(key);
      return null;
    },
    write,
    remove(key) {
      persistedStorage.remove(key);
    },
  };
}
