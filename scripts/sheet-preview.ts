/**
 * Writes the sample design sheet and compare sheet (demo data, no database) to a folder and
 * renders their pages to PNG with poppler's pdftoppm, to look at while working on a section:
 *   npx tsx scripts/sheet-preview.ts [out-dir] [a4|letter]
 */
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { buildCompareSheet, buildSheet } from '../server/sheets/build';
import { sampleCompareSheet, sampleSheet } from '../tests/server/sheets/sample';

const outDir = path.resolve(process.argv[2] ?? '/tmp/sheet-preview');
const paper = process.argv[3] === 'letter' ? 'letter' : 'a4';
mkdirSync(outDir, { recursive: true });

const started = performance.now();
const sheet = await buildSheet({ ...sampleSheet(), paper });
const middle = performance.now();
const compare = await buildCompareSheet({ ...sampleCompareSheet(), paper });
const done = performance.now();

for (const [name, bytes] of [
  ['sheet', sheet],
  ['compare', compare],
] as const) {
  const file = path.join(outDir, `${name}.pdf`);
  writeFileSync(file, bytes);
  execFileSync('pdftoppm', ['-r', '60', '-png', file, path.join(outDir, name)]);
}
console.log(
  `sheet ${(sheet.length / 1024).toFixed(0)} KB in ${(middle - started).toFixed(0)} ms, ` +
    `compare ${(compare.length / 1024).toFixed(0)} KB in ${(done - middle).toFixed(0)} ms → ${outDir}`,
);
