import { clearDraft, loadDraft, saveDraft, type Draft } from '@/features/workbench';

/**
 * Unsaved edits of a notebook, one per user and design, kept by the workbench's draft storage.
 * Beside the draft we keep the version it was started from, so a reload after someone else saved
 * still knows to offer a rebase instead of saving on top blindly.
 */
export function notebookDraftKey(userId: string, designId: string): string {
  return `blazebook.notebook.v1.${userId}.${designId}`;
}

const memory = new Map<string, string>();
const store = {
  read(key: string): string | null {
    try {
      return globalThis.localStorage?.getItem(key) ?? memory.get(key) ?? null;
    } catch {
      return memory.get(key) ?? null;
    }
  },
  write(key: string, value: string) {
    memory.set(key, value);
    try {
      globalThis.localStorage?.setItem(key, value);
    } catch {
      // Private mode or a full store: the in-memory copy still covers this session.
    }
  },
  remove(key: string) {
    memory.delete(key);
    try {
      globalThis.localStorage?.removeItem(key);
    } catch {
      // Nothing to do: the entry could not have been written either.
    }
  },
};

export type StoredEdits = { draft: Draft; baseVersion: number; notes: string; message: string };

function readMeta(key: string): Omit<StoredEdits, 'draft'> | null {
  try {
    const meta = JSON.parse(store.read(`${key}.meta`) ?? 'null') as Partial<StoredEdits> | null;
    if (!meta || !Number.isInteger(meta.baseVersion) || (meta.baseVersion ?? 0) < 1) return null;
    return {
      baseVersion: meta.baseVersion as number,
      notes: typeof meta.notes === 'string' ? meta.notes : '',
      message: typeof meta.message === 'string' ? meta.message : '',
    };
  } catch {
    return null;
  }
}

/** The kept edits, or null when there are none (or they were made on no known version). */
export function loadEdits(key: string): StoredEdits | null {
  const meta = readMeta(key);
  if (!meta) return null;
  let found = true;
  const draft = loadDraft(key, () => {
    found = false;
    return null as unknown as Draft;
  });
  return found ? { draft, ...meta } : null;
}

export function saveEdits(key: string, edits: StoredEdits): void {
  saveDraft(edits.draft, key);
  store.write(`${key}.meta`, JSON.stringify({ baseVersion: edits.baseVersion, notes: edits.notes, message: edits.message }));
}

export function clearEdits(key: string): void {
  clearDraft(key);
  store.remove(`${key}.meta`);
}
