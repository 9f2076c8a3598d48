import { z } from 'zod';
import { persistedState } from '@/features/ui/persisted-state';
import { draftSchema } from '@/features/workbench';

/**
 * Unsaved edits of a notebook, one entry per user and design. Beside the draft we keep the
 * version it was started from, so a reload after someone else saved still knows to offer a
 * rebase instead of saving on top blindly.
 */
export function notebookDraftKey(userId: string, designId: string): string {
  return `blazebook.notebook-edits.${userId}.${designId}`;
}

/** Releases before one entry per notebook kept the draft and the rest under two keys. */
function legacyKeys(key: string): { draft: string; meta: string } | null {
  const ids = key.slice('blazebook.notebook-edits.'.length);
  if (ids === key || ids === '') return null;
  const draft = `blazebook.notebook.v1.${ids}`;
  return { draft, meta: `${draft}.meta` };
}

const storedEditsSchema = z.object({
  draft: draftSchema,
  baseVersion: z.number().int().min(1),
  notes: z.string(),
  message: z.string(),
});

export type StoredEdits = z.infer<typeof storedEditsSchema>;

const legacyMetaSchema = z.object({
  baseVersion: z.number().int().min(1),
  notes: z.string().catch(''),
  message: z.string().catch(''),
});

const edits = persistedState({
  version: 1,
  schema: storedEditsSchema,
  legacy: (key, readOld) => {
    const old = legacyKeys(key);
    if (!old) return null;
    const draft = readOld(old.draft);
    const meta = readOld(old.meta);
    if (draft === undefined && meta === undefined) return null;
    // Edits made on no known version were never offered back; they stay dropped.
    const parsedMeta = legacyMetaSchema.safeParse(meta);
    return {
      value: parsedMeta.success ? { draft, ...parsedMeta.data } : null,
      keys: [old.draft, old.meta],
    };
  },
});

/** The kept edits, or null when there are none (or they cannot be read). */
export function loadEdits(key: string): StoredEdits | null {
  return edits.read(key);
}

export function saveEdits(key: string, value: StoredEdits): void {
  edits.write(key, value);
}

export function clearEdits(key: string): void {
  edits.remove(key);
}

/**
 * Where the next version's edits start when none are kept: the version's parameters, with empty
 * notes and message. A version's notes explain that version; carrying them over silently let one
 * go out with its predecessor's reasoning, so they are only ever brought in on request
 * (`startFromNotes`).
 */
export function freshEdits(draft: StoredEdits['draft'], baseVersion: number): StoredEdits {
  return { draft, baseVersion, notes: '', message: '' };
}

/**
 * The notes box after "Start from vN's notes": the earlier notes, with anything already typed
 * kept below them; pressing it twice changes nothing.
 */
export function startFromNotes(typed: string, earlier: string): string {
  if (typed.trim() === '') return earlier;
  if (earlier.trim() === '' || typed.startsWith(earlier)) return typed;
  return `${earlier}\n\n${typed}`;
}

/**
 * Whether the notes add anything to a new version: not when empty, nor when they are the
 * earlier version's notes word for word (the parameters decide then).
 */
export function notesAreNew(notes: string, earlier: string): boolean {
  return notes.trim() !== '' && notes.trim() !== earlier.trim();
}
