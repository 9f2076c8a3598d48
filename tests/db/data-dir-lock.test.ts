import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DataDirInUseError, lockDataDir, lockFileName } from '../../db/data-dir-lock';

const scratch = mkdtempSync(path.join(tmpdir(), 'blazebook-lock-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const newDir = () => mkdtempSync(path.join(scratch, 'data-'));

/** A pid that no process has any more: a child that has already exited. */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', '']);
  return child.pid;
}

describe('data directory lock', () => {
  it('refuses a second opener while the first holds it, naming the holder', () => {
    const dir = newDir();
    const lock = lockDataDir(dir, 'server/index.ts');
    expect(() => lockDataDir(dir)).toThrow(DataDirInUseError);
    expect(() => lockDataDir(dir)).toThrow(`is in use by process ${process.pid} (server/index.ts)`);
    lock.release();
    expect(existsSync(path.join(dir, lockFileName))).toBe(false);
    lockDataDir(dir).release();
  });

  it('creates the data directory when it does not exist yet', () => {
    const dir = path.join(newDir(), 'not-yet');
    const lock = lockDataDir(dir);
    expect(existsSync(path.join(dir, lockFileName))).toBe(true);
    lock.release();
  });

  it('takes over a lock left by a process that is gone (a killed server)', () => {
    const dir = newDir();
    writeFileSync(
      path.join(dir, lockFileName),
      JSON.stringify({ pid: deadPid(), startedAt: null, command: 'killed' }),
    );
    const lock = lockDataDir(dir);
    expect(JSON.parse(readFileSync(path.join(dir, lockFileName), 'utf8')).pid).toBe(process.pid);
    lock.release();
  });

  it('takes over a lock whose pid now belongs to a process started later (pids repeat in a restarted container)', async () => {
    const dir = newDir();
    const other = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 30000)']);
    try {
      // Linux start times come from /proc (the platform this project runs on, see STACK.md).
      writeFileSync(
        path.join(dir, lockFileName),
        JSON.stringify({ pid: other.pid, startedAt: '1', command: 'old server' }),
      );
      const lock = lockDataDir(dir);
      lock.release();
      writeFileSync(
        path.join(dir, lockFileName),
        JSON.stringify({ pid: other.pid, startedAt: null, command: 'live server' }),
      );
      expect(() => lockDataDir(dir)).toThrow(`in use by process ${other.pid} (live server)`);
    } finally {
      other.kill();
    }
  });

  it('treats an unreadable lock file as stale', () => {
    const dir = newDir();
    writeFileSync(path.join(dir, lockFileName), 'half-writ');
    lockDataDir(dir).release();
  });

  it('on release removes a lock a restore brought in from a dead process, but never a live process’s', () => {
    const dir = newDir();
    const file = path.join(dir, lockFileName);
    const restored = lockDataDir(dir);
    writeFileSync(file, JSON.stringify({ pid: deadPid(), startedAt: null, command: 'backup' }));
    restored.release();
    expect(existsSync(file)).toBe(false);

    const other = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 30000)']);
    try {
      const mine = lockDataDir(dir);
      const theirs = JSON.stringify({ pid: other.pid, startedAt: null, command: 'server' });
      writeFileSync(file, theirs);
      mine.release();
      expect(readFileSync(file, 'utf8')).toBe(theirs);
    } finally {
      other.kill();
    }
  });
});
