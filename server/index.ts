import type { AddressInfo } from 'node:net';
import { DataDirInUseError } from '../db/data-dir-lock';
import { openDatabase, redacted } from '../db/client';
import { createApp } from './app';
import { systemClock } from './clock';
import { loadConfig } from './config';
import { isLoopbackListenAddress } from './http/loopback';
import { createOutboxMailer, createSmtpMailer } from './mail/mailer';
import { createOutboxRepository } from './mail/outbox-repository';
import { seedDemoData } from './seed/demo';
import { gracefulShutdown } from './shutdown';

const config = loadConfig();
const database = await openDatabase(
  config.DATABASE_URL ? { url: config.DATABASE_URL, poolSize: config.DATABASE_POOL_SIZE } : { dataDir: config.DATA_DIR },
).catch((error: unknown) => {
  // A directory another process holds, or a server that does not answer: say so in one line.
  if (!(error instanceof DataDirInUseError) && !config.DATABASE_URL) throw error;
  console.error((error as Error).message);
  process.exit(1);
});
const dataLocation = config.DATABASE_URL ? `on ${redacted(config.DATABASE_URL)}` : `in ${config.DATA_DIR}`;
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
  trustProxy: config.TRUST_PROXY,
});

const server = app.listen(config.PORT, config.HOST, () => {
  const { port } = server.address() as AddressInfo;
  const url = config.PUBLIC_URL ?? `http://localhost:${port}`;
  listeningUrl = url;
  if (isLoopbackListenAddress(config.HOST)) {
    console.log('Listening on loopback only; set HOST=0.0.0.0 (and PUBLIC_URL) to open it to your network.');
  }
  // The test helper and `npm start` wait for this exact line; it comes last.
  console.log(`Blazebook is ready at ${url} (data ${dataLocation})`);
});

const backstopMs = 10_000;
const shutdown = gracefulShutdown(server, { close: () => database.close(), backstopMs });

function onSignal(signal: NodeJS.Signals) {
  if (shutdown.stopping) return;
  console.log(`${signal}: finishing open requests and closing the database…`);
  // Whatever hangs, the database's close included, the process still ends.
  setTimeout(() => {
    console.error('Shutdown did not finish; exiting without it.');
    process.exit(1);
  }, backstopMs + 5_000);
  shutdown.stop().then(
    (outcome) => {
      if (outcome === 'forced') {
        console.error(`Requests still running after ${backstopMs / 1000} s were cut.`);
      }
      console.log('Database closed. Goodbye.');
      process.exit(outcome === 'drained' ? 0 : 1);
    },
    (error: unknown) => {
      console.error(error);
      process.exit(1);
    },
  );
}

process.on('SIGINT', onSignal);
process.on('SIGTERM', onSignal);
