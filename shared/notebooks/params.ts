import { z } from 'zod';
import { versionNumberText } from './version-number';

/** Ids in paths and request bodies. */
export const idText = z.string().min(1).max(64);
export const teamDesignsParamsSchema = z.object({ teamId: idText });
export const designParamsSchema = z.object({ id: idText });
export const versionParamsSchema = designParamsSchema.extend({ n: versionNumberText });
export const shareLinkParamsSchema = designParamsSchema.extend({ linkId: idText });
export const shareTokenParamsSchema = z.object({ token: z.string().min(16).max(128) });
