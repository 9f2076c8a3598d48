import { z } from 'zod';
import { designTitleSchema } from './fields';
import { idText } from './params';
import { versionNumberSchema } from './version-number';

/** `POST /api/designs/:id/clone`: any member may clone, into a team where they are owner. */
export const cloneRequestSchema = z.object({
  /** Default: the latest version. */
  version: versionNumberSchema.optional(),
  /** Default: the caller's personal workspace. */
  teamId: idText.optional(),
  /** Default: the source's title. */
  title: designTitleSchema.optional(),
});
export type CloneRequest = z.input<typeof cloneRequestSchema>;
