import Ajv2020 from 'ajv/dist/2020.js';
import addFormats from 'ajv-formats';
import * as fc from 'fast-check';
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DatabaseHandle } from '../../db/client';
import { defaultRateLimits, type RateLimits } from '../../server/auth/rate-limit';
import { errorBodySchema } from '../../shared/api-error';
import { traceAnswerSchema, type TraceAnswer } from '../../shared/contract/trace';
import { exampleDesign } from '../../shared/design';
import { TRACE_LIMITS } from '../../shared/trace';
import { createTestApp } from '../support/test-app';
import { openTestDatabase } from '../support/test-db';

const TSX = join(process.cwd(), 'node_modules/.bin/tsx');
const SCRIPT = join(process.cwd(), 'scripts/trace.ts');

/** Few rays: the checks below are of the route's bookkeeping and bounds, not of the optics' fine detail. */
const RAYS = 1000;

// Tracing reads and writes no data: one database for the file, a new app where a case needs other limits.
let database: DatabaseHandle;
beforeAll(async () => {
  database = await openTestDatabase();
});
afterAll(() => database?.close());

/** The example design as a monochromator: without a detector, an exit slit. */
const { detector: _detector, ...monochromator } = exampleDesign;

/** A spectrograph: 2048 pixels of 25 µm (51.2 mm) hold 560–640 nm, about 29 mm at 0.36 mm/nm. */
const spectrograph = { ...exampleDesign, range: { startNm: 560, endNm: 640 }, detector: { pixelPitchUm: 25, pixelCount: 2048 } };

/** The answer's wavelength nearest `nm`. */
function at(answer: TraceAnswer, nm: number) {
  return answer.wavelengths.reduce((best, w) => (Math.abs(w.wavelengthNm - nm) < Math.abs(best.wavelengthNm - nm) ? w : best));
}

