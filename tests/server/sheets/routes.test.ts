import type { Response } from 'superagent';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBodySchema } from '../../../shared/api-error';
import { createShareLinkResponseSchema } from '../../../shared/notebooks';
import { MAX_SHEET_WAVELENGTHS, sheetFileName } from '../../../shared/sheets';
import { sheetSections } from '../../../server/sheets/registry';
import { CHANGED } from '../../../server/sheets/sections/compare-parameters';
import request from 'supertest';
import { browserAgent, createTestApp, testOrigin } from '../../support/test-app';
import { createNotebook, createNotebookFixture, designWith, saveVersion, type NotebookFixture } from '../notebooks/fixture';
import { pdfText } from './pdf-text';
import { bytesOf } from './http';

/**
 * The design sheet's three routes over HTTP: who gets the PDF, what it is called and how it is
 * cached, the paper and `at` options, and that every refusal or failure is the JSON error shape,
 * never (part of) a PDF.
 */

let fx: NotebookFixture;
let designId: string;
const title = 'Visible scanner';

beforeAll(async () => {
  fx = await createNotebookFixture();
  designId = (await createNotebook(fx, title)).design.id;
  await saveVersion(fx, designId, 1, designWith({ slits: { exitWidthUm: 40 } }), 'Narrow exit').expect(201);
}, 60_000);
afterAll(() => fx?.ctx.close());

const anonymous = () => browserAgent(fx.ctx.app);


/** A refusal: JSON in the one error shape, and no PDF bytes. */
function errorOf(res: Response & { body: Buffer }) {
  expect(res.headers['content-type']).toMatch(/^application\/json/);
  expect(res.body.subarray(0, 4).toString('latin1')).not.toBe('%PDF');
  return errorBodySchema.parse(JSON.parse(res.body.toString('utf8'))).error;
}

/** A whole PDF: the header at the start and the end-of-file marker at the end, as long as it says. */
function expectWholePdf(res: Response & { body: Buffer }) {
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toBe('application/pdf');
  expect(res.body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  expect(res.body.subarray(-8).toString('latin1')).toMatch(/%%EOF\s*$/);
  expect(Number(res.headers['content-length'])).toBe(res.body.length);
}

/** The name a download is saved under (quoted or not: RFC 6266 allows both for a plain name). */
function attachmentName(res: Response): string | undefined {
  return /^attachment; filename="?([^";]+)"?$/.exec(res.headers['content-disposition'] ?? '')?.[1];
}

const versionPath = (n: number | string, query = '') => `/api/designs/${designId}/versions/${n}/sheet.pdf${query}`;

const createLink = async (body: object) =>
  createShareLinkResponseSchema.parse((await fx.owner.agent.post(`/api/designs/${designId}/share-links`).send(body).expect(201)).body);

