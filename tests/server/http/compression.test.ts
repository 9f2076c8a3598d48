import express from 'express';
import { mkdtempSync, rmSync, writeFileSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exampleDesign } from '../../../shared/design';
import { compressFromBytes } from '../../../server/http/json';
import { webRouter } from '../../../server/http/web';
import { createNotebookFixture, type NotebookFixture } from '../notebooks/fixture';

/** The body as bytes. */
const raw = (res: request.Response, callback: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on('data', (chunk: Buffer) => chunks.push(chunk));
  res.on('end', () => callback(null, Buffer.concat(chunks)));
};

describe('compressed answers', () => {
  let fx: NotebookFixture;
  let listUrl: string;
  beforeAll(async () => {
    fx = await createNotebookFixture();
    // Enough designs that one page of the list is larger than the compression threshold.
    for (let i = 0; i < 45; i++) {
      await fx.owner.agent
        .post(`/api/teams/${fx.teamId}/designs`)
        .send({ title: `Long list design ${i}`, tags: ['listed'], params: exampleDesign, notes: '', message: 'First' })
        .expect(201);
    }
    listUrl = `/api/teams/${fx.teamId}/designs?pageSize=100`;
  }, 60_000);
  afterAll(() => fx?.ctx.close());

  it('gzips a large JSON answer for a client that accepts it, the same on every repeat', async () => {
    const plain = await fx.viewer.agent.get(listUrl).set('accept-encoding', 'identity').expect(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Buffer.byteLength(JSON.stringify(plain.body))).toBeGreaterThan(compressFromBytes);
    expect(plain.headers.vary).toMatch(/accept-encoding/i);

    for (let i = 0; i < 2; i++) {
      const zipped = await fx.viewer.agent.get(listUrl).set('accept-encoding', 'gzip').buffer(true).parse(raw).expect(200);
      expect(zipped.headers['content-encoding']).toBe('gzip');
      expect(zipped.headers.etag).toBe(plain.headers.etag);
      // What went over the wire; supertest itself unzips the body it hands over.
      expect(Number(zipped.headers['content-length'])).toBeLessThan(Number(plain.headers['content-length']) / 3);
      expect(JSON.parse((zipped.body as Buffer).toString('utf8'))).toEqual(plain.body);
    }
  });

  it('sends small answers as they are', async () => {
    const res = await fx.viewer.agent.get('/api/auth/session').set('accept-encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    const shortPage = await fx.viewer.agent.get(`/api/teams/${fx.teamId}/designs?pageSize=2`).set('accept-encoding', 'gzip').expect(200);
    expect(shortPage.headers['content-encoding']).toBeUndefined();
  });
});

describe('the web app', () => {
  const webRoot = mkdtempSync(path.join(tmpdir(), 'blazebook-web-'));
  beforeAll(() => {
    mkdirSync(path.join(webRoot, '_expo'));
    writeFileSync(path.join(webRoot, 'index.html'), '<!doctype html><title>Blazebook</title>');
    writeFileSync(path.join(webRoot, '_expo', 'bundle.js'), `const x = ${JSON.stringify('grating '.repeat(5000))};`);
  });
  afterAll(() => rmSync(webRoot, { recursive: true, force: true }));

  it('gzips the bundles and keeps caching them by their hashed names', async () => {
    const app = express().use(webRouter(webRoot));
    const res = await request(app).get('/_expo/bundle.js').set('accept-encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.headers['cache-control']).toContain('immutable');
    expect(res.text).toContain('grating grating');
  });
});
