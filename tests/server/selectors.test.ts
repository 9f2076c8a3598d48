import Ajv2020 from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import * as fc from 'fast-check';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EXAMPLES } from '../../scripts/selectors';
import { errorBodySchema } from '../../shared/api-error';
import {
  absorptionStackAnswerSchema,
  interferenceFilterAnswerSchema,
  prismAnswerSchema,
  selectorAnswerSchema,
} from '../../shared/selector-answers';
import { SELECTOR_LIMITS } from '../../shared/selectors';
import { defaultRateLimits } from '../../server/auth/rate-limit';
import type { DatabaseHandle } from '../../db/client';
import { createTestApp } from '../support/test-app';
import { openTestDatabase } from '../support/test-db';

const TSX = join(process.cwd(), 'node_modules/.bin/tsx');
const SCRIPT = join(process.cwd(), 'scripts/selectors.ts');

/** Malitson 1965's fused-silica Sellmeier coefficients (B, and C in µm), entered by hand. */
const malitsonFusedSilica = { B: [0.6961663, 0.4079426, 0.8974794], C: [0.0684043, 0.1162414, 9.896161] };

/** One coloured-glass long-pass, far past its edge at 1000 nm: its plateau. */
const longPass = {
  shape: 'long-pass',
  edgeNm: 420,
  edgeWidthNm: 20,
  peakInternalTransmission: 0.95,
  referenceThicknessMm: 3,
  thicknessMm: 6,
  refractiveIndex: 1.52,
} as const;

let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

