import { count } from 'drizzle-orm';
import * as fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teamCurves } from '../../db/schema';
import { errorBodySchema } from '../../shared/api-error';
import { CURVE_KINDS, designCurveSchema } from '../../shared/curves';
import { createNotebookFixture, type NotebookFixture } from './notebooks/fixture';

/**
 * Poisoned multipart forms and files thrown at the curve uploads: random bytes, text built from
 * the pieces curve files are made of (numbers of every shape, delimiters, quotes, comments, NULs,
 * broken UTF-8), and fields with any value or name. Whatever arrives, the answer is never a 500,
 * every refusal has the error shape, nothing is stored on a refusal, and whatever is stored is a
 * curve a design can carry.
 */

const runs = 300;

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture({ rateLimits: { curveUploadsPerIp: 1e9 } });
}, 60_000);
afterAll(() => fx?.ctx.close());

const stored = async () => (await fx.ctx.database.db.select({ n: count() }).from(teamCurves))[0]!.n;

const piece = fc.oneof(
  fc.constantFrom(',', ';', '\t', '\n', '\r\n', '\r', '"', '#', ' ', '%', 'nm', 'µm', 'um', 'air', 'vacuum', 'Wavelength (nm)', 'QE %', '\u0000', '\uFEFF', 'e', '-', '.', ',,'),
  fc.double({ noNaN: false }).map(String),
  fc.integer({ min: -1000, max: 100_000 }).map(String),
  fc.string({ maxLength: 6 }),
);
const curveText = fc.array(piece, { maxLength: 80 }).map((pieces) => Buffer.from(pieces.join(''), 'utf8'));
/** Mostly sensible files with one line poisoned, so the later checks (increasing, bounds, conversion) are reached. */
const nearlyGood = fc
  .tuple(fc.integer({ min: 2, max: 40 }), fc.integer({ min: 0, max: 39 }), piece)
  .map(([n, bad, poison]) => Buffer.from(Array.from({ length: n }, (_, i) => (i === bad ? `${300 + i},${poison}` : `${300 + i * 10},${(i % 10) / 10}`)).join('\n')));
const file = fc.oneof(curveText, nearlyGood, fc.uint8Array({ maxLength: 400 }).map((bytes) => Buffer.from(bytes)));

const fieldValue = fc.oneof(fc.constantFrom(...CURVE_KINDS), fc.constantFrom('nm', 'um', 'percent', 'fraction', 'air', 'vacuum', 'unstated', '', 'a\u0000b', '\uD800'), fc.string({ maxLength: 30 }));
const fields = fc.record(
  {
    kind: fc.oneof(fc.constantFrom(...CURVE_KINDS), fieldValue),
    wavelengthUnit: fieldValue,
    valueScale: fieldValue,
    medium: fieldValue,
    name: fieldValue,
  },
  { requiredKeys: ['kind'] },
);
const extraField = fc.option(fc.tuple(fc.string({ minLength: 1, maxLength: 12 }), fc.string({ maxLength: 12 })), { nil: undefined });
const fileName = fc.oneof(fc.constant('curve.csv'), fc.string({ maxLength: 30 }).map((s) => `${s.replace(/["\r\n\\]/g, '')}.csv`));

describe.each(['preview', 'upload'] as const)('POST curves %s', (which) => {
  it(`answers ${runs} poisoned forms without a 500, refusals in the error shape, nothing stored on a refusal`, async () => {
    await fc.assert(
      fc.asyncProperty(file, fields, extraField, fileName, async (bytes, form, extra, name) => {
        const path = which === 'preview' ? '/api/curves/preview' : `/api/teams/${fx.teamId}/curves`;
        const before = await stored();
        let req = fx.owner.agent.post(path);
        for (const [key, value] of Object.entries(form)) if (value !== undefined) req = req.field(key, value);
        if (extra) req = req.field(extra[0], extra[1]);
        const res = await req.attach('file', bytes, name);
        expect(res.status, `${res.status} ${res.text.slice(0, 300)}`).toBeLessThan(500);
        const after = await stored();
        if (res.status >= 400) {
          expect(errorBodySchema.safeParse(res.body).success, res.text.slice(0, 300)).toBe(true);
          expect(after).toBe(before);
        } else if (which === 'upload') {
          expect(after).toBe(res.status === 201 ? before + 1 : before);
          expect(designCurveSchema.safeParse(res.body.curve.designCurve).success).toBe(true);
        } else {
          expect(after).toBe(before);
        }
      }),
      { numRuns: runs },
    );
    expect(fx.ctx.errors).toEqual([]);
  }, 120_000);
});
