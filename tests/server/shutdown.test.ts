import { spawn, type ChildProcess } from 'node:child_process';
import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { networkInterfaces, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { gracefulShutdown } from '../../server/shutdown';

const rootDir = fileURLToPath(new URL('../..', import.meta.url));
const scratch = mkdtempSync(path.join(tmpdir(), 'blazebook-shutdown-'));
const emptyWebRoot = mkdtempSync(path.join(scratch, 'web-'));
const running = new Set<ChildProcess>();

/** A copy of the migrated template's data directory: the server reopens it, no initdb. */
function newDataDir(): string {
  const dataDir = mkdtempSync(path.join(scratch, 'data-'));
  cpSync(inject('dataDirTemplate'), dataDir, { recursive: true });
  return dataDir;
}

afterAll(() => {
  for (const child of running) child.kill('SIGKILL');
  rmSync(scratch, { recursive: true, force: true });
});

type Server = {
  /** Also the Origin its state-changing requests must carry (server/auth/origin.ts). */
  url: string;
  port: number;
  output: () => string;
  waitForOutput(pattern: RegExp): Promise<void>;
  /** Resolves with the exit code and the time of exit (performance.now()). */
  exited: Promise<{ code: number | null; at: number }>;
  child: ChildProcess;
};

/**
 * The real server process. Started with `node --import tsx`, as `npm start` does, not through the
 * tsx command: that one relays SIGTERM to its child and SIGKILLs it when the child does not
 * acknowledge within 30 ms — which happens whenever a database statement holds the event loop,
 * and would make these tests (and real shutdowns) lose the race at random.
 * HOST is left unset on purpose: the default must be loopback.
 */
async function startServer(dataDir: string): Promise<Server> {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    PORT: '0',
    DATA_DIR: dataDir,
    NODE_ENV: 'test',
    WEB_ROOT: emptyWebRoot,
  };
  delete env.HOST;
  delete env.PUBLIC_URL;
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: rootDir,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  running.add(child);
  let log = '';
  const watchers = new Set<() => void>();
  const append = (chunk: Buffer) => {
    log += chunk.toString();
    for (const check of watchers) check();
  };
  child.stdout?.on('data', append);
  child.stderr?.on('data', append);
  const exited = new Promise<{ code: number | null; at: number }>((resolve) =>
    child.once('exit', (code) => {
      running.delete(child);
      resolve({ code, at: performance.now() });
    }),
  );
  const waitForOutput = (pattern: RegExp) =>
    new Promise<void>((resolve, reject) => {
      const check = () => {
        if (!pattern.test(log)) return;
        watchers.delete(check);
        resolve();
      };
      watchers.add(check);
      check();
      void exited.then(() => {
        if (watchers.delete(check)) reject(new Error(`Server exited before printing ${pattern}:\n${log}`));
      });
    });
  await waitForOutput(/ready at http:\/\/\S+/);
  const port = /ready at http:\/\/localhost:(\d+)/.exec(log)?.[1];
  // Asked for by address: the server must answer on 127.0.0.1 whatever `localhost` resolves to.
  return {
    url: `http://127.0.0.1:${port}`,
    port: Number(port),
    output: () => log,
    waitForOutput,
    exited,
    child,
  };
}

type Answer = { status: number; headers: http.IncomingHttpHeaders; body: string };

function send(url: string, options: http.RequestOptions, body?: string): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, options, (res) => {
      let text = '';
      res.on('data', (chunk: Buffer) => (text += chunk.toString()));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text }));
    });
    req.on('error', reject);
    req.end(body);
  });
}

const credentials = {
  email: 'late.writer@example.com',
  displayName: 'Late Writer',
  password: 'a long enough password',
};

