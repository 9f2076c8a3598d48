import { z } from 'zod';
import { versionNumberSchema } from './version-number';

/** `PUT /api/designs/:id/baseline`: marks one version as the team's baseline, or clears it with null. */
export const baselineRequestSchema = z.object({ version: versionNumberSchema.nullable() });
export type BaselineRequest = z.input<typeof baselineRequestSchema>;
