/**
 * Notes-reader benchmark: `parseMarkdown` on pathological notes (the patterns that froze the share
 * page in issue 10) at three sizes. A linear reader roughly doubles its time per doubling of the
 * size, so the 40k/10k ratio stays near 4; a quadratic one shows about 16.
 * Prints figures only; run with `npm run bench:markdown`.
 */

import { parseMarkdown } from '../features/notebooks/markdown';

const SIZES = [10_000, 20_000, 40_000];
// Best of a few runs: the figure that matters is the reader's cost, not a neighbour's GC pause.
const RUNS = 3;

const inputs: (readonly [name: string, make: (n: number) => string])[] = [
  ['"**" × n (unmatched strong)', (n) => '**'.repeat(n)],
  ['"*a" × n (emphasis openers)', (n) => '*a'.repeat(n)],
  ['"*"×n a "*"×n (nested emphasis)', (n) => `${'*'.repeat(n)}a${'*'.repeat(n)}`],
  ['"[" × n (link openers)', (n) => '['.repeat(n)],
  ['"[a](" × n (unclosed links)', (n) => '[a]('.repeat(n)],
  ['"`" × n (one line of backticks)', (n) => '`'.repeat(n)],
  ['">" × n (nested quotes)', (n) => `${'>'.repeat(n)} x`],
  ['"- " × n (nested lists)', (n) => `${'- '.repeat(n)}x`],
];

function bestMs(source: string): number {
  let best = Infinity;
  for (let run = 0; run < RUNS; run++) {
    const start = performance.now();
    parseMarkdown(source);
    best = Math.min(best, performance.now() - start);
  }
  return best;
}

// Warm the parser up so the first row does not pay for compilation.
for (const [, make] of inputs) parseMarkdown(make(500));

const header = ['input', ...SIZES.map((n) => `n=${n / 1000}k ms`), '40k/10k'];
console.log(header.join('\t'));
for (const [name, make] of inputs) {
  const times = SIZES.map((n) => bestMs(make(n)));
  const ratio = times[times.length - 1]! / Math.max(times[0]!, 0.01);
  console.log([name, ...times.map((ms) => ms.toFixed(1)), ratio.toFixed(1)].join('\t'));
}
