import { count } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { teamCurves } from '../../db/schema';
import { errorBodySchema } from '../../shared/api-error';
import { designCurveSchema, MAX_CURVE_FILE_BYTES, MAX_CURVE_POINTS, type CurveKind } from '../../shared/curves';
import { exampleDesign } from '../../shared/design';
import { createTestApp, testOrigin } from '../support/test-app';
import { createNotebookFixture, type NotebookFixture, type Person } from './notebooks/fixture';

/**
 * The curve library over HTTP: multipart uploads and previews, what was detected, refusals naming
 * row and column with nothing stored, the 2 MB limit, re-uploads recognised, and who may do what.
 * Unit conversions are by definition (1 µm = 1000 nm; a percent is a hundredth).
 */

let fx: NotebookFixture;
beforeAll(async () => {
  fx = await createNotebookFixture({ rateLimits: { curveUploadsPerIp: 10_000 } });
}, 60_000);
afterAll(() => fx?.ctx.close());

const stored = async () => (await fx.ctx.database.db.select({ n: count() }).from(teamCurves))[0]!.n;

type Fields = { kind?: string; name?: string; wavelengthUnit?: string; valueScale?: string; medium?: string };

function send(person: Person, path: string, file: string | Buffer | null, fields: Fields, fileName = 'curve.csv') {
  let req = person.agent.post(path);
  for (const [key, value] of Object.entries(fields)) if (value !== undefined) req = req.field(key, value);
  if (file !== null) req = req.attach('file', Buffer.isBuffer(file) ? file : Buffer.from(file, 'utf8'), fileName);
  return req;
}
const upload = (file: string | Buffer | null, fields: Fields = { kind: 'grating-efficiency' }, person: Person = fx.owner, fileName?: string) =>
  send(person, `/api/teams/${fx.teamId}/curves`, file, fields, fileName);
const preview = (file: string | Buffer | null, fields: Fields = { kind: 'grating-efficiency' }) => send(fx.owner, '/api/curves/preview', file, fields);

