import { describe, expect, it } from 'vitest';
import {
  blockingFilterNumbers,
  coverageSentences,
  ghostSentence,
  linesInRangeSentence,
  orderWords,
  pairSentence,
  placementCell,
  resolvedPairsSentence,
} from '../../../features/calibration/calibration-words';
import { calibrationLineList, calibrationReport, type LinePair } from '../../../features/solver/calibration-lines';
import { exampleDesign, type Design } from '../../../shared/design';
import type { OrderSortingFilter } from '../../../shared/filters';

/** Spaces as typed: the formatter joins values and units with no-break spaces. */
const plain = (text: string) => text.replace(/[\u00A0\u202F]/g, ' ');

const naPair = (bandpassNm: number): LinePair => {
  const [d2, d1] = calibrationLineList(['Na']).filter((l) => l.wavelengthNm > 588 && l.wavelengthNm < 590);
  // Na D2 588.9950, D1 589.5924 nm (NIST ASD): 0.5974 nm apart.
  const separationNm = 589.5924 - 588.995;
  return { shorter: d2!, longer: d1!, separationNm, bandpassNm, resolved: separationNm >= bandpassNm };
};

const longPass = (over: Partial<OrderSortingFilter>): OrderSortingFilter => ({
  kind: 'long-pass',
  cutOnNm: 350,
  inFromNm: 400,
  inToNm: 900,
  edgeWidthNm: 10,
  ...over,
});

describe('the calibration card’s words', () => {
  it('counts the lines in the range', () => {
    expect(plain(linesInRangeSentence(48, 300, 900))).toBe('48 lines fall in 300–900 nm');
    expect(plain(linesInRangeSentence(1, 300, 900))).toBe('1 line falls in 300–900 nm');
  });

  it('names an unresolved pair with its separation and the bandpass', () => {
    expect(plain(pairSentence(naPair(0.83)))).toBe('Na 588.995 / 589.5924 nm: 0.597 nm apart, bandpass 0.83 nm — not resolved');
    expect(plain(pairSentence(naPair(0.5)))).toMatch(/— resolved$/);
    expect(resolvedPairsSentence(47, 1)).toBe('46 of 47 neighbouring pairs are resolved.');
    expect(resolvedPairsSentence(0, 0)).toMatch(/no neighbouring pairs/);
  });

  it('writes orders as words', () => {
    expect(['1', '2', '3', '4', '11', '12', '21'].map((n) => orderWords(Number(n)))).toEqual([
      '1st order',
      '2nd order',
      '3rd order',
      '4th order',
      '11th order',
      '12th order',
      '21st order',
    ]);
    expect(orderWords(-2)).toBe('order −2');
  });

  it('says a second-order mercury line is not blocked without filters and names the filter that blocks it', () => {
    // Grating equation mλ = d(sin α + sin β) (Palmer & Loewen ch. 2): 2 × 253.652 = 507.304 nm.
    const bare = calibrationReport(exampleDesign, calibrationLineList(['Hg']));
    const ghost = bare.ghosts.find((g) => g.line.wavelengthNm === 253.652 && g.order === 2)!;
    expect(plain(ghostSentence(ghost, []))).toBe('Hg 253.652 nm in 2nd order appears at 507.304 nm — not blocked');

    // A 350 nm long-pass, 10 nm edge, in the beam from 400 nm: its foot at 345 nm is above 253.652.
    const filtered: Design = { ...exampleDesign, filters: [longPass({ inFromNm: 300, inToNm: 400, cutOnNm: 250 }), longPass({})] };
    const report = calibrationReport(filtered, calibrationLineList(['Hg']));
    const blocked = report.ghosts.find((g) => g.line.wavelengthNm === 253.652 && g.order === 2)!;
    expect(plain(ghostSentence(blocked, filtered.filters!))).toBe(
      'Hg 253.652 nm in 2nd order appears at 507.304 nm — blocked by filter 2',
    );
    expect(blockingFilterNumbers(filtered.filters!, 507.304, 253.652)).toEqual([2]);
    expect(blockingFilterNumbers(filtered.filters!, 507.304, 400)).toEqual([]);
  });

  it('places a line on or off the detector in a table cell', () => {
    expect(placementCell({ placement: 'on-detector', pixel: 177.744, positionMm: -8.3 }, 1024)).toBe('177.7');
    expect(placementCell({ placement: 'short-of-detector', pixel: -269, positionMm: -19.5 }, 1024)).toBe('before pixel 0');
    expect(placementCell({ placement: 'past-detector', pixel: 1069, positionMm: 14 }, 1024)).toBe('past pixel 1023');
    expect(placementCell(null, null)).toBe('—');
  });

  it('gives the coverage: lines on the detector, their span and the cubic’s residual', () => {
    // The example design (1200 g/mm, 30° deviation, f = 300 mm, 1024 × 25 µm, grating at 600 nm).
    // By hand: α = 36.882°, β_c = 6.882°; Hg 576.9598 nm → β = 5.289°, x = 300 tan(−1.593°) =
    // −8.344 mm → pixel −8.344/0.025 + 511.5 = 177.7; Ne 633.4428 nm → β = 9.205°, x = 12.167 mm →
    // pixel 998.2 (Palmer & Loewen ch. 2 grating equation; x = f tan(β − β_c)).
    const report = calibrationReport(exampleDesign, calibrationLineList(['Hg', 'Ne']));
    const [first, ...rest] = coverageSentences(report.coverage!).map(plain);
    expect(first).toMatch(/^\d+ lines land on the detector, from pixel 177\.7 to 998\.2: a span of 820 pixels, 80 % of its 1,?024\.$/);
    expect(rest.join(' ')).toMatch(/off by at most .* nm \(RMS .* nm\): .* of a pixel\./);
    expect(rest.join(' ')).toMatch(/Under a tenth of a pixel/);
  });

  it('says a cubic needs four lines when fewer land', () => {
    const two = calibrationReport(exampleDesign, calibrationLineList([], [{ wavelengthNm: 580 }, { wavelengthNm: 600 }]));
    const words = coverageSentences(two.coverage!).map(plain).join(' ');
    expect(words).toMatch(/^2 lines land on the detector/);
    expect(words).toMatch(/a cubic calibration needs at least 4/);
  });
});
