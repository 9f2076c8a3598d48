/**
 * Solve a design from the command line, for lab scripts:
 *
 *   npm run --silent solve -- <design.json | -> [--at 400,500,600] [--points N]
 *
 * Prints the evaluation JSON on stdout. Exit 2 with a message on stderr for bad flags, unreadable
 * or invalid JSON, or a design the schema rejects (one `path: message` line per bad field).
 * Limits (the HTTP API's, see USAGE): at most 1,000 wavelengths, 20 listed overlapping orders each.
 */

import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { DEFAULT_POINTS, evaluateDesign } from '../features/solver/evaluate';
import { MAX_LISTED_OVERLAPS } from '../features/solver/orders';
import { defaultRateLimits } from '../server/auth/rate-limit';
import { designSchema, MAX_SOLVE_WAVELENGTHS, MIN_SOLVE_POINTS, solveRequestSchema } from '../shared/design';
import { fieldErrors, formatFieldErrors } from '../shared/validation';
import { parseInputJson, readInputText } from './json-input';
import { UsageError } from './run-command';

// The CLI keeps the HTTP API's limits (one schema for both), so a script that works here also
// works against POST /api/solve.
export const USAGE = `usage: npm run --silent solve -- <design.json | -> [--at 400,500,600] [--points N]
  --at      wavelengths in nm as decimal numbers (500, 532.1, 5e2), at most ${MAX_SOLVE_WAVELENGTHS}
  --points  evenly spaced wavelengths over the design range, ${MIN_SOLVE_POINTS} to ${MAX_SOLVE_WAVELENGTHS} (default ${DEFAULT_POINTS})
Each wavelength lists at most ${MAX_LISTED_OVERLAPS} overlapping orders (those nearest the working order);
overlapCount is the full number and overlapsTruncated is true when the list was cut.
Order sorting: the design's optional "filters" list ({ "kind": "long-pass", "cutOnNm", "inFromNm", "inToNm",
"edgeWidthNm" }, in the beam while set from inFromNm to inToNm) marks each listed overlap "blocked";
unblockedOverlapCount and filterTransmission are per wavelength, and "orderSorting" gives a
proposed plan (proposedFilters) and the unblockedOverlaps the design's filters leave.
The same limits as POST /api/solve, which also allows ${defaultRateLimits.solvePerIp} calls per ${defaultRateLimits.solveWindowMs / 1000} s per address.
What some figures assume:
  resolvingPower   λ / √(bandpassNm² + diffractionLimitNm²): slit and diffraction widths added in
                   quadrature, as for near-Gaussian profiles (common practice); below |m|N
  blazeEfficiency  the scalar (Kirchhoff) blaze function sinc²(π(|m| − λ_B cos K / λ)), the small-angle
                   form of the groove-facet model (Schroeder & Hilliard 1980); holds for λ/d below
                   about 0.2 (Palmer & Loewen, Diffraction Grating Handbook, ch. 9), warned past it
  detector.pixelsPerResolutionElement  pixels across the entrance-slit image or the diffraction-
                   limited line, the wider, fewest of range start, centre and end; under 2 warns`;

export { UsageError };

export interface SolveArgs {
  /** A file path, or `-` for stdin. */
  input: string;
  at?: number[];
  points?: number;
}

