/**
 * Trace a design exactly from the command line, for lab scripts:
 *
 *   npm run --silent trace -- <design.json | -> [--at 400,500] [--rays 20000] [--curved-entrance]
 *
 * Prints the same JSON as POST /api/trace on stdout. Exit 2 with a message on stderr for bad
 * flags, unreadable or invalid JSON, or a design or flag value the schema rejects (one
 * `path: message` line per bad field, flags named as flags).
 */

import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { traceAnswer } from '../server/trace/answer';
import { defaultRateLimits } from '../server/auth/rate-limit';
import { traceRequestSchema, type TraceAnswer } from '../shared/contract/trace';
import { designSchema } from '../shared/design';
import { TRACE_LIMITS } from '../shared/trace';
import { fieldErrors, formatFieldErrors } from '../shared/validation';
import { parseInputJson, runJsonCommand, type JsonOutcome } from './json-input';
import { runCommand, UsageError } from './run-command';
import { decimal } from './solve';

// The CLI keeps the HTTP API's limits (one schema for both), so a script that works here also
// works against POST /api/trace.
export const USAGE = `usage: npm run --silent trace -- <design.json | -> [--at 400,500] [--rays N] [--curved-entrance]
  --at               wavelengths in nm to trace besides the range's start, centre and end,
                     decimal numbers (500, 532.1, 5e2), at most ${TRACE_LIMITS.maxWavelengths}
  --rays             rays per wavelength, ${TRACE_LIMITS.minRays} to ${TRACE_LIMITS.maxRays} (default ${TRACE_LIMITS.defaultRays}), spread over the
                     entrance slit and the collimator's aperture
  --curved-entrance  bend the entrance slit to the arc that straightens its image
The design is the JSON POST /api/solve takes as "design"; with a detector that holds the whole
range it is traced as a spectrograph (the grating stays at the range's centre), otherwise as a
monochromator turned to each wavelength. Prints POST /api/trace's answer:
  wavelengths   per traced wavelength:
    wavelengthNm, raysTraced, raysVignetted   raysTraced + raysVignetted = rays launched
    centroidMm { x, y }             the centroid of the whole entrance slit's image
    rmsWidthMm, rmsHeightMm         RMS spread in x and in y of the spot from the slit's centre point
    tracedFwhmNm                    FWHM of the traced line shape (null: no clear peak)
    curvatureSagittaMm              x at the slit image's ends minus x at its centre
    tracedLinearDispersionMmPerNm   the traced linear dispersion, mm per nm
    bestFocusShiftMm                the tangential (x) focus from the image plane
  imagePlane, mode (monochromator or spectrograph), raysPerWavelength, straighteningRadiusMm,
  detectorTilt (a spectrograph's best flat-detector tilt, or null), warnings [{ code, wavelengthNm, message }]
Signs and axes, in the image plane (imagePlane names it: the exit slit's plane, or the detector's):
  x  along the dispersion, positive toward longer wavelengths
  y  along the slit, positive toward the top of the entrance slit's image
  both in mm from the exit slit's centre; bestFocusShiftMm is along the chief ray, positive away
  from the camera mirror
The same limits as POST /api/trace, which also allows ${defaultRateLimits.tracePerIp} calls a minute per address.`;

export { UsageError };

export interface TraceArgs {
  /** A file path, or `-` for stdin. */
  input: string;
  at?: number[];
  rays?: number;
  curvedEntrance?: boolean;
}

const options = {
  at: { type: 'string' },
  rays: { type: 'string' },
  'curved-entrance': { type: 'boolean' },
  help: { type: 'boolean', short: 'h' },
} as const;

/**
 * Reads the command line (without `node` and the script). Throws a `UsageError` naming the flag
 * for an unknown option, a missing value or a value that is not a number.
 */
export function parseTraceArgs(argv: readonly string[]): TraceArgs {
  // Not strict, as the solve script: the schema explains why `--rays -5` is refused.
  const { values, positionals, tokens } = parseArgs({ args: [...argv], options, allowPositionals: true, strict: false, tokens: true });
  if (values.help === true) throw new UsageError('');
  for (const token of tokens) {
    if (token.kind !== 'option') continue;
    if (!Object.hasOwn(options, token.name)) throw new UsageError(`unknown option ${token.rawName}`);
    const type = options[token.name as keyof typeof options].type;
    if (type === 'string' && !token.value) throw new UsageError(`${token.rawName} needs a value`);
    if (type === 'boolean' && token.value !== undefined) throw new UsageError(`${token.rawName} takes no value`);
  }
  const at = typeof values.at === 'string' ? values.at.split(',').map(wavelength) : undefined;
  let rays: number | undefined;
  if (typeof values.rays === 'string') {
    const n = decimal(values.rays);
    if (n === null) throw new UsageError(`--rays: "${values.rays}" is not a decimal number`);
    rays = n;
  }
  const [input, extra] = positionals;
  if (extra !== undefined) throw new UsageError(`unexpected argument ${extra}`);
  if (input === undefined) throw new UsageError('missing the design file (or - for stdin)');
  return { input, at, rays, curvedEntrance: values['curved-entrance'] === true ? true : undefined };
}

function wavelength(text: string): number {
  const n = decimal(text);
  if (n === null) throw new UsageError(`--at: "${text}" is not a wavelength in nm (a decimal number)`);
  return n;
}

/** How a refused request field is spelt on the command line: `--at value 2 (-5)`, `--rays`. */
function flagName(path: string, args: TraceArgs): string {
  const item = /^atNm\.(\d+)$/.exec(path);
  if (item) return `--at value ${Number(item[1]) + 1} (${args.at?.[Number(item[1])]})`;
  if (path === 'atNm') return '--at';
  if (path === 'curvedEntrance') return '--curved-entrance';
  return `--${path}`;
}

export type TraceOutcome = JsonOutcome<TraceAnswer>;

/**
 * Parses the design JSON read from `args.input`, checks it and the flag values with the HTTP
 * API's schema, and traces it. A refusal is the text the CLI prints before exiting 2: one
 * `path: reason` line per bad design field, flags named as flags (`--rays: must be at most 50000`).
 */
export function traceInput(text: string, args: TraceArgs): TraceOutcome {
  const read = parseInputJson(text, args.input);
  if (!read.ok) return read;

  const design = designSchema.safeParse(read.json);
  if (!design.success) return { ok: false, message: formatFieldErrors(fieldErrors(design.error)) };

  const request = traceRequestSchema.safeParse({ design: design.data, atNm: args.at, rays: args.rays, curvedEntrance: args.curvedEntrance });
  if (!request.success) {
    const flags = Object.entries(fieldErrors(request.error)).map(([path, why]) => `${flagName(path, args)}: ${why}`);
    return { ok: false, message: `${flags.join('\n')}\n${USAGE}` };
  }
  return { ok: true, answer: traceAnswer(request.data) };
}

/** The command: 0 with the answer on stdout, 2 with the reason on stderr. */
export function main(argv: readonly string[] = process.argv.slice(2)): Promise<number> {
  return runJsonCommand(argv, USAGE, parseTraceArgs, traceInput);
}

// Run only as the script, so tests can import the functions above.
if (process.argv[1] !== undefined && realpathSync(process.argv[1]) === realpathSync(fileURLToPath(import.meta.url))) {
  runCommand(() => main());
}
