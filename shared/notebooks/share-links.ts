import { z } from 'zod';
import { storedDesignSchema } from '../design';
import { personSchema } from './fields';
import { versionNumberSchema } from './version-number';
import { versionSummarySchema } from './versions';

export const shareLinkSchema = z.object({
  id: z.string(),
  /** Null: the link always shows the latest version. */
  version: z.number().int().positive().nullable(),
  createdBy: personSchema.nullable(),
  createdAt: z.iso.datetime(),
  expiresAt: z.iso.datetime().nullable(),
  revokedAt: z.iso.datetime().nullable(),
  /** Not revoked and not expired, by the server's clock. */
  active: z.boolean(),
});
export type ShareLink = z.infer<typeof shareLinkSchema>;

export const createShareLinkRequestSchema = z.object({
  version: versionNumberSchema.nullable().default(null),
  expiresAt: z.iso
    .datetime({ error: 'must be a date and time such as 2026-06-30T12:00:00Z' })
    .nullable()
    .default(null),
});
export type CreateShareLinkRequest = z.input<typeof createShareLinkRequestSchema>;

/** The token is shown once, at creation: only its hash is stored. */
export const createShareLinkResponseSchema = z.object({
  link: shareLinkSchema,
  token: z.string(),
  /** The web path that opens it, e.g. `/share/<token>`. */
  path: z.string(),
});
export type CreateShareLinkResponse = z.infer<typeof createShareLinkResponseSchema>;
export const shareLinkListResponseSchema = z.object({ links: z.array(shareLinkSchema) });

/** `GET /api/share/:token`, signed out: one version, read-only. No members, no other designs. */
export const sharedVersionResponseSchema = z.object({
  title: z.string(),
  /** True when the link is pinned to this version; false when it follows the latest. */
  pinned: z.boolean(),
  expiresAt: z.iso.datetime().nullable(),
  version: z.object({
    number: z.number().int().positive(),
    message: z.string(),
    createdAt: z.iso.datetime(),
    params: storedDesignSchema,
    notes: z.string(),
    summary: versionSummarySchema,
  }),
});
export type SharedVersionResponse = z.infer<typeof sharedVersionResponseSchema>;