describe('a good upload in each unit combination', () => {
  // Each file holds 0.45 and 0.50 of the light at 500 and 550 nm, written in its own units.
  const cases = [
    { label: 'nm, percent, air in a comment', file: '# measured in air\nWavelength (nm),Efficiency (%)\n500,45\n550,50\n', unit: 'nm', scale: 'percent', medium: 'air' },
    { label: 'nm, fraction, vacuum in the header', file: 'Wavelength vacuum (nm),Efficiency\n500,0.45\n550,0.5\n', unit: 'nm', scale: 'fraction', medium: 'vacuum' },
    { label: 'µm, percent, vacuum in a comment', file: '# vacuum wavelengths\nlambda [µm]\tQE %\n0.5\t45\n0.55\t50\n', unit: 'um', scale: 'percent', medium: 'vacuum' },
    { label: 'µm, fraction, air in the header', file: 'wavelength in air (um);reflectance\n0,5;0,45\n0,55;0,5\n', unit: 'um', scale: 'fraction', medium: 'air' },
    { label: 'nm and percent from the values, air', file: '# air\n500,45\n550,50\n', unit: 'nm', scale: 'percent', medium: 'air' },
    { label: 'µm and fraction from the values, vacuum', file: '# vacuum\n0.5,0.45\n0.55,0.5\n', unit: 'um', scale: 'fraction', medium: 'vacuum' },
    { label: 'nm, fraction from the values, nothing about the medium', file: '500,0.45\n550,0.5\n', unit: 'nm', scale: 'fraction', medium: 'unstated' },
    { label: 'µm from the values, percent from the header, air', file: '# in air\nwl,T (%)\n0.5,45\n0.55,50\n', unit: 'um', scale: 'percent', medium: 'air' },
  ] satisfies { label: string; file: string; unit: 'nm' | 'um'; scale: 'percent' | 'fraction'; medium: 'air' | 'vacuum' | 'unstated' }[];

  it.each(cases)('$label → 500 and 550 nm at 0.45 and 0.50', async ({ file, unit, scale, medium }) => {
    const before = await stored();
    const res = await upload(file, { kind: 'grating-efficiency', name: `Grating ${unit} ${scale} ${medium}` }).expect(201);
    expect(res.body.recognised).toBe(false);
    const curve = res.body.curve;
    expect(curve.designCurve.wavelengthsNm).toEqual([500, 550]);
    expect(curve.designCurve.values).toEqual([0.45, 0.5]);
    expect(curve).toMatchObject({ wavelengthUnit: unit, valueScale: scale, medium, pointCount: 2, startNm: 500, endNm: 550, fileName: 'curve.csv' });
    expect(curve.designCurve.checksum).toMatch(/^[0-9a-f]{64}$/);
    // The client copies designCurve into a draft as it is.
    expect(designCurveSchema.safeParse(curve.designCurve).success).toBe(true);
    expect(await stored()).toBe(before + 1);
  });

  it('answers the same checksum Node computes for the bytes sent (SHA-256)', async () => {
    const { createHash } = await import('node:crypto');
    const file = '400,0.2\n800,0.3\n';
    const res = await upload(file, { kind: 'mirror-reflectance' }).expect(201);
    expect(res.body.curve.checksum).toBe(createHash('sha256').update(file).digest('hex'));
    expect(res.body.curve.fileSizeBytes).toBe(file.length);
  });

  it('names the curve after the file unless a name is given', async () => {
    const res = await upload('400,0.1\n900,0.2\n', { kind: 'detector-response' }, fx.owner, 'CCD-QE rev B.csv').expect(201);
    expect(res.body.curve.name).toBe('CCD-QE rev B.csv');
  });

  it('reads a UTF-8 file name as sent, and clips a long one without splitting a character', async () => {
    const accented = await upload('400,0.5\n420,0.6\n', { kind: 'mirror-reflectance' }, fx.owner, 'Réflectance Ag µm.csv').expect(201);
    expect(accented.body.curve.name).toBe('Réflectance Ag µm.csv');
    // 119 letters and then 🔭 (two UTF-16 units): cut at 120 units, the pair's first half would be left alone.
    const long = `${'a'.repeat(119)}🔭.csv`;
    const res = await upload('400,0.5\n430,0.6\n', { kind: 'mirror-reflectance' }, fx.owner, long).expect(201);
    expect(res.body.curve.name).toBe('a'.repeat(119));
    expect(res.body.curve.fileName).toBe(long);
    expect(designCurveSchema.safeParse(res.body.curve.designCurve).success).toBe(true);
  });

  it('reads a line list of one column (intensity 1) and of three (intensity and label)', async () => {
    const one = await upload('253.652\n404.656\n435.833\n', { kind: 'line-list' }).expect(201);
    expect(one.body.curve.designCurve.values).toEqual([1, 1, 1]);
    expect(one.body.curve.valueScale).toBeNull();
    const three = await upload('# NIST, air\nnm,intensity,ion\n253.652,1000,Hg I\n404.656,1800,Hg I\n', { kind: 'line-list' }).expect(201);
    expect(three.body.curve.designCurve.values).toEqual([1000, 1800]);
    expect(three.body.curve.labels).toEqual(['Hg I', 'Hg I']);
    expect(three.body.curve.medium).toBe('air');
  });
});

