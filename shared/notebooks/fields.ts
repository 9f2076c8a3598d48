import { z } from 'zod';

export const designTitleSchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(120, { error: 'must be at most 120 characters' });

/** Tags are short labels, stored trimmed and lower-cased so "UV" and "uv" are one tag. */
export const tagSchema = z
  .string({ error: 'must be text' })
  .trim()
  .toLowerCase()
  .min(1, { error: 'must not be empty' })
  .max(32, { error: 'must be at most 32 characters' });

export const maxTags = 12;
export const tagsSchema = z
  .array(tagSchema, { error: 'must be a list of tags' })
  .max(maxTags, { error: `must have at most ${maxTags} tags` })
  .transform((tags) => [...new Set(tags)]);

/** The one-line change message of a version, like a commit subject. */
export const versionMessageSchema = z
  .string({ error: 'is required' })
  .trim()
  .min(1, { error: 'is required' })
  .max(200, { error: 'must be at most 200 characters' })
  .refine((message) => !/[\r\n]/.test(message), { error: 'must be one line' });

export const maxNotesLength = 50_000;
/** The designer's reasoning, in Markdown. The client renders it safely (no raw HTML). */
export const notesSchema = z
  .string({ error: 'must be text' })
  .max(maxNotesLength, { error: `must be at most ${maxNotesLength} characters` });

export const personSchema = z.object({ id: z.string(), displayName: z.string() });
export type Person = z.infer<typeof personSchema>;
