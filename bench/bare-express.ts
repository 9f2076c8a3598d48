/**
 * The API benchmark's floor: Express with one route answering a small JSON and nothing else (no
 * helmet, body parsing, session or database), as its own process on loopback, so
 * `route / floor` shows what the product's stack costs on top of HTTP and Express on this machine.
 * Started by bench/api.bench.ts; prints the same ready line as the server.
 */
import express from 'express';
import type { AddressInfo } from 'node:net';

const app = express();
app.disable('x-powered-by');
app.disable('etag');
app.get('/floor', (_req, res) => {
  res.json({ ok: true });
});
const server = app.listen(0, '127.0.0.1', () => {
  console.log(`Bare Express is ready at http://127.0.0.1:${(server.address() as AddressInfo).port}`);
});
process.on('SIGTERM', () => server.close(() => process.exit(0)));
