import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { UsageError } from '../../scripts/solve';

const TSX = join(process.cwd(), 'node_modules/.bin/tsx');

/**
 * What every script's tests need: a folder of input files, the script run as `npm run` runs it
 * (tsx, its own process), and the message a command line is refused with.
 */
export function cliHarness(script: string) {
  const dir = mkdtempSync(join(tmpdir(), `blazebook-${script}-`));
  const path = join(process.cwd(), 'scripts', `${script}.ts`);
  return {
    dir,
    /** Writes `content` (a string as is, anything else as JSON) to a file and returns its path. */
    file(name: string, content: unknown): string {
      const at = join(dir, name);
      writeFileSync(at, typeof content === 'string' ? content : JSON.stringify(content));
      return at;
    },
    /** Runs the script with `args` (and `stdin`), as a separate process. */
    run(args: string[], stdin?: string): { code: number | null; stdout: string; stderr: string } {
      const r = spawnSync(TSX, [path, ...args], { input: stdin, encoding: 'utf8', timeout: 60_000, maxBuffer: 64 * 1024 * 1024 });
      return { code: r.status, stdout: r.stdout, stderr: r.stderr };
    },
  };
}

/** The message `parse` refuses a command line with, or null when it accepts it. */
export function usageErrorOf(parse: (argv: string[]) => unknown): (argv: string[]) => string | null {
  return (argv) => {
    try {
      parse(argv);
      return null;
    } catch (error) {
      if (error instanceof UsageError) return error.message;
      throw error;
    }
  };
}
