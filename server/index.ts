import type { AddressInfo } from 'node:net';
import { openDatabase } from '../db/client';
import { createApp } from './app';
import { systemClock } from './clock';
import { loadConfig } from './config';
import { createOutboxMailer, createSmtpMailer } from './mail/mailer';
import { createOutboxRepository } from './mail/outbox-repository';
import { seedDemoData } from './seed/demo';

const config = loadConfig();
const database = await openDatabase({ dataDir: config.DATA_DIR });
if (config.NODE_ENV === 'development') {
  const lines = await seedDemoData({ database, clock: systemClock });
  if (lines) console.log(lines.join('\n'));
}
if (!config.SMTP_URL && config.NODE_ENV === 'production') {
  console.warn('SMTP_URL is not set: e-mails are kept in the mail_outbox table and not delivered.');
}
// Known once listening (PORT=0 picks a free port); e-mailed links are built after that.
let listeningUrl = config.PUBLIC_URL ?? `http://localhost:${config.PORT}`;
const app = createApp({
  database,
  mailer: config.SMTP_URL
    ? createSmtpMailer(config.SMTP_URL, config.MAIL_FROM)
    : createOutboxMailer(createOutboxRepository(database.db, systemClock)),
  clock: systemClock,
  nodeEnv: config.NODE_ENV,
  publicUrl: () => listeningUrl,
  trustedOrigin: config.PUBLIC_URL ? new URL(config.PUBLIC_URL).origin : undefined,
  version: config.version,
  webRoot: config.WEB_ROOT,
  https: config.PUBLIC_URL?.startsWith('https:') ?? false,
});

const server = app.listen(config.PORT, config.HOST, () => {
  const { port } = server.address() as AddressInfo;
  const url = config.PUBLIC_URL ?? `http://localhost:${port}`;
  listeningUrl = url;
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
