import { spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { exampleDesign } from '@/shared/design';

const TSX = join(process.cwd(), 'node_modules/.bin/tsx');
const SCRIPT = join(process.cwd(), 'scripts/solve.ts');
const dir = mkdtempSync(join(tmpdir(), 'blazebook-solve-'));

function solve(args: string[], stdin?: string) {
  const r = spawnSync(TSX, [SCRIPT, ...args], {
    input: stdin,
    encoding: 'utf8',
    timeout: 30_000,
    maxBuffer: 64 * 1024 * 1024,
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

function designFile(name: string, content: unknown): string {
  const path = join(dir, name);
  writeFileSync(path, typeof content === 'string' ? content : JSON.stringify(content));
  return path;
}

describe('solve CLI', { timeout: 30_000 }, () => {
  it('prints the evaluation JSON for a valid design at the requested wavelengths', () => {
    const r = solve([designFile('ok.json', exampleDesign), '--at', '400,500,600']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.points.map((p: { wavelengthNm: number }) => p.wavelengthNm)).toEqual([400, 500, 600]);
    expect(out.points.every((p: { reachable: boolean }) => p.reachable)).toBe(true);
    expect(out.design.kind).toBe('czerny-turner');
    expect(Array.isArray(out.warnings)).toBe(true);
  });

  it('reads the design from stdin with - and honours --points', () => {
    const r = solve(['-', '--points', '7'], JSON.stringify(exampleDesign));
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.points).toHaveLength(7);
    expect(out.points[0].wavelengthNm).toBe(300);
    expect(out.points[6].wavelengthNm).toBe(900);
  });

  it('reports unreachable wavelengths in the JSON with a reason and nulls, exit 0', () => {
    // 2000 nm needs sin φ > 1 with 1200 g/mm in first order (2d cos K = 1610 nm).
    const r = solve([designFile('ok2.json', exampleDesign), '--at', '2000']);
    expect(r.code).toBe(0);
    expect(r.stdout).not.toMatch(/NaN|Infinity/);
    const out = JSON.parse(r.stdout);
    expect(out.points[0]).toMatchObject({ reachable: false, incidenceDeg: null, bandpassNm: null });
    expect(out.points[0].reason).toMatch(/beyond the grating equation/);
    expect(out.warnings.map((w: { code: string }) => w.code)).toContain('unreachable');
  });

  it('names each bad field on stderr and exits 2 for a schema failure', () => {
    const bad = structuredClone(exampleDesign) as Record<string, any>;
    bad.grating.grooveDensityPerMm = 0;
    bad.grating.order = 1.5;
    const r = solve([designFile('bad.json', bad)]);
    expect(r.code).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain('grating.grooveDensityPerMm: must be greater than 0');
    expect(r.stderr).toContain('grating.order: must be a whole number other than 0');
  });

  it('exits 2 for invalid JSON', () => {
    const r = solve(['-'], '{ "grating": ');
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/not valid JSON/);
  });

  it.each([
    { name: 'an unknown flag', args: ['--wat'] },
    { name: 'a non-numeric --at', args: ['--at', '400,abc'] },
    { name: 'a negative --at', args: ['--at', '-5'] },
    { name: '--points below 2', args: ['--points', '1'] },
    { name: 'a missing value', args: ['--points'] },
  ] satisfies readonly { name: string; args: string[] }[])('exits 2 with the usage for $name', ({ args }) => {
    const r = solve([designFile('flags.json', exampleDesign), ...args]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/usage: npm run --silent solve/);
  });

  it('keeps the API limits: more than 1000 wavelengths or points exits 2 naming the flag', () => {
    const file = designFile('limits.json', exampleDesign);
    const at = Array.from({ length: 1001 }, (_, i) => 300 + i * 0.5).join(',');
    const tooMany = solve([file, '--at', at]);
    expect(tooMany.code).toBe(2);
    expect(tooMany.stderr).toContain('--at: must list at most 1000 wavelengths');
    const tooFine = solve([file, '--points', '1001']);
    expect(tooFine.code).toBe(2);
    expect(tooFine.stderr).toContain('--points: must be a whole number from 2 to 1000');
    const atCap = solve([file, '--points', '1000']);
    expect(atCap.code).toBe(0);
    expect(JSON.parse(atCap.stdout).points).toHaveLength(1000);
  });

  it('states the limits in its help', () => {
    const r = solve(['--help']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/--at +wavelengths in nm, at most 1000/);
    expect(r.stderr).toMatch(/2 to 1000/);
    expect(r.stderr).toMatch(/at most 20 overlapping orders/);
    expect(r.stderr).toMatch(/overlapsTruncated/);
    expect(r.stderr).toMatch(/120 calls per 60 s/);
  });

  it('exits 2 with the usage when no design is given', () => {
    const r = solve([]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/missing the design file/);
  });
});