describe('GET /api/designs/:id/versions/:n/sheet.pdf', () => {
  it('gives a member the whole PDF as an attachment named <design>-v<n>.pdf, kept out of shared caches', async () => {
    const res = await bytesOf(fx.viewer.agent.get(versionPath(2)));
    expectWholePdf(res);
    expect(attachmentName(res)).toBe(sheetFileName(title, 2));
    expect(sheetFileName(title, 2)).toBe('visible-scanner-v2.pdf');
    expect(res.headers['cache-control']).toMatch(/\bprivate\b/);
    expect(res.headers['cache-control']).toMatch(/\bno-store\b/);
    // It is the sheet of the version asked for: the footer links back to it…
    const { text } = await pdfText(res.body);
    // …on one line, so it can be read and copied whole.
    const link = `${testOrigin}/notebooks/${designId}/v/2`;
    expect(text.split('\n').filter((line) => line.includes(link)), `the footer's link ${link}, whole on one line`).not.toEqual([]);
  });

  it.each([
    { paper: 'a4', width: 595.28, height: 841.89 }, // ISO 216: 210 × 297 mm
    { paper: 'letter', width: 612, height: 792 }, // US Letter: 8.5 × 11 in
  ] as const)('prints every page on $paper ($width × $height pt)', async ({ paper, width, height }) => {
    const res = await bytesOf(fx.owner.agent.get(versionPath(1, `?paper=${paper}`)));
    expectWholePdf(res);
    const { pageSizes } = await pdfText(res.body);
    expect(pageSizes.length).toBeGreaterThan(0);
    for (const size of pageSizes) {
      expect(size.width).toBeCloseTo(width, 2);
      expect(size.height).toBeCloseTo(height, 2);
    }
  });

  it('is A4 when no paper is asked for', async () => {
    const res = await bytesOf(fx.owner.agent.get(versionPath(1)));
    expectWholePdf(res);
    const { pageSizes } = await pdfText(res.body);
    expect(pageSizes[0]!.width).toBeCloseTo(595.28, 2);
  });

  it('refuses a paper it does not print, naming the field', async () => {
    const res = await bytesOf(fx.owner.agent.get(versionPath(1, '?paper=b5')));
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res).fields ?? {})).toEqual(['paper']);
  });

  it('accepts picked wavelengths and lists them in the performance table', async () => {
    const res = await bytesOf(fx.owner.agent.get(versionPath(1, '?at=589,404.7')));
    expectWholePdf(res);
    const { text } = await pdfText(res.body);
    // Rows labelled as server/sheets/context.ts `performanceRows` labels a picked wavelength.
    expect(text).toMatch(/^Picked 404\.7 /m);
    expect(text).toMatch(/^Picked 589 /m);
  });

  it.each([
    { case: 'not a number', at: 'abc' },
    { case: 'too many', at: Array.from({ length: MAX_SHEET_WAVELENGTHS + 1 }, (_, i) => 400 + 10 * i).join(',') },
    { case: 'negative', at: '-5' },
  ])('refuses picked wavelengths that are $case, naming the field', async ({ at }) => {
    const res = await bytesOf(fx.owner.agent.get(versionPath(1, `?at=${encodeURIComponent(at)}`)));
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res).fields ?? {})).toEqual(['at']);
  });

  it('answers 404 in the error shape for a version that does not exist', async () => {
    const res = await bytesOf(fx.owner.agent.get(versionPath(99)));
    expect(res.status).toBe(404);
    errorOf(res);
  });

  it('answers an outsider 404, exactly as for a design that does not exist', async () => {
    const real = await bytesOf(fx.outsider.agent.get(versionPath(1)));
    const madeUp = await bytesOf(fx.outsider.agent.get('/api/designs/no-such-design/versions/1/sheet.pdf'));
    expect(real.status).toBe(404);
    expect(errorOf(real)).toEqual(errorOf(madeUp));
  });

  it('answers 401 when signed out', async () => {
    const res = await bytesOf(anonymous().get(versionPath(1)));
    expect(res.status).toBe(401);
    errorOf(res);
  });

  it('answers 500 in the error shape, never part of a PDF, when a section fails while drawing', async () => {
    // The last section: the pages before it are already drawn when it throws.
    const section = sheetSections.at(-1)!;
    const draw = section.draw;
    const errorsBefore = fx.ctx.errors.length;
    section.draw = () => {
      throw new Error('section exploded on purpose');
    };
    try {
      const res = await bytesOf(fx.owner.agent.get(versionPath(2)));
      expect(res.status).toBe(500);
      const error = errorOf(res);
      expect(error.message).not.toContain('exploded');
      expect(res.headers['content-disposition']).toBeUndefined();
      expect(fx.ctx.errors.slice(errorsBefore).map(String).join('\n')).toContain('section exploded on purpose');
    } finally {
      section.draw = draw;
    }
    expectWholePdf(await bytesOf(fx.owner.agent.get(versionPath(2))));
  });
});