describe('POST /api/trace', () => {
  let ctx: Awaited<ReturnType<typeof createTestApp>>;
  // The cases below send more than a minute's allowance; the limit has its own test.
  const limits: Partial<RateLimits> = { tracePerIp: 1e9 };
  beforeAll(async () => {
    ctx = await createTestApp({ database, rateLimits: limits });
  });
  afterAll(() => ctx?.close());

  const post = (body: unknown) => request(ctx.app).post('/api/trace').send(body as object);

  describe('a Czerny–Turner monochromator (the example design without its detector: 1200 g/mm, f 300 mm, 30° deviation, 300–900 nm)', () => {
    let answer: TraceAnswer;
    beforeAll(async () => {
      // No sign-in and no Origin header: supertest sends neither.
      const res = await post({ design: monochromator, atNm: [450], rays: RAYS }).expect(200);
      answer = traceAnswerSchema.parse(res.body);
    });

    it('traces the range’s start, centre and end and the wavelength asked for', () => {
      const traced = answer.wavelengths.map((w) => w.wavelengthNm);
      // Centre of 300–900 nm: 600 nm.
      for (const nm of [300, 450, 600, 900]) expect(traced.some((t) => Math.abs(t - nm) < 1e-9), `${nm} nm in ${traced.join(', ')}`).toBe(true);
      expect(answer.mode).toBe('monochromator');
      expect(answer.detectorTilt).toBeNull();
      expect(answer.imagePlane.length).toBeGreaterThan(0);
    });

    it('accounts for every ray it launched: traced + vignetted is the rays asked for, at each wavelength', () => {
      expect(answer.raysPerWavelength).toBe(RAYS);
      for (const w of answer.wavelengths) {
        expect(w.raysTraced + w.raysVignetted, `${w.wavelengthNm} nm`).toBe(answer.raysPerWavelength);
        expect(w.raysTraced).toBeGreaterThan(0);
        expect(w.raysVignetted).toBeGreaterThanOrEqual(0);
      }
    });

    it('images the centre wavelength onto the exit slit: the light’s centroid lies inside the 100 µm slit, across from its middle', () => {
      // A monochromator is turned to the wavelength it passes, so that wavelength's image lands on
      // the exit slit (common practice): its centroid within half the slit's width of the centre.
      const centre = at(answer, 600);
      expect(Math.abs(centre.centroidMm.x)).toBeLessThan(monochromator.slits.exitWidthUm / 1000 / 2);
      // The slit is lit evenly top to bottom and the mount is symmetric about the dispersion plane,
      // so the image's centroid in y is at the slit's middle (by symmetry), within sampling noise.
      expect(Math.abs(centre.centroidMm.y)).toBeLessThan(0.05 * monochromator.slits.heightMm);
    });

    it('disperses toward +x for longer wavelengths at the first-order rate f·|m| / (d cos β), within 2 % (Palmer & Loewen)', () => {
      // By hand at 600 nm: K = 15°, sin φ = mλ / (2d cos K) = 600 / (2 · 833.333 · 0.965926) = 0.372699,
      // φ = 21.883°, β = φ − K = 6.883°, cos β = 0.992793; f|m| / (d cos β) = 300 / (833.333e-6 · 0.992793)
      // = 362.62 mm/mm = 0.36262 mm/nm. The traced plane sits near f cos θ (2 % covers cos 10° = 0.985).
      const centre = at(answer, 600);
      expect(centre.tracedLinearDispersionMmPerNm).toBeGreaterThan(0);
      expect(Math.abs(centre.tracedLinearDispersionMmPerNm / 0.36262 - 1)).toBeLessThan(0.02);
    });

    it('traces a bandpass no narrower than the slits allow, and warns where it is more than 10 % off', () => {
      // Equal 100 µm slits: the slit-limited FWHM is w / (linear dispersion) = 0.1 / 0.36262 = 0.2758 nm
      // at 600 nm (Palmer & Loewen, ch. 6); aberrations only widen a line, so the traced FWHM is at least that.
      const centre = at(answer, 600);
      const slitLimitedNm = 0.1 / 0.36262;
      expect(centre.tracedFwhmNm).not.toBeNull();
      expect(centre.tracedFwhmNm!).toBeGreaterThan(0.95 * slitLimitedNm);
      const off = Math.abs(centre.tracedFwhmNm! / slitLimitedNm - 1);
      const warned = answer.warnings.some((w) => w.code === 'traced-bandpass-differs' && w.wavelengthNm === 600);
      // Away from the 10 % line (where the engine's own slit-limited figure may fall either side).
      if (off > 0.12) expect(warned, `traced ${centre.tracedFwhmNm} nm`).toBe(true);
      if (off < 0.08) expect(warned, `traced ${centre.tracedFwhmNm} nm`).toBe(false);
      const traced = new Set(answer.wavelengths.map((w) => w.wavelengthNm));
      for (const w of answer.warnings) expect(traced.has(w.wavelengthNm), w.message).toBe(true);
    });

    it('documents its answer: it validates against the OpenAPI document’s schema, and a wrong one does not', async () => {
      const document = (await request(ctx.app).get('/api/openapi.json').expect(200)).body as {
        paths: Record<string, { post: { operationId: string; security?: unknown; description: string; responses: Record<string, { content: Record<string, { schema: unknown }> }> } }>;
        components: unknown;
      };
      const op = document.paths['/trace']!.post;
      expect(op.operationId).toBe('trace.run');
      expect(op.security).toBeUndefined();
      // The contract (in shared/, which cannot import the server) states the server's default limit.
      expect(op.description).toContain(`${defaultRateLimits.tracePerIp} calls a minute per address`);
      const ajv = new Ajv2020({ strict: false, allErrors: true });
      addFormats(ajv);
      ajv.addSchema({ $id: 'doc', components: document.components });
      const schema = JSON.parse(JSON.stringify(op.responses['200']!.content['application/json']!.schema).replaceAll('"#/components/', '"doc#/components/'));
      const validate = ajv.compile(schema as object);
      expect(validate(answer) ? [] : validate.errors).toEqual([]);
      expect(validate({ ...answer, wavelengths: [{ ...answer.wavelengths[0], raysTraced: 'all' }] })).toBe(false);
    });

    it('gives the same JSON as npm run trace for the same design and flags', () => {
      const cli = spawnSync(TSX, [SCRIPT, '-', '--at', '450', '--rays', String(RAYS)], {
        input: JSON.stringify(monochromator),
        encoding: 'utf8',
        timeout: 60_000,
      });
      expect(cli.stderr).toBe('');
      expect(cli.status).toBe(0);
      expect(JSON.parse(cli.stdout)).toEqual(answer);
    }, 90_000);
  });

  it('spreads a spectrograph’s wavelengths across its detector: shorter toward −x, longer toward +x, at the grating equation’s angles', async () => {
    // 560–640 nm at about 0.36 mm/nm spans about 29 mm: 2048 pixels of 25 µm (51.2 mm) hold it all,
    // so the grating stays at the range's centre (600 nm) and the other wavelengths leave it at other
    // angles. By hand (Palmer & Loewen, ch. 2): φ = 21.882°, α = φ + K = 36.882°, sin α = 0.600172;
    // at 580 nm sin β = 580 / 833.333 − 0.600172 = 0.095828, β = 5.499°, so the chief ray turns by
    // Δβ = −1.383° from the centre's 6.882°; a camera of f = 300 mm puts it at f tan Δβ = −7.244 mm
    // (−7.134 mm at f cos 10°, 1.5 % nearer: 3 % covers either plane).
    const answer = traceAnswerSchema.parse((await post({ design: spectrograph, atNm: [580], rays: RAYS }).expect(200)).body);
    expect(answer.mode).toBe('spectrograph');
    expect(answer.detectorTilt).not.toBeNull();
    const xs = [560, 580, 600, 640].map((nm) => at(answer, nm).centroidMm.x);
    expect(xs).toEqual([...xs].sort((p, q) => p - q));
    expect(Math.abs(xs[2]!)).toBeLessThan(0.05);
    expect(Math.abs(xs[1]! / -7.244 - 1)).toBeLessThan(0.03);
    for (const w of answer.wavelengths) expect(w.raysTraced + w.raysVignetted).toBe(RAYS);
  }, 30_000);

  it(`traces ${TRACE_LIMITS.defaultRays} rays per wavelength when none are asked for`, async () => {
    const answer = traceAnswerSchema.parse((await post({ design: exampleDesign }).expect(200)).body);
    expect(answer.raysPerWavelength).toBe(TRACE_LIMITS.defaultRays);
    for (const w of answer.wavelengths) expect(w.raysTraced + w.raysVignetted).toBe(TRACE_LIMITS.defaultRays);
  }, 30_000);

  it('bends the entrance slit when asked, to the arc that straightens the centre wavelength’s image', async () => {
    const straight = traceAnswerSchema.parse((await post({ design: monochromator, rays: RAYS }).expect(200)).body);
    const curved = traceAnswerSchema.parse((await post({ design: monochromator, rays: RAYS, curvedEntrance: true }).expect(200)).body);
    // A plane grating bows a straight slit's image, (mλ/d) y² / (2 f cos β) = 0.72 · 5² / (2 · 300 ·
    // 0.99279) = 0.030 mm at the ends of this 10 mm slit at 600 nm (Schroeder, Astronomical Optics);
    // the off-axis mirrors add to it. An arc is named, and it is an arc, not a line.
    expect(straight.straighteningRadiusMm).not.toBeNull();
    expect(curved.straighteningRadiusMm).toBe(straight.straighteningRadiusMm);
    expect(Math.abs(straight.straighteningRadiusMm!)).toBeGreaterThan(monochromator.slits.heightMm / 2);
    const bowStraight = at(straight, 600).curvatureSagittaMm;
    expect(Math.abs(bowStraight)).toBeGreaterThan(0.02);
    // Bent to that arc, the centre wavelength's image is (nearly) straight: most of the bow is gone.
    expect(Math.abs(at(curved, 600).curvatureSagittaMm)).toBeLessThan(0.25 * Math.abs(bowStraight));
  }, 30_000);

  it.each([
    ['too few rays', { rays: TRACE_LIMITS.minRays - 1 }, 'rays', new RegExp(`at least ${TRACE_LIMITS.minRays}`)],
    ['too many rays', { rays: TRACE_LIMITS.maxRays + 1 }, 'rays', new RegExp(`at most ${TRACE_LIMITS.maxRays}`)],
    ['a fraction of a ray', { rays: 1000.5 }, 'rays', /whole number of rays/],
    ['rays as text', { rays: '1000' }, 'rays', /whole number of rays/],
    ['a negative wavelength', { atNm: [-5] }, 'atNm.0', /at least 1 nm/],
    ['a wavelength as text', { atNm: [500, '600'] }, 'atNm.1', /must be a number/],
    [
      'more wavelengths than the limit',
      { atNm: Array.from({ length: TRACE_LIMITS.maxWavelengths + 1 }, (_, i) => 400 + i) },
      'atNm',
      new RegExp(`at most ${TRACE_LIMITS.maxWavelengths} wavelengths`),
    ],
    ['a curved entrance as text', { curvedEntrance: 'yes' }, 'curvedEntrance', /true or false/],
    ['a slit of no height', { design: { ...exampleDesign, slits: { ...exampleDesign.slits, heightMm: 0 } } }, 'design.slits.heightMm', /./],
    ['a grating of no grooves', { design: { ...exampleDesign, grating: { ...exampleDesign.grating, grooveDensityPerMm: -1 } } }, 'design.grating.grooveDensityPerMm', /./],
    ['no design', { design: undefined }, 'design', /./],
    ['a misspelt option', { ray: 1000 }, '(body)', /ray/],
  ] satisfies [string, Record<string, unknown>, string, RegExp][])('refuses %s with a 400 naming the field', async (_name, change, field, message) => {
    const res = await post({ design: exampleDesign, rays: RAYS, ...change }).expect(400);
    const { error } = errorBodySchema.parse(res.body);
    expect(error.code).toBe('invalid_request');
    expect(error.fields?.[field], JSON.stringify(error.fields)).toMatch(message);
    expect(ctx.errors).toEqual([]);
  });

  it.each([
    ['no body', undefined],
    ['null', null],
    ['a list', [exampleDesign]],
    ['the bare design (not wrapped in "design")', exampleDesign],
    ['a poisoned key', JSON.parse(`{"design":${JSON.stringify(exampleDesign)},"__proto__":{"rays":1e9}}`)],
    ['a huge ray count', { design: exampleDesign, rays: 1e308 }],
  ] satisfies [string, unknown][])('answers %s with no 500, refusals in the error shape', async (_name, body) => {
    const res = await request(ctx.app).post('/api/trace').set('content-type', 'application/json').send(JSON.stringify(body ?? ''));
    expect(res.status).toBe(400);
    expect(errorBodySchema.safeParse(res.body).success).toBe(true);
    expect(ctx.errors).toEqual([]);
  });

  // hostile-bodies.property.test.ts throws poisoned JSON at the route; here the design's numbers
  // (and the options') are replaced by any double the schema might let through, and an accepted
  // body's answer must hold only what its schema documents: a NaN or an infinity from the trace
  // would reach the JSON as null and fail it.
  it.each([
    ['monochromator', monochromator],
    ['spectrograph', spectrograph],
  ] as const)('%s: any numbers get an answer its schema documents or a 400 naming a field, never a 500', async (_kind, design) => {
    const base = { design, atNm: [450], rays: 200 };
    const numericPaths: (string | number)[][] = [];
    const walk = (value: unknown, path: (string | number)[]) => {
      if (typeof value === 'number') numericPaths.push(path);
      else if (Array.isArray(value)) value.forEach((v, i) => walk(v, [...path, i]));
      else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) walk(v, [...path, k]);
    };
    walk(base, []);
    const extreme = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true }),
      fc.constantFrom(5e-324, 1e-300, 0.001, 0.5, 1, 2, 45, 89, 89.999, 179.999, 1e4, 1e7, 1e308, -1, -89),
    );
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
        expect(res.status, `${JSON.stringify(changes)} → ${res.text.slice(0, 300)}`).toBeLessThan(500);
        if (res.status === 200) {
          answered += 1;
          const parsed = traceAnswerSchema.safeParse(res.body);
          expect(parsed.success, `${JSON.stringify(changes)} → ${res.text.slice(0, 300)}`).toBe(true);
          for (const w of parsed.data!.wavelengths) expect(w.raysTraced + w.raysVignetted).toBe(parsed.data!.raysPerWavelength);
        } else {
          expect(res.status).toBe(400);
          expect(errorBodySchema.parse(res.body).error.fields).toBeDefined();
        }
      }),
      { numRuns: 200 },
    );
    // Not vacuous: some of the changed bodies got past the schema and were traced.
    expect(answered).toBeGreaterThan(10);
    expect(ctx.errors).toEqual([]);
  }, 120_000);

  it('answers a body over 1 MB with a 413 in the error shape, before reading it', async () => {
    const big = JSON.stringify({ design: exampleDesign, rays: RAYS, note: 'x'.repeat(1024 * 1024) });
    const res = await request(ctx.app).post('/api/trace').set('content-type', 'application/json').send(big).expect(413);
    expect(errorBodySchema.parse(res.body).error.code).toBe('payload_too_large');
  });
});

describe('POST /api/trace rate limit', () => {
  it('answers the call past tracePerIp with 429, on its own counter apart from solving', async () => {
    const limits: Partial<RateLimits> = { tracePerIp: 2, solvePerIp: 1, solveWindowMs: 60_000 };
    const ctx = await createTestApp({ database, rateLimits: limits });
    try {
      // Refused bodies count too: the limit guards the thread before the body is read.
      for (let i = 0; i < 2; i++) await request(ctx.app).post('/api/trace').send({ rays: 1 }).expect(400);
      const res = await request(ctx.app).post('/api/trace').send({ design: exampleDesign, rays: RAYS }).expect(429);
      const { error } = errorBodySchema.parse(res.body);
      expect(error.code).toBe('rate_limited');
      expect(error.message).toMatch(/traces/);
      // Its own counter: the solver's allowance of 1 is still whole.
      await request(ctx.app).post('/api/solve').send({ design: exampleDesign, at: [500] }).expect(200);
    } finally {
      await ctx.close();
    }
  });
});
