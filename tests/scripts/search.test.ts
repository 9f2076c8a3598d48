import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { checkRequirements } from '@/features/requirements';
import { designSchema } from '@/shared/design';
import { searchAnswerSchema } from '@/shared/search';
import { solveInput } from '../../scripts/solve';
import { main, parseSearchArgs, searchInput, USAGE } from '../../scripts/search';
import { cliHarness, usageErrorOf } from './cli-harness';

const { dir, file, run } = cliHarness('search');

const input = {
  range: { startNm: 400, endNm: 700 },
  source: { minNm: 380, maxNm: 780 },
  requirements: { maxBandpassNm: 0.5, minBlazeEfficiency: 0.3 },
  search: { grooveDensitiesPerMm: [600, 1200], blazeWavelengthsNm: [500], maxOrder: 1, deviationAnglesDeg: [20], focalLengthsMm: [300], top: 2 },
};


/** The message a command line is refused with, or null when it is accepted. */
const usageError = usageErrorOf(parseSearchArgs);

describe('search CLI', () => {
  afterEach(() => vi.restoreAllMocks());

  it('prints the answer for a file, and its design solves with the solve command unchanged', () => {
    const r = run([file('input.json', input)]);
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    const answer = searchAnswerSchema.parse(JSON.parse(r.stdout));
    expect(answer.candidates.length).toBeGreaterThan(0);
    const design = answer.candidates[0]!.design;
    expect(checkRequirements(designSchema.parse(design)).failed).toBe(0);
    // The solve command's own reading of its input, in process (one spawn per test file is enough).
    const solved = solveInput(JSON.stringify(design), { input: '-', points: 3 });
    expect(solved.ok && solved.evaluation.points).toHaveLength(3);
  });

  it.each([
    [['input.json'], null],
    [['-'], null],
    [[], 'missing the input file (or - for stdin)'],
    [['a.json', 'b.json'], 'unexpected argument b.json'],
    [['a.json', '--top', '3'], 'unknown option --top'],
    [['--help'], ''],
  ] satisfies [string[], string | null][])('reads %j', (argv, message) => {
    expect(usageError(argv)).toBe(message);
  });

  it('refuses invalid JSON, naming where it came from', () => {
    const outcome = searchInput('{ "range": ', { input: '-' });
    expect(outcome).toMatchObject({ ok: false, message: expect.stringMatching(/^stdin is not valid JSON: /) });
  });

  it('refuses bad fields with one path: message line each', () => {
    const outcome = searchInput(JSON.stringify({ ...input, range: { startNm: 700, endNm: 400 }, requirements: { maxBandpassNm: 'half' } }), {
      input: 'input.json',
    });
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.message.split('\n').sort()).toEqual([
      'range.endNm: must be greater than range.startNm',
      'requirements.maxBandpassNm: must be a number',
    ]);
  });

  it('refuses a search over the candidate cap, naming search', () => {
    const forty = Array.from({ length: 40 }, (_, i) => 100 + i * 10);
    const outcome = searchInput(JSON.stringify({ ...input, search: { focalLengthsMm: forty, deviationAnglesDeg: forty.map((f) => f / 10) } }), {
      input: 'input.json',
    });
    expect(outcome).toMatchObject({ ok: false, message: expect.stringMatching(/^search: would evaluate 768000 candidates/) });
  });

  it('exits 2 with the reason on stderr for a bad command line or an unreadable file', async () => {
    const stderr = vi.spyOn(process.stderr, 'write').mockImplementation(() => true);
    expect(await main(['--nope'])).toBe(2);
    expect(String(stderr.mock.calls[0]?.[0])).toBe(`unknown option --nope\n${USAGE}\n`);
    expect(await main([join(dir, 'missing.json')])).toBe(2);
    expect(String(stderr.mock.calls[1]?.[0])).toMatch(/^cannot read .*missing\.json: ENOENT/);
    expect(await main([file('bad.json', { range: input.range })])).toBe(2);
    expect(String(stderr.mock.calls[2]?.[0])).toBe('requirements: is required\n');
  });
});