describe('GET /api/designs/:id/compare.pdf', () => {
  it('gives a member both versions as one PDF named <design>-v<a>-vs-v<b>.pdf', async () => {
    const res = await bytesOf(fx.reviewer.agent.get(`/api/designs/${designId}/compare.pdf?a=1&b=2&paper=letter`));
    expectWholePdf(res);
    expect(attachmentName(res)).toBe('visible-scanner-v1-vs-v2.pdf');
    expect(res.headers['cache-control']).toMatch(/\bprivate\b/);
    const { pageSizes, text } = await pdfText(res.body);
    for (const size of pageSizes) expect([size.width, size.height]).toEqual([612, 792]);
    // The saved change (exit slit 100 → 40 µm) is there, marked, with v2's message.
    expect(text).toMatch(new RegExp(`Exit slit width \\(µm\\) 100 40 ${CHANGED}`));
    expect(text).toContain('Narrow exit');
  });

  it('answers 404 for a version that does not exist and 400 without both versions', async () => {
    const missing = await bytesOf(fx.owner.agent.get(`/api/designs/${designId}/compare.pdf?a=1&b=99`));
    expect(missing.status).toBe(404);
    errorOf(missing);
    const half = await bytesOf(fx.owner.agent.get(`/api/designs/${designId}/compare.pdf?a=1`));
    expect(half.status).toBe(400);
    expect(Object.keys(errorOf(half).fields ?? {})).toEqual(['b']);
  });

  it('answers an outsider 404 and a signed-out visitor 401', async () => {
    expect((await bytesOf(fx.outsider.agent.get(`/api/designs/${designId}/compare.pdf?a=1&b=2`))).status).toBe(404);
    expect((await bytesOf(anonymous().get(`/api/designs/${designId}/compare.pdf?a=1&b=2`))).status).toBe(401);
  });
});

describe('GET /api/share/:token/sheet.pdf', () => {
  it('gives a signed-out holder of a live link the sheet of its version', async () => {
    const { token } = await createLink({ version: 1 });
    const res = await bytesOf(anonymous().get(`/api/share/${token}/sheet.pdf?paper=letter`));
    expectWholePdf(res);
    expect(attachmentName(res)).toBe(sheetFileName(title, 1));
    expect(res.headers['cache-control']).toMatch(/\bno-store\b/);
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    const { text, pageSizes } = await pdfText(res.body);
    expect(pageSizes[0]).toEqual({ width: 612, height: 792 });
    // The footer leads back to the share page, not into the team's workspace.
    const link = `${testOrigin}/share/${token}`;
    expect(text.split('\n').filter((line) => line.includes(link)), `the footer's link ${link}, whole on one line`).not.toEqual([]);
    expect(text).not.toContain(`/notebooks/${designId}`);
  });

  it('refuses bad options from a link holder too', async () => {
    const { token } = await createLink({ version: 1 });
    const res = await bytesOf(anonymous().get(`/api/share/${token}/sheet.pdf?paper=b5`));
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res).fields ?? {})).toEqual(['paper']);
  });

  it('answers a revoked, an expired and a made-up token 404 as the share page does', async () => {
    const revoked = await createLink({ version: 1 });
    await fx.owner.agent.delete(`/api/designs/${designId}/share-links/${revoked.link.id}`).expect(204);
    const expiring = await createLink({ version: 2, expiresAt: new Date(fx.ctx.clock.now().getTime() + 60_000).toISOString() });
    await bytesOf(anonymous().get(`/api/share/${expiring.token}/sheet.pdf`)).then(expectWholePdf);
    fx.ctx.clock.advance(60_000);
    for (const token of [revoked.token, expiring.token, 'z'.repeat(40)]) {
      const sheet = await bytesOf(anonymous().get(`/api/share/${token}/sheet.pdf`));
      expect(sheet.status, token).toBe(404);
      const page = await anonymous().get(`/api/share/${token}`).expect(404);
      expect(errorOf(sheet), token).toEqual(page.body.error);
    }
  });
});

describe('how many sheets one address may ask for', () => {
  it('answers 429 in the error shape once the minute’s allowance is spent', async () => {
    const { token } = await createLink({ version: 1 });
    // A second app on the same data with a tiny allowance: its counters start at zero.
    const limited = await createTestApp({ database: fx.ctx.database, rateLimits: { sheetsPerIp: 2 } });
    try {
      await bytesOf(request(limited.app).get(`/api/share/${token}/sheet.pdf`)).then((res) => expect(res.status).toBe(200));
      await bytesOf(request(limited.app).get(`/api/share/${token}/sheet.pdf?paper=letter`)).then((res) => expect(res.status).toBe(200));
      const refused = await request(limited.app).get(`/api/share/${token}/sheet.pdf`);
      expect(refused.status).toBe(429);
      expect(refused.headers['content-type']).toMatch(/^application\/json/);
      expect(errorBodySchema.parse(refused.body).error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});
