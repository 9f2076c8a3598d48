import { linkSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * PGlite takes no lock of its own: a second process opens a data directory that a running server
 * is using without complaint (and on closing removes the server's `postmaster.pid`), and the two
 * then write the same files. This file, inside the data directory (PostgreSQL ignores files it
 * does not know), makes the second opener stop with a clear message instead.
 */
export const lockFileName = 'blazebook.lock';

type Holder = { pid: number; startedAt: string | null; command: string };

/** Thrown when another live process has the data directory open. */
export class DataDirInUseError extends Error {
  constructor(
    readonly dataDir: string,
    readonly holder: Holder,
  ) {
    super(
      `The data directory ${dataDir} is in use by process ${holder.pid} (${holder.command}). ` +
        'The embedded database can be opened by one process at a time: stop that process first ' +
        `(if you are sure it is not running Blazebook, delete ${path.join(dataDir, lockFileName)}).`,
    );
    this.name = 'DataDirInUseError';
  }
}

/**
 * A process's start time in clock ticks since boot (field 22 of /proc/<pid>/stat), or null where
 * there is no /proc. With it a lock left by a killed process is not mistaken for a live one that
 * happens to get the same pid later — the usual case in a restarted container, where pids repeat.
 */
function startTimeOf(pid: number): string | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (field 2) may contain spaces and parentheses; fields after it do not.
    return stat.slice(stat.lastIndexOf(')') + 2).split(' ')[19] ?? null;
  } catch {
    return null;
  }
}

/** Whether a process with this id exists (perhaps another user's), without signalling it. */
export function processExists(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM: the process exists but belongs to someone else.
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function isAlive(holder: Holder): boolean {
  if (!processExists(holder.pid)) return false;
  const startedAt = startTimeOf(holder.pid);
  return holder.startedAt === null || startedAt === null || startedAt === holder.startedAt;
}

function describeThisProcess(): string {
  const script = process.argv[1];
  return script ? path.relative(process.cwd(), script) || script : process.argv0;
}

function readHolder(file: string): Holder | null {
  try {
    const value = JSON.parse(readFileSync(file, 'utf8')) as Partial<Holder>;
    if (typeof value.pid !== 'number') return null;
    return { pid: value.pid, startedAt: value.startedAt ?? null, command: value.command ?? 'unknown' };
  } catch {
    return null;
  }
}

export type DataDirLock = { release(): void };

/**
 * Marks `dataDir` as opened by this process, creating the directory if needed. Throws
 * DataDirInUseError while another live process holds it; a lock whose process is gone is taken over.
 */
export function lockDataDir(dataDir: string, command = describeThisProcess()): DataDirLock {
  mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, lockFileName);
  const me: Holder = { pid: process.pid, startedAt: startTimeOf(process.pid), command };
  // Written whole under a private name, then linked into place: the link either creates the lock
  // with its content or fails, so nobody ever reads a half-written lock and takes it for stale.
  const draft = `${file}.${process.pid}`;
  writeFileSync(draft, `${JSON.stringify(me)}\n`);
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        linkSync(draft, file);
        break;
      } catch (error) {
        if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
        const holder = readHolder(file);
        if (holder && isAlive(holder)) throw new DataDirInUseError(dataDir, holder);
        if (attempt > 0)
          throw new Error(`Could not take the lock ${file}; another process keeps replacing it.`);
        rmSync(file, { force: true });
      }
    }
  } finally {
    rmSync(draft, { force: true });
  }
  let released = false;
  return {
    release() {
      if (released) return;
      released = true;
      // A restore loads a dump that carries the lock of the process that made it; that one is
      // gone, so what is there now is removed unless a live process other than us holds it.
      const holder = readHolder(file);
      const ours = holder?.pid === me.pid && holder.startedAt === me.startedAt;
      if (holder && !ours && isAlive(holder)) return;
      rmSync(file, { force: true });
    },
  };
}
