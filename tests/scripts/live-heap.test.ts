import { spawn, type ChildProcess } from 'node:child_process';
import { afterEach, describe, expect, it } from 'vitest';
import { inspectorUrl, liveHeap } from '../../bench/live-heap';

/**
 * The soak's leak check reads a process's heap through its inspector after a full collection. A
 * child process keeps or drops about 40 MB on request: kept memory must show, garbage must not.
 */
const child = `
globalThis.kept = [];
process.stdin.setEncoding('utf8');
process.stdin.on('data', (line) => {
  const batch = Array.from({ length: 400_000 }, (_, i) => ({ i, label: 'item ' + i }));
  if (line.trim() === 'keep') globalThis.kept.push(batch);
  process.stdout.write('done\\n');
});
process.stdout.write('ready\\n');
`;

let running: ChildProcess | null = null;
afterEach(() => {
  running?.kill();
  running = null;
});

function start(): Promise<{ url: string; ask: (what: 'keep' | 'drop') => Promise<void> }> {
  const proc = spawn(process.execPath, ['--inspect=127.0.0.1:0', '-e', child], { stdio: ['pipe', 'pipe', 'pipe'] });
  running = proc;
  let stderr = '';
  let stdout = '';
  proc.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  proc.stdout!.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
  const lines = (n: number) =>
    new Promise<void>((resolve, reject) => {
      const check = () => {
        if (stdout.split('\n').length - 1 >= n && /Debugger listening/.test(stderr)) {
          proc.stdout!.off('data', check);
          resolve();
        }
      };
      proc.stdout!.on('data', check);
      proc.once('exit', (code) => reject(new Error(`child exited with ${code}: ${stderr}`)));
      check();
    });
  let answered = 1;
  return lines(1).then(() => ({
    url: inspectorUrl(stderr),
    ask: async (what) => {
      proc.stdin!.write(`${what}\n`);
      answered += 1;
      await lines(answered);
    },
  }));
}

describe('the live heap read through the inspector', () => {
  it('counts what a process keeps and not the garbage it made', async () => {
    const { url, ask } = await start();
    const before = await liveHeap(url);
    expect(before.heapUsedMb).toBeGreaterThan(0);
    expect(before.rssMb).toBeGreaterThan(before.heapUsedMb);

    await ask('drop');
    const afterGarbage = await liveHeap(url);
    expect(afterGarbage.heapUsedMb - before.heapUsedMb).toBeLessThan(5);

    await ask('keep');
    const afterKeeping = await liveHeap(url);
    expect(afterKeeping.heapUsedMb - before.heapUsedMb).toBeGreaterThan(20);
  }, 30_000);

  it('says so when the output names no inspector', () => {
    expect(() => inspectorUrl('Blazebook ready at http://127.0.0.1:8080')).toThrow(/did not print an inspector address/);
  });
});
