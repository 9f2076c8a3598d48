import { z } from 'zod';

/** Version numbers live in PostgreSQL `integer` columns: larger ones are refused, not overflowed. */
export const maxVersionNumber = 2_147_483_647;
// zod's int check also refuses numbers past 2^53, so its message states the range too.
const wholeVersionNumber = `must be a whole number from 1 to ${maxVersionNumber}`;

export const versionNumberSchema = z
  .number({ error: 'must be a version number' })
  .int({ error: wholeVersionNumber })
  .min(1, { error: 'must be at least 1' })
  .max(maxVersionNumber, { error: `must be at most ${maxVersionNumber}` });

/** Version numbers in paths and query strings arrive as text. */
export const versionNumberText = z.coerce
  .number({ error: 'must be a version number' })
  .int({ error: wholeVersionNumber })
  .min(1, { error: 'must be at least 1' })
  .max(maxVersionNumber, { error: `must be at most ${maxVersionNumber}` });
