import { z } from 'zod';
import { number, section } from './schema-words';

/**
 * How light reaches the entrance slit: the optional `input` block of a design. Field names carry
 * their units and are part of the scripting interface and the notebook file.
 *
 * - `free-space`: a source at or imaged onto the slit. With `fNumber` the cone it fills is known;
 *   without it the input is taken as matched to the instrument (stated wherever it is used).
 * - `fibre`: a fibre butted against the slit, its cone `f/# ≈ 1/(2 NA)` (common practice) and its
 *   core imaged 1:1 onto the slit.
 * - `lens`: a lens focusing the source onto the slit at the given f-number.
 */

export const INPUT_KINDS = ['free-space', 'fibre', 'lens'] as const;
export type InputKind = (typeof INPUT_KINDS)[number];

const fNumber = () =>
  number()
    .min(0.5, { error: 'must be at least 0.5 (no beam is faster: sine condition)' })
    .max(1000, { error: 'must be at most 1000' });

const kind = <K extends InputKind>(value: K) =>
  z.literal(value, {
    error: (issue) =>
      issue.input === undefined ? 'is required' : `must be one of ${INPUT_KINDS.join(', ')}`,
  });

export const freeSpaceInputSchema = section({ kind: kind('free-space'), fNumber: fNumber().optional() });
export const fibreInputSchema = section({
  kind: kind('fibre'),
  numericalAperture: number()
    .gt(0, { error: 'must be greater than 0' })
    .max(1, { error: 'must be at most 1 (in air)' }),
  coreDiameterUm: number()
    .gt(0, { error: 'must be greater than 0' })
    .min(0.1, { error: 'must be at least 0.1 µm' })
    .max(100_000, { error: 'must be at most 100000 µm' }),
});
export const lensInputSchema = section({ kind: kind('lens'), fNumber: fNumber() });

/**
 * One of the three inputs, chosen by `kind`. A wrong or missing kind is named on `kind` itself
 * rather than as three failed alternatives.
 */
export const lightInputSchema = z.discriminatedUnion('kind', [freeSpaceInputSchema, fibreInputSchema, lensInputSchema], {
  error: (issue) => {
    if (issue.input === undefined) return 'is required';
    if (typeof issue.input !== 'object' || issue.input === null || Array.isArray(issue.input)) return 'must be an object';
    return { message: `must be one of ${INPUT_KINDS.join(', ')}`, path: ['kind'] } as never;
  },
});

export type LightInput = z.infer<typeof lightInputSchema>;