describe('corrections and re-uploads', () => {
  const file = 'Wavelength,Transmission\n10,0.1\n20,0.9\n';

  it('takes the uploader’s units over the detected ones, and says which were corrected', async () => {
    // Every wavelength is below 30, so the file reads as µm; the uploader says these are nm (EUV).
    const res = await preview(file, { kind: 'filter-transmission', wavelengthUnit: 'nm', medium: 'vacuum' }).expect(200);
    expect(res.body.preview.detected.wavelengthUnit).toMatchObject({ value: 'um', from: 'values' });
    expect(res.body.preview.applied.wavelengthUnit).toEqual({ value: 'nm', corrected: true });
    expect(res.body.preview.applied.medium).toEqual({ value: 'vacuum', corrected: true });
    expect(res.body.preview.wavelengthsNm).toEqual([10, 20]);
  });

  it('recognises the same file read the same way: 200, the stored curve, nothing new', async () => {
    const first = await upload(file, { kind: 'filter-transmission', name: 'Order filter' }).expect(201);
    const before = await stored();
    const again = await upload(file, { kind: 'filter-transmission', name: 'Another name' }).expect(200);
    expect(again.body.recognised).toBe(true);
    expect(again.body.curve.id).toBe(first.body.curve.id);
    expect(again.body.curve.name).toBe('Order filter');
    // A correction that only repeats what was detected reads it the same way.
    await upload(file, { kind: 'filter-transmission', wavelengthUnit: 'um' }).expect(200);
    expect(await stored()).toBe(before);
  });

  it('stores the same file read another way (another unit, another kind) as a curve of its own', async () => {
    await upload(file, { kind: 'mirror-reflectance', name: 'Filter as mirror' }).expect(201);
    const other = await upload(file, { kind: 'filter-transmission', wavelengthUnit: 'nm' }).expect(201);
    expect(other.body.curve.designCurve.wavelengthsNm).toEqual([10, 20]);
    expect(other.body.curve.corrections).toEqual({ wavelengthUnit: 'nm' });
  });
});

describe('the preview', () => {
  it('answers what it detected and why, the points and the first rows, and stores nothing', async () => {
    const before = await stored();
    const res = await preview('# measured in air\nlambda [µm],QE %\n0.4,20\n0.5,40\n0.6,35\n', { kind: 'detector-response' }).expect(200);
    const p = res.body.preview;
    expect(p.detected.wavelengthUnit.reason).toBe("µm, from the header 'lambda [µm]'");
    expect(p.detected.valueScale.reason).toBe("percent, from the header 'QE %'");
    expect(p.detected.medium).toMatchObject({ value: 'air', from: 'comment' });
    expect(p.wavelengthsNm).toEqual([400, 500, 600]);
    expect(p.values).toEqual([0.2, 0.4, 0.35]);
    expect(p.header).toEqual({ row: 2, cells: ['lambda [µm]', 'QE %'] });
    expect(p.firstRows[0]).toEqual({ row: 3, cells: ['0.4', '20'] });
    expect(p.pointCount).toBe(3);
    expect(await stored()).toBe(before);
  });
});