const options = {
  at: { type: 'string' },
  points: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;

/**
 * Reads the command line (without `node` and the script). Throws a `UsageError` naming the flag
 * for an unknown option, a missing value or a value that is not a number.
 */
export function parseSolveArgs(argv: readonly string[]): SolveArgs {
  // Not strict: node's own messages would differ from ours, and strict mode refuses `--at -5`
  // outright where the schema below explains that a wavelength must be greater than 0.
  const { values, positionals, tokens } = parseArgs({ args: [...argv], options, allowPositionals: true, strict: false, tokens: true });
  if (values.help === true) throw new UsageError('');
  for (const token of tokens) {
    if (token.kind !== 'option') continue;
    if (!Object.hasOwn(options, token.name)) throw new UsageError(`unknown option ${token.rawName}`);
    if (options[token.name as keyof typeof options].type === 'string' && !token.value) {
      throw new UsageError(`${token.rawName} needs a value`);
    }
  }
  const at = typeof values.at === 'string' ? values.at.split(',').map(wavelength) : undefined;
  let points: number | undefined;
  if (typeof values.points === 'string') {
    const n = decimal(values.points);
    if (n === null) throw new UsageError(`--points: "${values.points}" is not a decimal number`);
    points = n;
  }
  const [input, extra] = positionals;
  if (extra !== undefined) throw new UsageError(`unexpected argument ${extra}`);
  if (input === undefined) throw new UsageError('missing the design file (or - for stdin)');
  if (at !== undefined && points !== undefined) throw new UsageError('use either --at or --points, not both');
  return { input, at, points };
}

/**
 * Plain decimal notation, optionally with a power of ten: `500`, `-5`, `.5`, `532.1`, `5e2`.
 * `Number()` alone also reads `0x1F4`, `0b1`, `0o7`, `Infinity` and `''` (as 0), so a typo
 * would silently become a wavelength; we check the spelling first.
 */
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

/** The number a decimal string spells, or null when it is not one (or not finite). */
export function decimal(text: string): number | null {
  const trimmed = text.trim();
  if (!DECIMAL.test(trimmed)) return null;
  const n = Number(trimmed);
  return Number.isFinite(n) ? n : null;
}

function wavelength(text: string): number {
  const n = decimal(text);
  if (n === null) throw new UsageError(`--at: "${text}" is not a wavelength in nm (a decimal number)`);
  return n;
}

export type SolveOutcome = { ok: true; evaluation: ReturnType<typeof evaluateDesign> } | { ok: false; message: string };

/**
 * Parses the design JSON read from `args.input`, checks it and the flag values with the HTTP
 * API's schemas, and evaluates it. A refusal is the text the CLI prints before exiting 2: one
 * `path: reason` line per bad field, flags named as flags (`--at value 2 (-5): …`).
 */
export function solveInput(text: string, args: SolveArgs): SolveOutcome {
  const read = parseInputJson(text, args.input);
  if (!read.ok) return read;

  const design = designSchema.safeParse(read.json);
  if (!design.success) return { ok: false, message: formatFieldErrors(fieldErrors(design.error)) };

  // Flag values go through the same rules as an HTTP solve request.
  const request = solveRequestSchema.safeParse({ design: design.data, at: args.at, points: args.points });
  if (!request.success) {
    const flags = Object.entries(fieldErrors(request.error)).map(([path, why]) => {
      const item = /^at\.(\d+)$/.exec(path);
      const flag = item ? `--at value ${Number(item[1]) + 1} (${args.at?.[Number(item[1])]})` : `--${path}`;
      return `${flag}: ${why}`;
    });
    return { ok: false, message: `${flags.join('\n')}\n${USAGE}` };
  }

  const evaluation = evaluateDesign(request.data.design, {
    wavelengthsNm: request.data.at,
    points: request.data.points,
  });
  return { ok: true, evaluation };
}

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(2);
}

function main(): void {
  let args: SolveArgs;
  try {
    args = parseSolveArgs(process.argv.slice(2));
  } catch (error) {
    if (error instanceof UsageError) fail(error.message ? `${error.message}\n${USAGE}` : USAGE);
    throw error;
  }

  const input = readInputText(args.input);
  if (!input.ok) fail(input.message);

  const outcome = solveInput(input.text, args);
  if (!outcome.ok) fail(outcome.message);
  process.stdout.write(`${JSON.stringify(outcome.evaluation, null, 2)}\n`);
}

// Run only as the script, so tests can import the functions above. Real paths on both sides, in
// case the script was reached through a symlink.
if (process.argv[1] !== undefined && realpathSync(process.argv[1]) === realpathSync(fileURLToPath(import.meta.url))) main();