describe('the server process', { timeout: 180_000 }, () => {
  // One server for the checks that leave it running, stopped by the last of them: every start is
  // a new Node process, tsx and PGlite opening a data directory, seconds on a loaded machine.
  describe('one server on its own data directory', () => {
    let dataDir: string;
    let server: Server;
    beforeAll(async () => {
      dataDir = newDataDir();
      server = await startServer(dataDir);
    }, 180_000);

    it('listens on loopback by default and says how to open it to the network', async () => {
      expect(server.output()).toContain('Listening on loopback only; set HOST=0.0.0.0');
      expect((await send(`${server.url}/api/health`, {})).status).toBe(200);
      // This machine's own network address, when it has one, must not answer.
      const lanAddress = Object.values(networkInterfaces())
        .flat()
        .find((address) => address && address.family === 'IPv4' && !address.internal)?.address;
      if (lanAddress) {
        await expect(send(`http://${lanAddress}:${server.port}/api/health`, {})).rejects.toMatchObject({
          code: 'ECONNREFUSED',
        });
      }
    });

    it('refuses to start a second server on a data directory that is in use', async () => {
      const second = await startServer(dataDir).catch((error: Error) => error);
      expect(second).toBeInstanceOf(Error);
      expect((second as Error).message).toMatch(
        new RegExp(`data directory ${dataDir} is in use by process ${server.child.pid}`),
      );
      expect((await send(`${server.url}/api/health`, {})).status).toBe(200);
    });

    it('exits at once on SIGTERM when a keep-alive client holds an idle connection', async () => {
      const agent = new http.Agent({ keepAlive: true });
      expect((await send(`${server.url}/api/health`, { agent })).status).toBe(200);

      const signalledAt = performance.now();
      server.child.kill('SIGTERM');
      const { code, at } = await server.exited;
      agent.destroy();
      expect(code).toBe(0);
      // The backstop is 10 s and the keep-alive timeout 5 s: anything near them means the idle
      // connection was waited for instead of closed. Generous, for a loaded test machine.
      expect(at - signalledAt).toBeLessThan(3_000);
    });
  });

  it('answers a write in flight at SIGTERM, exits as soon as it is answered, and keeps the write', async () => {
    const dataDir = newDataDir();
    const server = await startServer(dataDir);
    const agent = new http.Agent({ keepAlive: true });
    const body = JSON.stringify(credentials);

    // `Expect: 100-continue` makes "in flight" certain: the server has read the headers (it says
    // 100 Continue) and waits for the body when the signal comes; the body goes only once the
    // server has printed that it is stopping.
    const answer = await new Promise<Answer & { at: number }>((resolve, reject) => {
      const req = http.request(`${server.url}/api/auth/sign-up`, {
        method: 'POST',
        agent,
        headers: {
          'content-type': 'application/json',
          'content-length': Buffer.byteLength(body),
          origin: server.url,
          expect: '100-continue',
        },
      });
      req.on('continue', () => {
        server.child.kill('SIGTERM');
        server.waitForOutput(/SIGTERM: finishing open requests/).then(() => req.end(body), reject);
      });
      req.on('response', (res) => {
        let text = '';
        res.on('data', (chunk: Buffer) => (text += chunk.toString()));
        res.on('end', () =>
          resolve({ status: res.statusCode ?? 0, headers: res.headers, body: text, at: performance.now() }),
        );
      });
      req.on('error', reject);
      req.flushHeaders();
    });
    const { code, at } = await server.exited;
    agent.destroy();

    expect(answer.status).toBe(201);
    expect(JSON.parse(answer.body).user.email).toBe(credentials.email);
    expect(code).toBe(0);
    // Before, the answered connection stayed open until the 5 s keep-alive timeout (+1 s).
    expect(at - answer.at).toBeLessThan(3_000);
    // Told not to come back on this connection, so the client does not race the closing server.
    expect(answer.headers.connection).toBe('close');

    const again = await startServer(dataDir);
    const signIn = await send(
      `${again.url}/api/auth/sign-in`,
      { method: 'POST', headers: { 'content-type': 'application/json', origin: again.url } },
      JSON.stringify({ email: credentials.email, password: credentials.password }),
    );
    expect(signIn.status).toBe(200);
    again.child.kill('SIGTERM');
    expect((await again.exited).code).toBe(0);
  });

  it('keeps every acknowledged write when the process is killed outright, and starts again after it', async () => {
    const dataDir = newDataDir();
    const server = await startServer(dataDir);
    const accounts = ['killed.one', 'killed.two', 'killed.three'].map((name) => ({
      email: `${name}@example.com`,
      displayName: name,
      password: `${name} has a password`,
    }));
    const answers = await Promise.all(
      accounts.map((account) =>
        send(
          `${server.url}/api/auth/sign-up`,
          { method: 'POST', headers: { 'content-type': 'application/json', origin: server.url } },
          JSON.stringify(account),
        ),
      ),
    );
    expect(answers.map((answer) => answer.status)).toEqual([201, 201, 201]);
    // No chance to close anything: the lock it leaves behind names a process that is gone.
    server.child.kill('SIGKILL');
    await server.exited;

    const again = await startServer(dataDir);
    for (const { email, password } of accounts) {
      const signIn = await send(
        `${again.url}/api/auth/sign-in`,
        { method: 'POST', headers: { 'content-type': 'application/json', origin: again.url } },
        JSON.stringify({ email, password }),
      );
      expect(signIn.status).toBe(200);
    }
    again.child.kill('SIGTERM');
    expect((await again.exited).code).toBe(0);
  });
});

describe('gracefulShutdown', () => {
  async function listen(handler: http.RequestListener, backstopMs?: number) {
    const server = http.createServer(handler);
    const closed = { count: 0 };
    const shutdown = gracefulShutdown(server, { close: async () => void closed.count++, backstopMs });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    const { port } = server.address() as AddressInfo;
    return { server, shutdown, closed, url: `http://127.0.0.1:${port}` };
  }

  it('cuts a request that outlives the backstop, reports it as forced and still closes', async () => {
    const { shutdown, closed, url } = await listen(() => {
      // Never answers.
    }, 200);
    const hung = send(`${url}/`, {}).catch((error: NodeJS.ErrnoException) => error.code);
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(await shutdown.stop()).toBe('forced');
    expect(await hung).toBe('ECONNRESET');
    expect(closed.count).toBe(1);
  });

  it('closes a keep-alive connection as soon as an answer that started before the stop ends', async () => {
    let finish = () => {};
    const { shutdown, closed, url } = await listen((_req, res) => {
      // Headers and a first part leave before the stop, so they cannot carry `Connection: close`.
      res.writeHead(200, { 'content-type': 'text/plain' });
      res.write('first part, ');
      finish = () => res.end('last part');
    });
    const agent = new http.Agent({ keepAlive: true });
    const answer = new Promise<string>((resolve, reject) => {
      http
        .get(`${url}/`, { agent }, (res) => {
          let text = '';
          res.on('data', (chunk: Buffer) => (text += chunk.toString()));
          res.on('end', () => resolve(text));
        })
        .on('error', reject);
    });
    await new Promise((resolve) => setTimeout(resolve, 50));
    const stopped = shutdown.stop();
    expect(shutdown.stopping).toBe(true);
    const endedAt = performance.now();
    finish();
    expect(await answer).toBe('first part, last part');
    expect(await stopped).toBe('drained');
    // Well inside the 5 s keep-alive timeout that held it open before.
    expect(performance.now() - endedAt).toBeLessThan(1_000);
    expect(closed.count).toBe(1);
    agent.destroy();
  });
});