describe('bad files: 400 naming the row and column, nothing stored', () => {
  const bad = [
    { label: 'a non-numeric cell', kind: 'grating-efficiency', file: 'nm,value\n400,0.1\n500,0.2\n600,0.3\n700,0.4\n800,0.5\nabc9,0.6\n900,abc\n', expected: "row 8, column 2 (value): 'abc' is not a number" },
    { label: 'fewer than two points', kind: 'mirror-reflectance', file: 'nm,R\n500,0.9\n', expected: 'row 2: is the only point' },
    { label: 'wavelengths not increasing', kind: 'mirror-reflectance', file: '500,0.9\n600,0.9\n550,0.9\n', expected: 'row 3, column 1 (wavelength): 550 is not greater than 600 on row 2' },
    { label: 'a duplicate wavelength', kind: 'mirror-reflectance', file: '500,0.9\n600,0.9\n600,0.8\n', expected: 'row 3, column 1 (wavelength): 600 repeats the wavelength of row 2' },
    { label: 'a negative value', kind: 'source-spectrum', file: 'nm,counts\n500,10\n600,-3\n', expected: 'row 3, column 2 (counts): -3 is negative' },
    { label: 'a transmission above 100 %', kind: 'filter-transmission', file: 'nm,T (%)\n500,90\n600,100.5\n', expected: 'row 3, column 2 (T (%)): 100.5 is above 100 %' },
    { label: 'a fraction above 1', kind: 'filter-transmission', file: 'nm,T (fraction)\n500,0.9\n600,1.2\n', expected: 'row 3, column 2 (T (fraction)): 1.2 is above 1 as a fraction' },
    { label: 'an empty value', kind: 'detector-response', file: '500,0.2\n600,\n', expected: 'row 2, column 2 (value): is empty' },
    { label: 'an empty file', kind: 'detector-response', file: '', expected: 'is empty' },
    { label: 'only comments', kind: 'detector-response', file: '# nothing measured\n\n', expected: 'is empty' },
    { label: 'a header and no data', kind: 'detector-response', file: 'nm,QE\n', expected: 'row 1: has a header but no rows of data' },
  ] satisfies { label: string; kind: CurveKind; file: string; expected: string }[];

  it.each(bad)('$label', async ({ kind, file, expected }) => {
    const before = await stored();
    const res = await upload(file, { kind }).expect(400);
    expect(errorBodySchema.safeParse(res.body).success).toBe(true);
    expect(res.body.error.message).toContain(expected);
    expect(res.body.error.fields.file).toContain(expected);
    expect(await stored()).toBe(before);
    // The preview refuses it the same way.
    const seen = await preview(file, { kind }).expect(400);
    expect(seen.body.error.fields.file).toContain(expected);
  });

  it('lists each bad cell with its row and column in details, counting comment lines', async () => {
    const res = await upload('# a comment\nnm,value\n500,x\n600,0.2\n700,y\n', { kind: 'grating-efficiency' }).expect(400);
    expect(res.body.error.details.fileErrors).toEqual([
      { row: 3, column: 2, columnName: 'value', message: "'x' is not a number" },
      { row: 5, column: 2, columnName: 'value', message: "'y' is not a number" },
    ]);
  });

  it(`refuses more than ${MAX_CURVE_POINTS} points, naming the first row past the limit`, async () => {
    const rows = Array.from({ length: MAX_CURVE_POINTS + 1 }, (_, i) => `${300 + i * 0.1},0.5`);
    const before = await stored();
    const res = await upload(`nm,R\n${rows.join('\n')}\n`, { kind: 'mirror-reflectance' }).expect(400);
    // The header is row 1, so point 5001 is on row 5002.
    expect(res.body.error.fields.file).toContain(`row ${MAX_CURVE_POINTS + 2}: is point ${MAX_CURVE_POINTS + 1}`);
    expect(await stored()).toBe(before);
  });

  it('refuses bytes that are not text: NUL bytes, UTF-16 and invalid UTF-8', async () => {
    const before = await stored();
    for (const bytes of [Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d]), Buffer.from('500,0.5\n600,0.6\n', 'utf16le'), Buffer.from([0x35, 0x30, 0x30, 0x2c, 0xff, 0xfe, 0x0a])]) {
      const res = await upload(bytes, { kind: 'grating-efficiency' }, fx.owner, 'picture.png').expect(400);
      expect(res.body.error.fields.file).toContain('is not a text file');
    }
    expect(await stored()).toBe(before);
  });

  it(`answers 413 in the error shape for a file over ${MAX_CURVE_FILE_BYTES} bytes, never a 500`, async () => {
    const before = await stored();
    const big = Buffer.alloc(MAX_CURVE_FILE_BYTES + 1, '5');
    const res = await upload(big, { kind: 'grating-efficiency' }).expect(413);
    expect(res.body.error).toMatchObject({ code: 'payload_too_large', fields: { file: 'must be at most 2 MB' } });
    expect(await stored()).toBe(before);
    expect(fx.ctx.errors).toEqual([]);
    // Exactly the limit is read (and refused only as a file of no curve).
    const atLimit = await upload(Buffer.alloc(MAX_CURVE_FILE_BYTES, '5'), { kind: 'grating-efficiency' }).expect(400);
    expect(atLimit.body.error.fields.file).toContain('row 1');
  });
});

