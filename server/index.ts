import type { AddressInfo } from 'node:net';
import { openDatabase } from '../db/client';
import { createApp } from './app';
import { systemClock } from './clock';
import { loadConfig } from './config';
import { createMemoryMailer } from './mail/mailer';

const config = loadConfig();
const database = await openDatabase({ dataDir: config.DATA_DIR });
const app = createApp({
  database,
  mailer: createMemoryMailer(),
  clock: systemClock,
  version: config.version,
  webRoot: config.WEB_ROOT,
  https: config.PUBLIC_URL?.startsWith('https:') ?? false,
});

const server = app.listen(config.PORT, config.HOST, () => {
  const { port } = server.address() as AddressInfo;
  const url = config.PUBLIC_URL ?? `http://localhost:${port}`;
  // The test helper and `npm start` wait for this exact line.
  console.log(`Blazebook is ready at ${url} (data in ${config.DATA_DIR})`);
});

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  console.log(`${signal}: finishing open requests and closing the database…`);
  const forced = setTimeout(() => {
    console.error('Requests did not finish within 10 s; closing anyway.');
    server.closeAllConnections();
  }, 10_000);
  server.close(async () => {
    clearTimeout(forced);
    await database.close();
    console.log('Database closed. Goodbye.');
    process.exit(0);
  });
  server.closeIdleConnections();
}

process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