describe('POST /api/selectors', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  beforeAll(async () => {
    // The fuzzing below sends far more than a minute's allowance; the limit has its own test.
    ctx = await createTestApp({ database, rateLimits: { selectorsPerIp: 1e9 } });
  });
  afterAll(() => ctx?.close());

  const post = (body: unknown) => request(ctx.app).post('/api/selectors').send(body as object);

  it('answers an interference filter without signing in or an Origin header (Hecht, Optics, §9.6)', async () => {
    const res = await post({ ...EXAMPLES['interference-filter'], tiltsDeg: [0, 20] }).expect(200);
    const answer = interferenceFilterAnswerSchema.parse(res.body);
    // First order at normal incidence: optical thickness nt = λ/2, so t = 500 / (2 · 1.5) = 166.67 nm.
    expect(answer.spacerThicknessNm).toBeCloseTo(166.667, 2);
    // Peaks 2nt/k = 500/k nm: only k = 1 lies in 300–1100 nm (k = 2 is 250 nm).
    expect(answer.peaksNm).toHaveLength(1);
    expect(answer.peaksNm[0]).toBeCloseTo(500, 6);
    // Finesse π√0.9 / 0.1 = 29.80; FSR λ/m = 500 nm; FWHM = 500 / 29.80 = 16.78 nm.
    expect(answer.finesse).toBeCloseTo(29.804, 2);
    expect(answer.freeSpectralRangeNm).toBeCloseTo(500, 6);
    expect(answer.fwhmNm).toBeCloseTo(16.776, 2);
    // λ(20°) = 500 √(1 − (sin 20° / 1.5)²) = 500 √(1 − 0.051990) = 486.83 nm.
    expect(answer.tilt.map((t) => t.tiltDeg)).toEqual([0, 20]);
    expect(answer.tilt[0]!.peakNm).toBeCloseTo(500, 6);
    expect(answer.tilt[1]!.peakNm).toBeCloseTo(486.83, 1);
  });

  it('answers an absorption stack: on the plateau T_ref^(t/t_ref) times two surfaces, and two filters give the square of one', async () => {
    const one = absorptionStackAnswerSchema.parse(
      (await post({ kind: 'absorption-stack', filters: [longPass], wavelengthsNm: [430, 1000] }).expect(200)).body,
    );
    expect(one.points.map((p) => p.wavelengthNm)).toEqual([430, 1000]);
    // Beer–Lambert: 0.95^(6/3) = 0.9025; Fresnel at normal incidence r = ((1.52 − 1)/(1.52 + 1))² = 0.042580
    // per surface, two surfaces (1 − r)² = 0.91665; so 0.9025 × 0.91665 = 0.82728 (by hand).
    expect(one.points[1]!.transmission).toBeCloseTo(0.82728, 3);
    expect(one.peakTransmission).toBeCloseTo(Math.max(...one.points.map((p) => p.transmission)), 12);
    const two = absorptionStackAnswerSchema.parse(
      (await post({ kind: 'absorption-stack', filters: [longPass, longPass], wavelengthsNm: [430, 1000] }).expect(200)).body,
    );
    // A stack's transmission is the product of its filters' (issue 16): identical filters, the square.
    for (const [i, point] of two.points.entries()) expect(point.transmission).toBeCloseTo(one.points[i]!.transmission ** 2, 10);
  });

  it('answers a prism: fused silica n(587.6 nm) = 1.45846 (Malitson 1965) and its minimum deviation on a 60° prism', async () => {
    const res = await post({ kind: 'prism', material: 'fused-silica', apexDeg: 60, baseMm: 50, wavelengthsNm: [587.6, 589.3] }).expect(200);
    const answer = prismAnswerSchema.parse(res.body);
    expect(answer.material.id).toBe('fused-silica');
    expect(answer.material.source).toMatch(/Malitson/);
    const [d, na] = answer.points;
    expect(d!.index).toBeCloseTo(1.45846, 5);
    expect(na!.index).toBeCloseTo(1.4584, 4);
    // At minimum deviation n = sin((A + δ)/2) / sin(A/2) (Born & Wolf; Hecht), so
    // δ = 2 asin(1.45846 · sin 30°) − 60° = 2 · 46.822° − 60° = 33.64°.
    expect(d!.minDeviationDeg).toBeCloseTo(33.64, 1);
    // dn/dλ from Malitson's formula (central difference over ±0.01 nm, by hand): −3.521e-5 per nm.
    expect(d!.dnDlambdaPerNm).toBeCloseTo(-3.521e-5, 7);
    // dδ/dλ = 2 sin(A/2) / √(1 − n² sin²(A/2)) · dn/dλ (Hecht) = 1.46142 × 3.521e-5 rad/nm = 0.002948°/nm.
    expect(Math.abs(d!.angularDispersionDegPerNm!)).toBeCloseTo(0.002948, 5);
    // R = b |dn/dλ| = 5e7 nm × 3.521e-5 /nm = 1760 (Born & Wolf).
    expect(d!.resolvingPower).toBeCloseTo(1760, -1);
  });

  it('takes a user-entered Sellmeier formula: Malitson’s own coefficients give the built-in fused silica', async () => {
    const body = { kind: 'prism', apexDeg: 60, baseMm: 50, wavelengthsNm: [400, 587.6, 700] };
    const builtIn = prismAnswerSchema.parse((await post({ ...body, material: 'fused-silica' }).expect(200)).body);
    const custom = prismAnswerSchema.parse((await post({ ...body, material: { sellmeier: malitsonFusedSilica } }).expect(200)).body);
    expect(custom.material.id).toBe('custom');
    for (const [i, point] of custom.points.entries()) expect(point.index).toBeCloseTo(builtIn.points[i]!.index!, 9);
  });

  it.each([
    ['an unknown kind', { kind: 'laser' }, 'kind', /must have a kind/],
    ['an unknown material', { ...EXAMPLES.prism, material: 'glass' }, 'material', /must be one of fused-silica/],
    ['no wavelengths', { ...EXAMPLES.prism, wavelengthsNm: [] }, 'wavelengthsNm', /at least one wavelength/],
    [
      'more wavelengths than the limit',
      { ...EXAMPLES.prism, wavelengthsNm: Array.from({ length: SELECTOR_LIMITS.maxWavelengths + 1 }, (_, i) => 400 + i * 0.1) },
      'wavelengthsNm',
      /at most 1000 wavelengths/,
    ],
    [
      'a negative filter thickness',
      { ...EXAMPLES['absorption-stack'], filters: [{ ...longPass, thicknessMm: -1 }] },
      'filters.0.thicknessMm',
      /greater than 0/,
    ],
    ['a perfect mirror', { ...EXAMPLES['interference-filter'], mirrorReflectance: 1 }, 'mirrorReflectance', /less than 1/],
    ['a reversed range', { ...EXAMPLES['interference-filter'], rangeNm: { startNm: 700, endNm: 400 } }, 'rangeNm.endNm', /greater than startNm/],
    // A range starting next to 0 nm would hold nearly every order: the design's 0.001 nm floor.
    ['a range from 1e-320 nm', { ...EXAMPLES['interference-filter'], rangeNm: { startNm: 1e-320, endNm: 1000 } }, 'rangeNm.startNm', /at least 0.001 nm/],
    ['a misspelt field', { ...EXAMPLES['interference-filter'], targetnm: 500 }, '(body)', /unknown field 'targetnm'/],
  ] satisfies [string, unknown, string, RegExp][])('refuses %s with a 400 naming the field', async (_name, body, field, message) => {
    const res = await post(body).expect(400);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.code).toBe('invalid_request');
    expect(error.fields?.[field]).toMatch(message);
  });

  it.each([
    ['no body', undefined],
    ['null', null],
    ['a list', [1, 2]],
    ['a string', 'prism'],
    ['numbers as text', { ...EXAMPLES.prism, apexDeg: '60' }],
    ['a poisoned key', JSON.parse('{"kind":"prism","__proto__":{"polluted":true}}')],
    ['a huge number', { ...EXAMPLES['interference-filter'], order: 1e308 }],
    ['a Sellmeier pole on a wavelength', { ...EXAMPLES.prism, material: { sellmeier: { B: [1], C: [0.5] } }, wavelengthsNm: [500] }],
  ] satisfies [string, unknown][])('answers %s with no 500, refusals in the error shape', async (_name, body) => {
    const res = await request(ctx.app).post('/api/selectors').set('content-type', 'application/json').send(JSON.stringify(body ?? ''));
    expect(res.status).toBeLessThan(500);
    if (res.status >= 400) expect(errorBodySchema.safeParse(res.body).success).toBe(true);
    else expect(selectorAnswerSchema.safeParse(res.body).success).toBe(true);
  });

  // hostile-bodies.property.test.ts fuzzes the route with a prism body; here every kind's numbers
  // are replaced by any double the schema might let through, and an accepted body's answer must hold
  // only what its schema documents: a NaN or an infinity would reach the JSON as null and fail it.
  it.each(Object.keys(EXAMPLES) as (keyof typeof EXAMPLES)[])('%s: any numbers get an answer its schema documents or a 400, never a 500', async (kind) => {
    const base = EXAMPLES[kind] as unknown;
    const numericPaths: (string | number)[][] = [];
    const walk = (value: unknown, path: (string | number)[]) => {
      if (typeof value === 'number') numericPaths.push(path);
      else if (Array.isArray(value)) value.forEach((v, i) => walk(v, [...path, i]));
      else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) walk(v, [...path, k]);
    };
    walk(base, []);
    const extreme = fc.oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.constantFrom(5e-324, 1e-300, 0.999999999, 1, 89, 179.999, 1e7, 1e308));
    let answered = 0;
    await fc.assert(
      fc.asyncProperty(fc.array(fc.tuple(fc.constantFrom(...numericPaths), extreme), { minLength: 1, maxLength: 3 }), async (changes) => {
        const body = structuredClone(base) as Record<string | number, unknown>;
        for (const [path, value] of changes) {
          let node = body;
          for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
          node[path[path.length - 1]!] = value;
        }
        const res = await post(body);
        expect(res.status, res.text.slice(0, 300)).toBeLessThan(500);
        if (res.status === 200) {
          answered += 1;
          const parsed = selectorAnswerSchema.safeParse(res.body);
          expect(parsed.success, `${JSON.stringify(body)} → ${res.text.slice(0, 300)}`).toBe(true);
        } else {
          expect(res.status).toBe(400);
          expect(errorBodySchema.parse(res.body).error.fields).toBeDefined();
        }
      }),
      { numRuns: 300 },
    );
    // Not vacuous: some of the changed bodies got past the schema and were calculated.
    expect(answered).toBeGreaterThan(10);
    expect(ctx.errors).toEqual([]);
  }, 60_000);

  it('gives the same answer as the selectors script for the same input, each kind', async () => {
    for (const input of Object.values(EXAMPLES)) {
      const api = (await post(input).expect(200)).body as unknown;
      const cli = spawnSync(TSX, [SCRIPT, '-'], { input: JSON.stringify(input), encoding: 'utf8', timeout: 60_000 });
      expect(cli.stderr).toBe('');
      expect(cli.status).toBe(0);
      expect(JSON.parse(cli.stdout)).toEqual(api);
    }
  }, 120_000);

  describe('in the OpenAPI document', () => {
    let document: { paths: Record<string, Record<string, Record<string, unknown>>>; components: unknown };
    beforeAll(async () => {
      document = (await request(ctx.app).get('/api/openapi.json').expect(200)).body;
    });

    /** A documented schema compiled with Ajv's JSON Schema 2020-12 dialect, as tests/server/openapi.test.ts does. */
    function compile(schema: unknown) {
      const ajv = new Ajv2020({ strict: false, allErrors: true });
      addFormats(ajv);
      ajv.addSchema({ $id: 'doc', components: document.components });
      return ajv.compile(JSON.parse(JSON.stringify(schema).replaceAll('"#/components/', '"doc#/components/')) as object);
    }

    it('lists /selectors under its contract name, with no session needed', () => {
      const op = document.paths['/selectors']?.post;
      expect(op?.operationId).toBe('selectors.run');
      expect(op?.security).toBeUndefined();
      // The contract (in shared/, which cannot import the server) states the server's default limit.
      expect(op?.description).toContain(`${defaultRateLimits.selectorsPerIp} calls a minute per address`);
    });

    it('documents the input of each kind: the examples pass the documented body schema, a bad body fails it', () => {
      const op = document.paths['/selectors']!.post as { requestBody: { content: Record<string, { schema: unknown }> } };
      const validate = compile(op.requestBody.content['application/json']!.schema);
      for (const input of Object.values(EXAMPLES)) expect(validate(input) ? [] : validate.errors).toEqual([]);
      expect(validate({ ...EXAMPLES.prism, material: 'glass' })).toBe(false);
      expect(validate({ ...EXAMPLES['interference-filter'], kind: 'laser' })).toBe(false);
    });

    it('documents the output: each kind’s real answer validates against it, and a wrong one does not', async () => {
      const op = document.paths['/selectors']!.post as { responses: Record<string, { content: Record<string, { schema: unknown }> }> };
      const validate = compile(op.responses['200']!.content['application/json']!.schema);
      for (const input of Object.values(EXAMPLES)) {
        const answer = (await post(input).expect(200)).body as Record<string, unknown>;
        expect(validate(answer) ? [] : validate.errors).toEqual([]);
        expect(validate({ ...answer, warnings: 'none' })).toBe(false);
      }
    });
  });
});

describe('POST /api/selectors rate limit', () => {
  it('takes its limit from AppDeps.rateLimits and answers the next call with 429, apart from searching', async () => {
    const ctx = await createTestApp({ database, rateLimits: { selectorsPerIp: 2, searchPerIp: 1, solveWindowMs: 60_000 } });
    try {
      for (let i = 0; i < 2; i++) await request(ctx.app).post('/api/selectors').send(EXAMPLES.prism).expect(200);
      const res = await request(ctx.app).post('/api/selectors').send(EXAMPLES.prism).expect(429);
      const { error } = errorBodySchema.parse(res.body);
      expect(error.code).toBe('rate_limited');
      expect(error.message).toMatch(/selector calculations/);
      // Its own counter: the search's allowance of 1 is still whole.
      await request(ctx.app)
        .post('/api/search')
        .send({
          range: { startNm: 500, endNm: 600 },
          requirements: { maxBandpassNm: 1 },
          search: { grooveDensitiesPerMm: [1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300] },
        })
        .expect(200);
    } finally {
      await ctx.close();
    }
  });
});
