import { describe, expect, it } from 'vitest';
import { designCalibrationLines } from '../../../features/calibration/design-lines';
import { detectorStrip, offDetectorSentence, placeStripLabels, stripSummary } from '../../../features/calibration/detector-strip';
import { calibrationReport } from '../../../features/solver/calibration-lines';
import { exampleDesign } from '../../../shared/design';

const plain = (text: string) => text.replace(/[\u00A0\u202F]/g, ' ');

describe('the detector strip', () => {
  const lines = designCalibrationLines(exampleDesign, ['Hg', 'Ne']);
  const strip = detectorStrip(exampleDesign, lines)!;

  it('ticks every line that lands on the detector at its pixel, in pixel order', () => {
    // Hand computation as in calibration-words.test.ts: Hg 576.9598 nm at pixel 177.7 and Ne
    // 633.4428 nm at 998.2 on the example design's 1024-pixel detector (grating equation, Palmer
    // & Loewen ch. 2); the detector spans about 565–635 nm (RLD 2.76 nm/mm × 25.6 mm).
    expect(strip.pixelCount).toBe(1024);
    expect(strip.ticks[0]!.line.wavelengthNm).toBe(576.9598);
    expect(strip.ticks[0]!.pixel).toBeCloseTo(177.74, 1);
    expect(strip.ticks.at(-1)!.line.wavelengthNm).toBe(633.4428);
    expect(strip.ticks.at(-1)!.pixel).toBeCloseTo(998.16, 1);
    expect(strip.ticks.every((t) => t.pixel >= -0.5 && t.pixel <= 1023.5)).toBe(true);
    // The same count the coverage states.
    expect(strip.ticks.length).toBe(calibrationReport(exampleDesign, lines).coverage!.linesOnDetector);
  });

  it('lists the lines in range that miss it, on each side', () => {
    // Hg 546.0735 nm lands 19.5 mm short of the centre (by hand: β = 3.160°), past the 12.8 mm half-width.
    expect(strip.shortOf.map((l) => l.wavelengthNm)).toContain(546.0735);
    expect(strip.pastEnd.map((l) => l.wavelengthNm)).toContain(638.2992);
    expect(plain(offDetectorSentence(strip)!)).toMatch(/^Off the detector: \d+ lines before pixel 0 \(302\.15–546\.0735 nm\); \d+ lines past pixel 1,?023 \(638\.2992–885\.3867 nm\)\.$/);
  });

  it('says in words how many lines land and where', () => {
    const summary = plain(stripSummary(strip));
    // Pixel 0's centre is 511.5 × 25 µm = 12.7875 mm short of the centre: β = β_c − atan(12.7875/300),
    // λ = d(sin α + sin β) = 564.68 nm by hand; the last pixel 635.14 nm (Palmer & Loewen ch. 2).
    expect(strip.firstPixelNm).toBeCloseTo(564.68, 1);
    expect(strip.lastPixelNm).toBeCloseTo(635.14, 1);
    expect(summary).toMatch(
      new RegExp(`^Detector strip, pixels 0 to 1,?023 \\(564\\.68–635\\.14 nm\\): ${strip.ticks.length} lamp lines \\(Hg, Ne\\) land on it`),
    );
    expect(summary).toMatch(/from Hg 576\.9598 nm at pixel 177\.7 to Ne 633\.4428 nm at pixel 998\.2\./);
  });

  it('has nothing to draw without a detector', () => {
    const { detector: _gone, ...bare } = exampleDesign;
    expect(detectorStrip(bare, lines)).toBeNull();
  });
});

describe('labels on the strip', () => {
  it('stack into free rows and are dropped when no row is free', () => {
    // 10 px labels centred at 10, 12, 14 and 100 px, 2 rows, 3 px gap: the first takes row 0
    // (5–15), the second row 1 (7–17), the third fits neither, the fourth row 0 again.
    expect(placeStripLabels([10, 12, 14, 100], [10, 10, 10, 10], 200, 2).map((p) => p.row)).toEqual([0, 1, null, 0]);
  });

  it('stay inside the strip at its ends', () => {
    const [left, right] = placeStripLabels([0, 200], [12, 12], 200, 1);
    expect(left!.leftPx).toBe(0);
    expect(right!.leftPx).toBe(188);
  });
});
