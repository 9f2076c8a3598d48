import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { prismAnswerSchema, selectorAnswerSchema } from '@/shared/selector-answers';
import { selectorInputSchema } from '@/shared/selectors';
import { EXAMPLES, main, parseSelectorsArgs, selectorsInput, USAGE } from '../../scripts/selectors';
import { cliHarness, usageErrorOf } from './cli-harness';

const { dir, file, run } = cliHarness('selectors');


/** The message a command line is refused with, or null when it is accepted. */
const usageError = usageErrorOf(parseSelectorsArgs);

describe('selectors CLI', () => {
  afterEach(() => vi.restoreAllMocks());

  it('prints the answer for a file: fused silica n(587.6 nm) = 1.45846 (Malitson 1965)', () => {
    const input = { kind: 'prism', material: 'fused-silica', apexDeg: 60, baseMm: 50, wavelengthsNm: [587.6] };
    const r = run([file('prism.json', input)]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const answer = prismAnswerSchema.parse(JSON.parse(r.stdout));
    expect(answer.points).toHaveLength(1);
    expect(answer.points[0]!.index).toBeCloseTo(1.45846, 5);
  });

  it.each([
    [['input.json'], null],
    [['-'], null],
    [[], 'missing the input file (or - for stdin)'],
    [['a.json', 'b.json'], 'unexpected argument b.json'],
    [['a.json', '--kind', 'prism'], 'unknown option --kind'],
    [['--help'], ''],
  ] satisfies [string[], string | null][])('reads %j', (argv, message) => {
    expect(usageError(argv)).toBe(message);
  });

  it('documents each kind’s input and output fields, with an example of each that runs', () => {
    const fields = {
      'interference-filter': ['targetNm', 'order', 'spacerIndex', 'mirrorReflectance', 'effectiveIndex', 'tiltsDeg', 'rangeNm', 'spacerThicknessNm', 'peaksNm', 'finesse', 'fwhmNm', 'tilt', 'tiltDeg', 'peakNm'],
      'absorption-stack': ['filters', 'wavelengthsNm', 'thicknessMm', 'points', 'wavelengthNm', 'transmission'],
      prism: ['material', 'sellmeier', 'apexDeg', 'baseMm', 'wavelengthsNm', 'index', 'dnDlambdaPerNm', 'minDeviationDeg', 'angularDispersionDegPerNm', 'resolvingPower'],
    };
    for (const [kind, names] of Object.entries(fields)) {
      // The kind's own block: from its heading to the next blank line before another kind.
      const block = USAGE.slice(USAGE.indexOf(`kind "${kind}"`)).split('\n\n')[0]!;
      for (const name of names) expect(block, `${kind}: ${name}`).toContain(name);
      const example = /e\.g\. (.*)$/m.exec(block)?.[1];
      expect(example, kind).toBeDefined();
      const parsed = selectorInputSchema.parse(JSON.parse(example!));
      expect(parsed.kind).toBe(kind);
      const outcome = selectorsInput(example!, { input: '-' });
      expect(outcome.ok && selectorAnswerSchema.parse(outcome.answer).kind).toBe(kind);
    }
    expect(Object.keys(EXAMPLES).sort()).toEqual(Object.keys(fields).sort());
  });

  it('refuses invalid JSON, naming where it came from', () => {
    const outcome = selectorsInput('{ "kind": ', { input: '-' });
    expect(outcome).toMatchObject({ ok: false, message: expect.stringMatching(/^stdin is not valid JSON: /) });
  });

  it('refuses bad fields with one path: message line each', () => {
    const bad = { ...EXAMPLES['absorption-stack'], filters: [{ ...EXAMPLES['absorption-stack'].filters[0], thicknessMm: 0 }], wavelengthsNm: 'visible' };
    const outcome = selectorsInput(JSON.stringify(bad), { input: 'input.json' });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.message.split('\n').sort()).toEqual(['filters.0.thicknessMm: must be greater than 0', 'wavelengthsNm: must be a list of wavelengths in nm']);
  });

  it('refuses an unknown material, naming material', () => {
    const outcome = selectorsInput(JSON.stringify({ ...EXAMPLES.prism, material: 'unobtainium' }), { input: 'input.json' });
    expect(outcome).toMatchObject({ ok: false, message: expect.stringMatching(/^material: must be one of fused-silica, calcium-fluoride/) });
  });

  it('exits 2 with the reason on stderr for a bad command line, an unreadable file or a bad kind', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    expect(await main(['--nope'])).toBe(2);
    expect(String(stderr.mock.calls[0]?.[0])).toBe(`unknown option --nope\n${USAGE}\n`);
    expect(await main([join(dir, 'missing.json')])).toBe(2);
    expect(String(stderr.mock.calls[1]?.[0])).toMatch(/^cannot read .*missing\.json: ENOENT/);
    expect(await main([file('bad.json', { kind: 'laser' })])).toBe(2);
    expect(String(stderr.mock.calls[2]?.[0])).toBe('kind: must have a kind: one of interference-filter, absorption-stack, prism\n');
    expect(await main(['--help'])).toBe(2);
    expect(String(stderr.mock.calls[3]?.[0])).toBe(`${USAGE}\n`);
  });

  it('prints the answer on stdout and exits 0', async () => {
    const stdout = vi.spyOn(process.stdout, 'write').mockImplementation(() => true);
    expect(await main([file('filter.json', EXAMPLES['interference-filter'])])).toBe(0);
    const answer = selectorAnswerSchema.parse(JSON.parse(String(stdout.mock.calls[0]?.[0])));
    // First order, n = 1.5: t = 500 / (2 · 1.5) = 166.67 nm (Hecht, Optics, §9.6).
    expect(answer.kind === 'interference-filter' && answer.spacerThicknessNm).toBeCloseTo(166.667, 2);
  });
});
