import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { traceAnswerSchema } from '@/shared/contract/trace';
import { exampleDesign } from '@/shared/design';
import { TRACE_LIMITS } from '@/shared/trace';
import { main, parseTraceArgs, traceInput, USAGE, type TraceArgs } from '../../scripts/trace';
import { cliHarness, usageErrorOf } from './cli-harness';

const { dir, file, run } = cliHarness('trace');


/** The message a command line is refused with, or null when it is accepted. */
const usageError = usageErrorOf(parseTraceArgs);

/** The example design (as the CLI reads it from a file) with the given flags. */
function traceExample(flags: Omit<TraceArgs, 'input'>, design: unknown = exampleDesign) {
  return traceInput(JSON.stringify(design), { input: 'design.json', ...flags });
}

describe('trace CLI', () => {
  afterEach(() => vi.restoreAllMocks());

  describe('reading the command line', () => {
    it.each([
      { argv: ['d.json'], args: { input: 'd.json', at: undefined, rays: undefined, curvedEntrance: undefined } },
      { argv: ['d.json', '--at', '400, 500'], args: { input: 'd.json', at: [400, 500], rays: undefined, curvedEntrance: undefined } },
      { argv: ['-', '--rays=20000', '--curved-entrance'], args: { input: '-', at: undefined, rays: 20_000, curvedEntrance: true } },
      // Read, then refused by the schema with its reason (below).
      { argv: ['d.json', '--rays', '-5', '--at', '5e2,-1'], args: { input: 'd.json', at: [500, -1], rays: -5, curvedEntrance: undefined } },
    ] satisfies readonly { argv: string[]; args: TraceArgs }[])('reads $argv', ({ argv, args }) => {
      expect(parseTraceArgs(argv)).toEqual(args);
    });

    it.each([
      { argv: ['d.json', '--wat'], message: 'unknown option --wat' },
      { argv: ['d.json', '--at', '400,abc'], message: '--at: "abc" is not a wavelength in nm (a decimal number)' },
      { argv: ['d.json', '--at', '0x1F4'], message: '--at: "0x1F4" is not a wavelength in nm (a decimal number)' },
      { argv: ['d.json', '--rays', 'many'], message: '--rays: "many" is not a decimal number' },
      { argv: ['d.json', '--rays', 'Infinity'], message: '--rays: "Infinity" is not a decimal number' },
      { argv: ['d.json', '--rays'], message: '--rays needs a value' },
      { argv: ['d.json', '--curved-entrance=yes'], message: '--curved-entrance takes no value' },
      { argv: ['a.json', 'b.json'], message: 'unexpected argument b.json' },
      { argv: [], message: 'missing the design file (or - for stdin)' },
      { argv: ['--help'], message: '' },
    ] satisfies readonly { argv: string[]; message: string }[])('refuses $argv', ({ argv, message }) => {
      expect(usageError(argv)).toBe(message);
    });
  });

  it('documents the answer’s fields, its signs and axes, and the bounds in the help', () => {
    for (const name of ['wavelengthNm', 'raysTraced', 'raysVignetted', 'centroidMm', 'rmsWidthMm', 'rmsHeightMm', 'tracedFwhmNm', 'curvatureSagittaMm', 'tracedLinearDispersionMmPerNm', 'bestFocusShiftMm', 'imagePlane', 'warnings']) {
      expect(USAGE).toContain(name);
    }
    expect(USAGE).toMatch(/x\s+along the dispersion, positive toward longer wavelengths/);
    expect(USAGE).toMatch(/y\s+along the slit/);
    expect(USAGE).toMatch(/mm from the exit slit's centre/);
    expect(USAGE).toMatch(/bestFocusShiftMm is along the chief ray, positive away\s+from the camera mirror/);
    expect(USAGE).toContain(`${TRACE_LIMITS.minRays} to ${TRACE_LIMITS.maxRays}`);
    expect(USAGE).toContain(`at most ${TRACE_LIMITS.maxWavelengths}`);
  });

  it('refuses invalid JSON, naming where it came from', () => {
    expect(traceInput('{ "grating": ', { input: '-' })).toMatchObject({ ok: false, message: expect.stringMatching(/^stdin is not valid JSON: /) });
  });

  it('refuses a bad design with one path: message line per field, as the file spells the paths', () => {
    const outcome = traceExample({}, { ...exampleDesign, slits: { ...exampleDesign.slits, heightMm: 0 } });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.message).toMatch(/^slits\.heightMm: /);
  });

  it.each([
    { flags: { rays: 50 }, message: `--rays: must be at least ${TRACE_LIMITS.minRays}` },
    { flags: { rays: TRACE_LIMITS.maxRays + 1 }, message: `--rays: must be at most ${TRACE_LIMITS.maxRays}` },
    { flags: { rays: 1000.5 }, message: '--rays: must be a whole number of rays' },
    { flags: { at: [500, -1] }, message: '--at value 2 (-1): must be at least 1 nm' },
    { flags: { at: Array.from({ length: TRACE_LIMITS.maxWavelengths + 1 }, (_, i) => 400 + i) }, message: `--at: must list at most ${TRACE_LIMITS.maxWavelengths} wavelengths` },
  ] satisfies readonly { flags: Omit<TraceArgs, 'input'>; message: string }[])('names the flag for $flags', ({ flags, message }) => {
    const outcome = traceExample(flags);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.message.split('\n')[0]).toBe(message);
    expect(outcome.message).toContain(USAGE);
  });

  it('exits 2 with the reason on stderr for a bad command line, an unreadable file or a bad flag value', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    expect(await main(['--nope'])).toBe(2);
    expect(String(stderr.mock.calls[0]?.[0])).toBe(`unknown option --nope\n${USAGE}\n`);
    expect(await main([join(dir, 'missing.json')])).toBe(2);
    expect(String(stderr.mock.calls[1]?.[0])).toMatch(/^cannot read .*missing\.json: ENOENT/);
    expect(await main([file('design.json', exampleDesign), '--rays', '10'])).toBe(2);
    expect(String(stderr.mock.calls[2]?.[0])).toMatch(/^--rays: must be at least 200\n/);
  });

  it('prints the answer on stdout and exits 0, every launched ray accounted for', () => {
    const r = run([file('ct.json', exampleDesign), '--at', '500', '--rays', '1000']);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const answer = traceAnswerSchema.parse(JSON.parse(r.stdout));
    expect(answer.raysPerWavelength).toBe(1000);
    expect(answer.wavelengths.some((w) => w.wavelengthNm === 500)).toBe(true);
    for (const w of answer.wavelengths) expect(w.raysTraced + w.raysVignetted).toBe(1000);
  }, 90_000);
});
