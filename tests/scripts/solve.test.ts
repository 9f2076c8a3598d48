import { describe, expect, it } from 'vitest';
import { exampleDesign } from '@/shared/design';
import { parseSolveArgs, solveInput, USAGE, type SolveArgs } from '../../scripts/solve';
import { cliHarness, usageErrorOf } from './cli-harness';

const { file: designFile, run: solve } = cliHarness('solve');

/** The message a command line is refused with, or null when it is accepted. */
const usageError = usageErrorOf(parseSolveArgs);

/** Evaluates the example design (as the CLI reads it from a file) with the given flags. */
function solveExample(flags: Omit<SolveArgs, 'input'>, design: unknown = exampleDesign) {
  return solveInput(JSON.stringify(design), { input: 'design.json', ...flags });
}

describe('solve CLI', () => {
  describe('reading the command line', () => {
    it.each([
      { argv: ['d.json'], args: { input: 'd.json', at: undefined, points: undefined } },
      { argv: ['d.json', '--at', '400, 500,600'], args: { input: 'd.json', at: [400, 500, 600], points: undefined } },
      { argv: ['d.json', '--at=400,500'], args: { input: 'd.json', at: [400, 500], points: undefined } },
      { argv: ['-', '--points', '7'], args: { input: '-', at: undefined, points: 7 } },
      // A negative wavelength is read, then refused by the schema with its reason (below).
      { argv: ['d.json', '--at', '-5'], args: { input: 'd.json', at: [-5], points: undefined } },
      // Decimal notation in its usual spellings, a power of ten included.
      { argv: ['d.json', '--at', '.5,532.,5e2,+6E+2'], args: { input: 'd.json', at: [0.5, 532, 500, 600], points: undefined } },
    ] satisfies readonly { argv: string[]; args: SolveArgs }[])('reads $argv', ({ argv, args }) => {
      expect(parseSolveArgs(argv)).toEqual(args);
    });

    it.each([
      { name: 'an unknown flag', argv: ['d.json', '--wat'], message: 'unknown option --wat' },
      { name: 'an unknown short flag', argv: ['d.json', '-x'], message: 'unknown option -x' },
      { name: 'a non-numeric --at', argv: ['d.json', '--at', '400,abc'], message: '--at: "abc" is not a wavelength in nm (a decimal number)' },
      { name: 'an empty item in --at', argv: ['d.json', '--at', '400,,500'], message: '--at: "" is not a wavelength in nm (a decimal number)' },
      // Number() reads all of these; a lab script that typed them meant something else.
      { name: 'a hexadecimal --at', argv: ['d.json', '--at', '0x1F4'], message: '--at: "0x1F4" is not a wavelength in nm (a decimal number)' },
      { name: 'a binary --at', argv: ['d.json', '--at', '0b1'], message: '--at: "0b1" is not a wavelength in nm (a decimal number)' },
      { name: 'an octal --at', argv: ['d.json', '--at', '500,0o7'], message: '--at: "0o7" is not a wavelength in nm (a decimal number)' },
      { name: 'an exponent without digits', argv: ['d.json', '--at', '1e'], message: '--at: "1e" is not a wavelength in nm (a decimal number)' },
      { name: 'Infinity in --at', argv: ['d.json', '--at', 'Infinity'], message: '--at: "Infinity" is not a wavelength in nm (a decimal number)' },
      { name: 'a blank item in --at', argv: ['d.json', '--at', '400, ,500'], message: '--at: " " is not a wavelength in nm (a decimal number)' },
      { name: 'a finite-looking overflow in --at', argv: ['d.json', '--at', '1e999'], message: '--at: "1e999" is not a wavelength in nm (a decimal number)' },
      { name: 'a non-numeric --points', argv: ['d.json', '--points', 'many'], message: '--points: "many" is not a decimal number' },
      { name: 'a hexadecimal --points', argv: ['d.json', '--points', '0x10'], message: '--points: "0x10" is not a decimal number' },
      { name: 'an infinite --points', argv: ['d.json', '--points', '-Infinity'], message: '--points: "-Infinity" is not a decimal number' },
      { name: 'a missing value', argv: ['d.json', '--points'], message: '--points needs a value' },
      { name: 'an empty inline value', argv: ['d.json', '--at='], message: '--at needs a value' },
      { name: 'both --at and --points', argv: ['d.json', '--at', '500', '--points', '3'], message: 'use either --at or --points, not both' },
      { name: 'a second design', argv: ['a.json', 'b.json'], message: 'unexpected argument b.json' },
      { name: 'no design', argv: [], message: 'missing the design file (or - for stdin)' },
      { name: '--points with no design', argv: ['--points', '3'], message: 'missing the design file (or - for stdin)' },
      { name: '--help', argv: ['--help'], message: '' },
      { name: '-h', argv: ['d.json', '-h'], message: '' },
    ] satisfies readonly { name: string; argv: string[]; message: string }[])(
      'refuses $name, naming the flag',
      ({ argv, message }) => {
        expect(usageError(argv)).toBe(message);
      },
    );
  });

  it('states the limits in its help', () => {
    expect(USAGE).toMatch(/^usage: npm run --silent solve/);
    expect(USAGE).toMatch(/--at +wavelengths in nm as decimal numbers .*, at most 1000/);
    expect(USAGE).toMatch(/2 to 1000/);
    expect(USAGE).toMatch(/at most 20 overlapping orders/);
    expect(USAGE).toMatch(/overlapsTruncated/);
    expect(USAGE).toMatch(/120 calls per 60 s/);
  });

  it('states what the resolving power, the efficiency and the sampling assume', () => {
    expect(USAGE).toMatch(/resolvingPower +λ \/ √\(bandpassNm² \+ diffractionLimitNm²\)/);
    expect(USAGE).toMatch(/blazeEfficiency +the scalar \(Kirchhoff\) blaze function/);
    expect(USAGE).toMatch(/Schroeder & Hilliard 1980/);
    expect(USAGE).toMatch(/λ\/d below\s+about 0\.2/);
    expect(USAGE).toMatch(/pixelsPerResolutionElement +pixels across the entrance-slit image/);
  });

  describe('checking and evaluating a design', () => {
    it('evaluates a valid design at the requested wavelengths', () => {
      const r = solveExample({ at: [400, 500, 600] });
      if (!r.ok) throw new Error(r.message);
      expect(r.evaluation.points.map((p) => p.wavelengthNm)).toEqual([400, 500, 600]);
      expect(r.evaluation.points.every((p) => p.reachable)).toBe(true);
      expect(r.evaluation.design.kind).toBe('czerny-turner');
    });

    it('honours --points over the design range', () => {
      const r = solveExample({ points: 7 });
      if (!r.ok) throw new Error(r.message);
      expect(r.evaluation.points).toHaveLength(7);
      expect(r.evaluation.points[0]!.wavelengthNm).toBe(300);
      expect(r.evaluation.points[6]!.wavelengthNm).toBe(900);
    });

    it('reports unreachable wavelengths with a reason and nulls, never NaN', () => {
      // 2000 nm needs sin φ > 1 with 1200 g/mm in first order (2d cos K = 1610 nm).
      const r = solveExample({ at: [2000] });
      if (!r.ok) throw new Error(r.message);
      const json = JSON.stringify(r.evaluation);
      expect(json).not.toMatch(/NaN|Infinity/);
      const out = JSON.parse(json);
      expect(out.points[0]).toMatchObject({ reachable: false, incidenceDeg: null, bandpassNm: null });
      expect(out.points[0].reason).toMatch(/beyond the grating equation/);
      expect(out.warnings.map((w: { code: string }) => w.code)).toContain('unreachable');
    });

    it('names each bad field of a design the schema refuses', () => {
      const bad = structuredClone(exampleDesign) as Record<string, any>;
      bad.grating.grooveDensityPerMm = 0;
      bad.grating.order = 1.5;
      const r = solveExample({}, bad);
      expect(r.ok).toBe(false);
      if (r.ok) return;
      expect(r.message).toContain('grating.grooveDensityPerMm: must be greater than 0');
      expect(r.message).toContain('grating.order: must be a whole number other than 0');
    });

    it('refuses text that is not JSON, naming where it came from', () => {
      expect(solveInput('{ "grating": ', { input: '-' })).toMatchObject({ ok: false, message: expect.stringMatching(/^stdin is not valid JSON/) });
    });

    it.each([
      { name: 'a negative --at', flags: { at: [-5] }, line: '--at value 1 (-5): must be greater than 0' },
      { name: '--points below 2', flags: { points: 1 }, line: '--points: must be a whole number from 2 to 1000' },
      { name: 'more than 1000 points', flags: { points: 1001 }, line: '--points: must be a whole number from 2 to 1000' },
      {
        name: 'more than 1000 wavelengths',
        flags: { at: Array.from({ length: 1001 }, (_, i) => 300 + i * 0.5) },
        line: '--at: must list at most 1000 wavelengths',
      },
    ] satisfies readonly { name: string; flags: Omit<SolveArgs, 'input'>; line: string }[])(
      'keeps the API limits: $name is refused naming the flag, with the usage',
      ({ flags, line }) => {
        const r = solveExample(flags);
        expect(r).toEqual({ ok: false, message: `${line}\n${USAGE}` });
      },
    );

    it('takes 1000 points, the API limit', () => {
      const r = solveExample({ points: 1000 });
      if (!r.ok) throw new Error(r.message);
      expect(r.evaluation.points).toHaveLength(1000);
    });
  });

  describe('as a process', { timeout: 30_000 }, () => {
    it('prints the evaluation JSON on stdout and exits 0 for a valid design read from stdin', () => {
      const r = solve(['-', '--at', '400,500,600'], JSON.stringify(exampleDesign));
      expect(r.code).toBe(0);
      const out = JSON.parse(r.stdout);
      expect(out.points.map((p: { wavelengthNm: number }) => p.wavelengthNm)).toEqual([400, 500, 600]);
      expect(Array.isArray(out.warnings)).toBe(true);
    });

    it('prints one path: reason line per bad field on stderr and exits 2 for a bad design file', () => {
      const bad = structuredClone(exampleDesign) as Record<string, any>;
      bad.grating.grooveDensityPerMm = 0;
      bad.grating.order = 1.5;
      const r = solve([designFile('bad.json', bad)]);
      expect(r.code).toBe(2);
      expect(r.stdout).toBe('');
      expect(r.stderr.trim().split('\n')).toEqual(
        expect.arrayContaining([
          'grating.grooveDensityPerMm: must be greater than 0',
          'grating.order: must be a whole number other than 0',
        ]),
      );
    });
  });
});
