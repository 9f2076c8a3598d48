import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@/features/solver';
import { exampleDesign, type Design } from '@/shared/design';
import { solveResponseSchema } from '@/shared/solve';

/**
 * The solver's answer as the API contract describes it (strict objects: a field added, renamed or
 * dropped on either side fails here), for designs that reach every branch of the answer.
 */
const designs: Record<string, Design> = {
  'the example Czerny–Turner': exampleDesign,
  'with a detector': { ...exampleDesign, detector: { pixelPitchUm: 12.5, pixelCount: 2048 } },
  'a Littrow in order 2, partly unreachable': {
    ...exampleDesign,
    grating: { ...exampleDesign.grating, order: 2 },
    layout: { ...exampleDesign.layout, kind: 'littrow', deviationDeg: 0 },
    range: { startNm: 200, endNm: 1500 },
  } as Design,
};

describe('the solve answer schema', () => {
  it.each(Object.entries(designs))('parses what the solver gives for %s', (_name, design) => {
    const evaluation = evaluateDesign(design, { points: 25 });
    const parsed = solveResponseSchema.safeParse(evaluation);
    expect(parsed.success ? [] : parsed.error.issues).toEqual([]);
  });

  it('refuses an answer with a field the contract does not describe', () => {
    const evaluation = evaluateDesign(exampleDesign, { points: 2 });
    expect(solveResponseSchema.safeParse({ ...evaluation, extra: 1 }).success).toBe(false);
    expect(solveResponseSchema.safeParse({ ...evaluation, points: [{ ...evaluation.points[0], bandpassNm: 'wide' }] }).success).toBe(false);
  });
});
