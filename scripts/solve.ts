/**
 * Solve a design from the command line, for lab scripts:
 *
 *   npm run --silent solve -- <design.json | -> [--at 400,500,600] [--points N]
 *
 * Prints the evaluation JSON on stdout. Exit 2 with a message on stderr for bad flags, unreadable
 * or invalid JSON, or a design the schema rejects (one `path: message` line per bad field).
 * Limits (the HTTP API's, see USAGE): at most 1,000 wavelengths, 20 listed overlapping orders each.
 */

import { readFileSync } from 'node:fs';
import { DEFAULT_POINTS, evaluateDesign } from '../features/solver/evaluate';
import { MAX_LISTED_OVERLAPS } from '../features/solver/orders';
import { defaultRateLimits } from '../server/auth/rate-limit';
import { designSchema, MAX_SOLVE_WAVELENGTHS, MIN_SOLVE_POINTS, solveRequestSchema } from '../shared/design';
import { fieldErrors, formatFieldErrors } from '../shared/validation';

// The CLI keeps the HTTP API's limits (one schema for both), so a script that works here also
// works against POST /api/solve.
const USAGE = `usage: npm run --silent solve -- <design.json | -> [--at 400,500,600] [--points N]
  --at      wavelengths in nm, at most ${MAX_SOLVE_WAVELENGTHS}
  --points  evenly spaced wavelengths over the design range, ${MIN_SOLVE_POINTS} to ${MAX_SOLVE_WAVELENGTHS} (default ${DEFAULT_POINTS})
Each wavelength lists at most ${MAX_LISTED_OVERLAPS} overlapping orders (those nearest the working order);
overlapCount is the full number and overlapsTruncated is true when the list was cut.
The same limits as POST /api/solve, which also allows ${defaultRateLimits.solvePerIp} calls per ${defaultRateLimits.solveWindowMs / 1000} s per address.`;

class UsageError extends Error {}

interface Args {
  input: string;
  at?: number[];
  points?: number;
}

function parseArgs(argv: readonly string[]): Args {
  let input: string | undefined;
  let at: number[] | undefined;
  let points: number | undefined;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    const [flag, inline] = arg.startsWith('--') ? (arg.split(/=(.*)/s, 2) as [string, string?]) : [arg];
    const value = () => {
      const v = inline ?? argv[++i];
      if (v === undefined || v === '') throw new UsageError(`${flag} needs a value`);
      return v;
    };
    if (flag === '--at') {
      at = value().split(',').map((s) => {
        const n = Number(s.trim());
        if (s.trim() === '' || !Number.isFinite(n)) throw new UsageError(`--at: "${s}" is not a wavelength in nm`);
        return n;
      });
    } else if (flag === '--points') {
      const raw = value();
      points = Number(raw);
      if (!Number.isFinite(points)) throw new UsageError(`--points: "${raw}" is not a number`);
    } else if (flag === '--help' || flag === '-h') {
      throw new UsageError('');
    } else if (flag.startsWith('-') && flag !== '-') {
      throw new UsageError(`unknown option ${flag}`);
    } else if (input === undefined) {
      input = arg;
    } else {
      throw new UsageError(`unexpected argument ${arg}`);
    }
  }
  if (input === undefined) throw new UsageError('missing the design file (or - for stdin)');
  if (at !== undefined && points !== undefined) throw new UsageError('use either --at or --points, not both');
  return { input, at, points };
}

function readInput(input: string): string {
  return readFileSync(input === '-' ? 0 : input, 'utf8');
}

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(2);
}

function main(): void {
  let args: Args;
  try {
    args = parseArgs(process.argv.slice(2));
  } catch (error) {
    if (error instanceof UsageError) fail(error.message ? `${error.message}\n${USAGE}` : USAGE);
    throw error;
  }

  let text: string;
  try {
    text = readInput(args.input);
  } catch (error) {
    fail(`cannot read ${args.input === '-' ? 'stdin' : args.input}: ${(error as Error).message}`);
  }

  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    fail(`${args.input === '-' ? 'stdin' : args.input} is not valid JSON: ${(error as Error).message}`);
  }

  const design = designSchema.safeParse(json);
  if (!design.success) fail(formatFieldErrors(fieldErrors(design.error)));

  // Flag values go through the same rules as an HTTP solve request.
  const request = solveRequestSchema.safeParse({ design: design.data, at: args.at, points: args.points });
  if (!request.success) {
    const flags = Object.entries(fieldErrors(request.error)).map(([path, why]) => {
      const item = /^at\.(\d+)$/.exec(path);
      const flag = item ? `--at value ${Number(item[1]) + 1} (${args.at?.[Number(item[1])]})` : `--${path}`;
      return `${flag}: ${why}`;
    });
    fail(`${flags.join('\n')}\n${USAGE}`);
  }

  const evaluation = evaluateDesign(request.data.design, {
    wavelengthsNm: request.data.at,
    points: request.data.points,
  });
  process.stdout.write(`${JSON.stringify(evaluation, null, 2)}\n`);
}

main();