describe('bad forms: 400 naming the field, nothing stored', () => {
  it('a missing file', async () => {
    const res = await upload(null, { kind: 'grating-efficiency' }).expect(400);
    expect(res.body.error.fields.file).toMatch(/^is required/);
  });

  it('a JSON body instead of multipart', async () => {
    const res = await fx.owner.agent.post(`/api/teams/${fx.teamId}/curves`).send({ kind: 'grating-efficiency', file: '500,0.5\n600,0.6' }).expect(400);
    expect(res.body.error.fields.file).toBe('must be sent as a multipart/form-data part named file');
  });

  it('an unknown kind, a missing kind, and a unit that is not one', async () => {
    const unknown = await upload('500,0.5\n600,0.6\n', { kind: 'telescope' }).expect(400);
    expect(unknown.body.error.fields.kind).toMatch(/^must be one of grating-efficiency/);
    const missing = await upload('500,0.5\n600,0.6\n', {}).expect(400);
    expect(missing.body.error.fields.kind).toBe('is required');
    const unit = await upload('500,0.5\n600,0.6\n', { kind: 'grating-efficiency', wavelengthUnit: 'mm' }).expect(400);
    expect(unit.body.error.fields.wavelengthUnit).toBe('must be one of nm, um');
  });

  it('a value scale for a kind whose values are not fractions', async () => {
    const res = await upload('500,10\n600,20\n', { kind: 'source-spectrum', valueScale: 'percent' }).expect(400);
    expect(res.body.error.fields.valueScale).toMatch(/^applies only to/);
  });

  it('a name the database cannot store, and one too long', async () => {
    const nul = await upload('500,0.5\n600,0.6\n', { kind: 'grating-efficiency', name: 'a\u0000b' }).expect(400);
    expect(nul.body.error.fields.name).toBeDefined();
    const long = await upload('500,0.5\n600,0.6\n', { kind: 'grating-efficiency', name: 'x'.repeat(121) }).expect(400);
    expect(long.body.error.fields.name).toBe('must be at most 120 characters');
  });

  it('two files, or a file in another part', async () => {
    const two = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/curves`)
      .field('kind', 'grating-efficiency')
      .attach('file', Buffer.from('500,0.5\n600,0.6\n'), 'a.csv')
      .attach('file', Buffer.from('500,0.5\n700,0.6\n'), 'b.csv')
      .expect(400);
    expect(two.body.error.fields.file).toBe('must be one file');
    const elsewhere = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/curves`)
      .field('kind', 'grating-efficiency')
      .attach('data', Buffer.from('500,0.5\n600,0.6\n'), 'a.csv')
      .expect(400);
    expect(elsewhere.body.error.fields.file).toBe('must be the only file part');
  });

  it('a truncated multipart body', async () => {
    const res = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/curves`)
      .set('content-type', 'multipart/form-data; boundary=XYZ')
      .send('--XYZ\r\nContent-Disposition: form-data; name="kind"\r\n\r\ngrating-eff')
      .expect(400);
    expect(res.body.error.code).toBe('malformed_body');
  });

  it('a multipart content type without a boundary, and a CSV sent as the whole body', async () => {
    const noBoundary = await fx.owner.agent.post('/api/curves/preview').set('content-type', 'multipart/form-data').send('500,0.5\n600,0.6\n').expect(400);
    expect(noBoundary.body.error.code).toBe('malformed_body');
    const raw = await fx.owner.agent.post('/api/curves/preview').set('content-type', 'text/csv').send('500,0.5\n600,0.6\n').expect(400);
    expect(raw.body.error.fields.file).toBe('must be sent as a multipart/form-data part named file');
  });

  it('stored none of the above', async () => {
    const names = (await fx.ctx.database.db.select({ name: teamCurves.name }).from(teamCurves)).map((r) => r.name);
    expect(names).not.toContain('a\u0000b');
    expect(fx.ctx.errors).toEqual([]);
  });
});

describe('the library: list, read, remove, and who may', () => {
  it('lists metadata with the point count and span, newest first, without points', async () => {
    const made = await upload('# vacuum\n120,0.01\n130,0.02\n140,0.04\n', { kind: 'grating-efficiency', name: 'VUV grating' }).expect(201);
    const res = await fx.viewer.agent.get(`/api/teams/${fx.teamId}/curves`).expect(200);
    const listed = res.body.curves.find((c: { id: string }) => c.id === made.body.curve.id);
    expect(listed).toMatchObject({ name: 'VUV grating', pointCount: 3, startNm: 120, endNm: 140, medium: 'vacuum', uploadedBy: fx.owner.user.id, uploadedByName: fx.owner.user.displayName });
    expect(listed.wavelengthsNm).toBeUndefined();
    expect(listed.designCurve).toBeUndefined();
  });

  it('lets reviewers and viewers read a curve but not add or remove one', async () => {
    const made = await upload('400,0.3\n450,0.35\n', { kind: 'grating-efficiency', name: 'Shared read' }).expect(201);
    const id: string = made.body.curve.id;
    for (const person of [fx.reviewer, fx.viewer]) {
      const read = await person.agent.get(`/api/teams/${fx.teamId}/curves/${id}`).expect(200);
      expect(read.body.curve.designCurve.values).toEqual([0.3, 0.35]);
      await upload('400,0.3\n460,0.35\n', { kind: 'grating-efficiency' }, person).expect(403);
      await person.agent.delete(`/api/teams/${fx.teamId}/curves/${id}`).expect(403);
    }
    await fx.outsider.agent.get(`/api/teams/${fx.teamId}/curves/${id}`).expect(404);
    await upload('400,0.3\n470,0.35\n', { kind: 'grating-efficiency' }, fx.outsider).expect(404);
    await request(fx.ctx.app).get(`/api/teams/${fx.teamId}/curves`).expect(401);
    await request(fx.ctx.app).post('/api/curves/preview').set('origin', testOrigin).field('kind', 'line-list').attach('file', Buffer.from('500\n600\n'), 'l.csv').expect(401);
  });

  it('removes a curve for its owner (204); a design that copied it keeps its copy', async () => {
    const made = await upload('600,0.7\n700,0.8\n', { kind: 'mirror-reflectance', name: 'Silver' }).expect(201);
    const curve = made.body.curve;
    const design = await fx.owner.agent
      .post(`/api/teams/${fx.teamId}/designs`)
      .send({ title: 'With a curve', params: { ...exampleDesign, curves: [curve.designCurve] }, message: 'Attach' })
      .expect(201);
    await fx.owner.agent.delete(`/api/teams/${fx.teamId}/curves/${curve.id}`).expect(204);
    await fx.owner.agent.get(`/api/teams/${fx.teamId}/curves/${curve.id}`).expect(404);
    await fx.owner.agent.delete(`/api/teams/${fx.teamId}/curves/${curve.id}`).expect(404);
    const version = await fx.owner.agent.get(`/api/designs/${design.body.design.id}/versions/1`).expect(200);
    expect(version.body.version.params.curves).toEqual([curve.designCurve]);
  });

  it('does not show one team’s curve through another team’s path', async () => {
    const made = await upload('610,0.7\n710,0.8\n', { kind: 'mirror-reflectance' }).expect(201);
    const other = await fx.owner.agent.post('/api/teams').send({ name: 'Other lab' }).expect(201);
    await fx.owner.agent.get(`/api/teams/${other.body.team.id}/curves/${made.body.curve.id}`).expect(404);
  });

  it('goes with its team when the team is deleted', async () => {
    const team = await fx.owner.agent.post('/api/teams').send({ name: 'Short-lived lab' }).expect(201);
    const teamId: string = team.body.team.id;
    await send(fx.owner, `/api/teams/${teamId}/curves`, '500,0.5\n600,0.6\n', { kind: 'grating-efficiency' }).expect(201);
    const before = await stored();
    await fx.owner.agent.delete(`/api/teams/${teamId}`).expect(204);
    expect(await stored()).toBe(before - 1);
  });
});

describe('rate limit', () => {
  it('counts previews and uploads together per address, then answers 429', async () => {
    const limited = await createTestApp({ database: fx.ctx.database, rateLimits: { curveUploadsPerIp: 2 } });
    const agent = request.agent(limited.app).set('origin', testOrigin);
    const signIn = await agent.post('/api/auth/sign-in').send({ email: fx.owner.user.email, password: fx.owner.password ?? 'long enough password' });
    expect(signIn.status).toBe(200);
    const file = Buffer.from('500,0.5\n600,0.6\n');
    await agent.post('/api/curves/preview').field('kind', 'grating-efficiency').attach('file', file, 'a.csv').expect(200);
    await agent.post(`/api/teams/${fx.teamId}/curves`).field('kind', 'grating-efficiency').attach('file', file, 'a.csv').expect((res) => expect([200, 201]).toContain(res.status));
    const third = await agent.post('/api/curves/preview').field('kind', 'grating-efficiency').attach('file', file, 'a.csv').expect(429);
    expect(third.body.error.code).toBe('rate_limited');
    await limited.close();
  });
});
