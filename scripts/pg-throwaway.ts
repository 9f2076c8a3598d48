import { execFileSync, spawnSync } from 'node:child_process';
import { chownSync, existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir, userInfo } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

/**
 * A throwaway PostgreSQL cluster on loopback, for the tests and CI: `initdb` in a temporary
 * directory, started with `pg_ctl` as an unprivileged user (PostgreSQL refuses to run as root; as
 * root this runs it as Debian's `postgres` user), trusted for local connections only, and removed
 * when stopped. Nothing here is for production: the README's operations section is.
 *
 *   node --import tsx scripts/pg-throwaway.ts start   → prints `TEST_DATABASE_URL=…` and `PGDATA=…`
 *   node --import tsx scripts/pg-throwaway.ts stop <PGDATA>
 */

export type Cluster = {
  /** `postgres://blazebook@127.0.0.1:<port>/postgres`: the maintenance database, as superuser. */
  url: string;
  dataDir: string;
  port: number;
  /** `pg_ctl stop -m immediate`: every server process ends at once, as in a crash. */
  crash(): void;
  start(): void;
  /** Stops the server (fast) and removes the directory. */
  remove(): void;
};

export type ClusterOptions = {
  /** false turns fsync off: faster, and still safe against a crash of PostgreSQL (not of the machine). */
  fsync?: boolean;
};

/** The folder with initdb and pg_ctl: PG_BIN, else Debian's newest /usr/lib/postgresql/N/bin, else PATH. */
export function postgresBinDir(): string {
  if (process.env.PG_BIN) return process.env.PG_BIN;
  const debian = '/usr/lib/postgresql';
  if (existsSync(debian)) {
    const versions = readdirSync(debian)
      .filter((name) => /^\d+$/.test(name) && existsSync(path.join(debian, name, 'bin', 'initdb')))
      .sort((a, b) => Number(b) - Number(a));
    if (versions[0]) return path.join(debian, versions[0], 'bin');
  }
  const found = spawnSync('sh', ['-c', 'command -v initdb'], { encoding: 'utf8' }).stdout.trim();
  if (found) return path.dirname(found);
  throw new Error('PostgreSQL is not installed: `apt-get install postgresql` (Debian), or set PG_BIN to the folder with initdb.');
}

const asRoot = () => process.getuid?.() === 0;

/** Runs a PostgreSQL program as the unprivileged user (the current one unless we are root). */
function run(program: string, args: string[]): string {
  const bin = path.join(postgresBinDir(), program);
  const [command, argv] = asRoot() ? ['runuser', ['-u', 'postgres', '--', bin, ...args]] : [bin, args];
  return execFileSync(command, argv, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'] });
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
  });
}

/** initdb and start; resolves once the server accepts connections. */
export async function startCluster({ fsync = true }: ClusterOptions = {}): Promise<Cluster> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'blazebook-pg-'));
  const owner = asRoot()
    ? {
        uid: Number(execFileSync('id', ['-u', 'postgres'], { encoding: 'utf8' }).trim()),
        gid: Number(execFileSync('id', ['-g', 'postgres'], { encoding: 'utf8' }).trim()),
      }
    : null;
  if (owner) chownSync(dataDir, owner.uid, owner.gid);
  run('initdb', ['-D', dataDir, '-U', 'blazebook', '-A', 'trust', '-E', 'UTF8', '--locale=C.UTF-8', '--no-instructions']);
  const port = await freePort();
  const settings = [
    "listen_addresses = '127.0.0.1'",
    `port = ${port}`,
    // The socket goes in the cluster's own folder, so nothing outside it is needed.
    `unix_socket_directories = '${dataDir}'`,
    `fsync = ${fsync ? 'on' : 'off'}`,
    'max_connections = 200',
    "log_min_messages = 'warning'",
  ];
  // The file stays the cluster owner's.
  const conf = path.join(dataDir, 'postgresql.auto.conf');
  writeFileSync(conf, `${settings.join('\n')}\n`, { flag: 'a' });
  if (owner) chownSync(conf, owner.uid, owner.gid);
  const cluster: Cluster = {
    url: `postgres://blazebook@127.0.0.1:${port}/postgres`,
    dataDir,
    port,
    start: () => void run('pg_ctl', ['-D', dataDir, '-l', path.join(dataDir, 'server.log'), '-w', '-t', '60', 'start']),
    crash: () => void run('pg_ctl', ['-D', dataDir, '-m', 'immediate', '-w', 'stop']),
    remove() {
      try {
        run('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
      } catch {
        // Already stopped.
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
  cluster.start();
  return cluster;
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  const [command, dataDir] = process.argv.slice(2);
  if (command === 'start') {
    const cluster = await startCluster({ fsync: false });
    console.log(`TEST_DATABASE_URL=${cluster.url}`);
    console.log(`PGDATA=${cluster.dataDir}`);
  } else if (command === 'stop' && dataDir) {
    try {
      run('pg_ctl', ['-D', dataDir, '-m', 'fast', '-w', 'stop']);
    } finally {
      rmSync(dataDir, { recursive: true, force: true });
    }
  } else {
    console.error(`Usage: node --import tsx scripts/pg-throwaway.ts start | stop <PGDATA> (run by ${userInfo().username})`);
    process.exit(2);
  }
}
