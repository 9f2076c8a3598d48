import { describe, expect, it } from 'vitest';
import { evaluateDesign } from '@/features/solver';
import {
  CUBIC_MIN_LINES,
  MAX_LISTED_CALIBRATION_ITEMS,
  calibrationLineList,
  calibrationReport,
  detectorFrame,
  detectorLanding,
  isPairResolved,
  type CalibrationLine,
  type CalibrationReport,
} from '@/features/solver/calibration-lines';
import { wavelengthAtDetectorNm } from '@/features/solver/detector';
import { designSchema, exampleDesign, type Design } from '@/shared/design';
import type { OrderSortingFilter } from '@/shared/filters';
import { expectClose } from './close-to';
import { makeDesign } from './fixtures';

/** Every number anywhere in the report is finite (the solver never hands a NaN to a plot). */
function expectAllFinite(value: unknown, path = 'report'): void {
  if (typeof value === 'number') {
    expect(Number.isFinite(value), `${path} = ${value}`).toBe(true);
  } else if (Array.isArray(value)) {
    value.forEach((v, i) => expectAllFinite(v, `${path}[${i}]`));
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) expectAllFinite(v, `${path}.${k}`);
  }
}

const userLines = (...nms: number[]) => calibrationLineList([], nms.map((wavelengthNm) => ({ wavelengthNm })));
const pairAt = (report: CalibrationReport, shorterNm: number) =>
  report.pairs.find((p) => p.shorter.wavelengthNm === shorterNm);

/**
 * The example design (1200 g/mm, K = 15°, f = 300 mm) set for 550–650 nm, a 10 µm entrance slit
 * (its image, ≈ 8 µm, is narrower than the exit slit) and an exit slit chosen for the bandpass.
 */
const narrowEntrance = (exitWidthUm: number): Design =>
  makeDesign({ range: { startNm: 550, endNm: 650 }, slits: { entranceWidthUm: 10, exitWidthUm } });

describe('which pairs a design resolves (separation ≥ bandpass, FWHM criterion, common practice)', () => {
  it('compares separation and bandpass', () => {
    expect(isPairResolved(0.5974, 0.5)).toBe(true);
    expect(isPairResolved(0.5974, 0.7)).toBe(false);
    expect(isPairResolved(0.5, 0.5)).toBe(true); // at the limit counts as resolved
  });

  // Exit slits by hand (Palmer & Loewen, ch. 2 and 9): at the pair's mid-point λ, sin φ =
  // λ/(2d cos 15°), β = φ − 15°, RLD = d cos β / f; w = bandpass / RLD.
  //   Na D mid 589.2937 nm: RLD = 2.760074 nm/mm → 0.5 nm needs 181.15 µm, 0.7 nm 253.62 µm.
  //   Hg yellow mid 578.0131 nm: RLD = 2.762350 nm/mm → 1.5 nm needs 543.02 µm, 2.5 nm 905.03 µm.
  it.each([
    // Na D2/D1, 588.9950 / 589.5924 nm (NIST ASD, from memory): 0.5974 nm apart.
    { pair: 'Na D', shorterNm: 588.995, longerNm: 589.5924, exitUm: 181.15, bandpass: 0.5, resolved: true },
    { pair: 'Na D', shorterNm: 588.995, longerNm: 589.5924, exitUm: 253.62, bandpass: 0.7, resolved: false },
    // Hg yellow pair, 576.9598 / 579.0663 nm (NIST ASD, from memory): 2.1065 nm apart.
    { pair: 'Hg yellow', shorterNm: 576.9598, longerNm: 579.0663, exitUm: 543.02, bandpass: 1.5, resolved: true },
    { pair: 'Hg yellow', shorterNm: 576.9598, longerNm: 579.0663, exitUm: 905.03, bandpass: 2.5, resolved: false },
  ] satisfies { pair: string; shorterNm: number; longerNm: number; exitUm: number; bandpass: number; resolved: boolean }[])(
    '$pair at $bandpass nm bandpass: resolved $resolved',
    ({ shorterNm, longerNm, exitUm, bandpass, resolved }) => {
      const design = narrowEntrance(exitUm);
      const report = calibrationReport(design, calibrationLineList(shorterNm < 580 ? ['Hg'] : ['Na']));
      const pair = pairAt(report, shorterNm)!;
      expect(pair.longer.wavelengthNm).toBe(longerNm);
      expectClose(pair.separationNm, longerNm - shorterNm, 1e-12);
      expectClose(pair.bandpassNm, bandpass, 1e-4); // the solver's bandpass is the one intended
      expect(pair.resolved).toBe(resolved);
    },
  );

  it('pairs neighbours of any element in wavelength order and counts the unresolved ones', () => {
    const report = calibrationReport(narrowEntrance(253.62), calibrationLineList(['Hg', 'Na', 'Ne', 'Kr']));
    // In 550–650 nm: …576.9598 Hg, 579.0663 Hg, 585.2488 Ne, 587.0915 Kr, 588.1895 Ne, 588.995 Na…
    const kr = pairAt(report, 585.2488)!;
    expect(kr.longer.element).toBe('Kr');
    expect(report.pairCount).toBe(report.linesInRangeCount - 1);
    expect(report.unresolvedPairCount).toBe(report.pairs.filter((p) => p.resolved === false).length);
    expect(report.unresolvedPairCount).toBeGreaterThanOrEqual(1); // Na D at 0.7 nm
  });
});

describe('lines in the range', () => {
  const report = calibrationReport(exampleDesign, calibrationLineList(['Hg']));

  it('lists the lines inside the range with the bandpass there', () => {
    // Example range 300–900 nm: Hg from 302.15 on; 253.652 and 296.728 are outside.
    const nms = report.linesInRange.map((l) => l.line.wavelengthNm);
    expect(nms[0]).toBe(302.15);
    expect(nms).not.toContain(253.652);
    expect(report.linesInRangeCount).toBe(nms.length);
    const green = report.linesInRange.find((l) => l.line.wavelengthNm === 546.0735)!;
    const solver = evaluateDesign(exampleDesign, { wavelengthsNm: [546.0735] }).points[0]!;
    expect(green.reachable).toBe(true);
    expectClose(green.bandpassNm, solver.bandpassNm!, 1e-12);
  });

  it('says where each lands on the detector, and when it misses it', () => {
    // Example detector: 1024 × 25 µm at the 600 nm centre covers about 568–634 nm.
    const green = report.linesInRange.find((l) => l.line.wavelengthNm === 546.0735)!;
    expect(green.detector?.placement).toBe('short-of-detector');
    const yellow = report.linesInRange.find((l) => l.line.wavelengthNm === 576.9598)!;
    expect(yellow.detector?.placement).toBe('on-detector');
    const far = calibrationReport(exampleDesign, userLines(850)).linesInRange[0]!;
    expect(far.detector?.placement).toBe('past-detector');
  });

  it('puts Na D2 on pixel 351.99 of the example design (hand computation)', () => {
    // Palmer & Loewen, ch. 2, at fixed incidence, by hand (bc): centre 600 nm → φ = 21.882194°,
    // α = 36.882194°, β_c = 6.882194°; 588.995 nm → β = 6.120643°; x = 300 tan(β − β_c) =
    // −3.987707 mm; pixel = x / 0.025 + (1024 − 1)/2 = 351.9917. D1 589.5924 nm → 360.6454.
    const report = calibrationReport(exampleDesign, calibrationLineList(['Na']));
    const pixelOf = (nm: number) => report.linesInRange.find((l) => l.line.wavelengthNm === nm)!.detector!.pixel;
    expectClose(pixelOf(588.995), 351.9917, 0, 1e-4);
    expectClose(pixelOf(589.5924), 360.6454, 0, 1e-4);
  });

  it('inverts the detector’s own pixel → wavelength mapping, in either order sign', () => {
    for (const order of [1, -1]) {
      const design = makeDesign({ grating: { order } });
      const frame = detectorFrame(design)!;
      // Order −1 swaps α and β in this mount's convention (grating.ts), so it covers 571–628 nm.
      for (const nm of [575, 600, 625]) {
        const landing = detectorLanding(frame, nm);
        expect(landing.placement).toBe('on-detector');
        expectClose(wavelengthAtDetectorNm(frame.geometry, landing.positionMm!), nm, 1e-12);
      }
      expectClose(detectorLanding(frame, 600).pixel, 511.5, 0, 1e-9); // the centre, by construction
    }
  });

  it('says a line beyond the grating equation misses the camera', () => {
    // 1200 g/mm, K = 15°: |mλ| ≤ 2d cos²K = 1555 nm (Palmer & Loewen, ch. 2); 1700 nm cannot pass.
    const report = calibrationReport(makeDesign({ range: { startNm: 300, endNm: 1700 } }), userLines(1700));
    const line = report.linesInRange[0]!;
    expect(line.reachable).toBe(false);
    expect(line.reason).toMatch(/grating equation/);
    expect(line.bandpassNm).toBeNull();
    expect(line.detector).toEqual({ placement: 'misses-camera', pixel: null, positionMm: null });
  });

  it('has no detector answers without a detector', () => {
    const noDetector = calibrationReport(makeDesign({ detector: undefined }), calibrationLineList(['Hg']));
    expect(noDetector.linesInRange.every((l) => l.detector === null)).toBe(true);
    expect(noDetector.coverage).toBeNull();
  });
});

describe('ghosts: source lines reaching the range through another order', () => {
  // First order, 450–600 nm, a source reaching 250 nm.
  const base = makeDesign({ range: { startNm: 450, endNm: 600 }, source: { minNm: 250, maxNm: 1100 } });
  const longPass: OrderSortingFilter = { kind: 'long-pass', cutOnNm: 395, inFromNm: 450, inToNm: 600, edgeWidthNm: 10 };

  it('shows Hg 253.65 nm in second order at 507.30 nm when nothing blocks it', () => {
    // Grating equation: 2 × 253.652 nm leaves at the angle of 507.304 nm in first order
    // (Palmer & Loewen, ch. 2, overlapping orders).
    const report = calibrationReport(base, calibrationLineList(['Hg']));
    const ghost = report.ghosts.find((g) => g.line.wavelengthNm === 253.652)!;
    expect(ghost.order).toBe(2);
    expectClose(ghost.apparentWavelengthNm, 507.304, 1e-12);
    expect(ghost.blocked).toBe(false);
    expect(ghost.filterTransmission).toBe(1);
    expect(ghost.reachable).toBe(true);
    // Hg 296.728 → 593.456 nm too; the apparent wavelengths come sorted.
    expect(report.ghosts.map((g) => g.apparentWavelengthNm)).toEqual(
      [...report.ghosts.map((g) => g.apparentWavelengthNm)].sort((a, b) => a - b),
    );
    expect(report.ghostCount).toBe(report.ghosts.length);
  });

  it('is blocked by a 395 nm long-pass in the beam at 507 nm', () => {
    // The ramp foot, 395 − 10/2 = 390 nm, lies above 253.652 nm: blocked, nothing passes.
    const report = calibrationReport({ ...base, filters: [longPass] }, calibrationLineList(['Hg']));
    const ghost = report.ghosts.find((g) => g.line.wavelengthNm === 253.652)!;
    expect(ghost.blocked).toBe(true);
    expect(ghost.filterTransmission).toBe(0);
  });

  it('is not blocked when the filter is in the beam only elsewhere in the range', () => {
    const elsewhere = { ...longPass, inFromNm: 550, inToNm: 600 };
    const report = calibrationReport({ ...base, filters: [elsewhere] }, calibrationLineList(['Hg']));
    expect(report.ghosts.find((g) => g.line.wavelengthNm === 253.652)!.blocked).toBe(false);
    expect(report.ghosts.find((g) => g.line.wavelengthNm === 296.728)!.blocked).toBe(true); // at 593.456
  });

  it('ignores lines outside the source', () => {
    const report = calibrationReport({ ...base, source: { minNm: 260, maxNm: 1100 } }, calibrationLineList(['Hg']));
    expect(report.ghosts.some((g) => g.line.wavelengthNm === 253.652)).toBe(false);
  });

  it('finds a longer line in a lower order, which no long-pass can block', () => {
    // Second order, 250–300 nm: Hg 546.0735 nm in first order sits at 546.0735/2 = 273.037 nm.
    const design = makeDesign({
      grating: { order: 2 },
      range: { startNm: 250, endNm: 300 },
      source: { minNm: 250, maxNm: 1100 },
      filters: undefined,
    });
    const lowPass: OrderSortingFilter = { kind: 'long-pass', cutOnNm: 240, inFromNm: 250, inToNm: 300, edgeWidthNm: 5 };
    const report = calibrationReport({ ...design, filters: [lowPass] }, calibrationLineList(['Hg']));
    const ghost = report.ghosts.find((g) => g.line.wavelengthNm === 546.0735)!;
    expect(ghost.order).toBe(1);
    expectClose(ghost.apparentWavelengthNm, 273.03675, 1e-12);
    expect(ghost.blocked).toBe(false);
  });

  it('keeps the order’s sign in negative orders', () => {
    const negative = makeDesign({ grating: { order: -1 }, range: { startNm: 450, endNm: 600 }, source: { minNm: 250, maxNm: 1100 } });
    const ghost = calibrationReport(negative, calibrationLineList(['Hg'])).ghosts.find((g) => g.line.wavelengthNm === 253.652)!;
    expect(ghost.order).toBe(-2);
    expectClose(ghost.apparentWavelengthNm, 507.304, 1e-12);
  });
});

describe('calibration coverage and the cubic fit to the dispersion', () => {
  it('example design: lines enough for a cubic, and a cubic residual far below 0.01 nm', () => {
    const report = calibrationReport(exampleDesign, calibrationLineList(['Hg', 'Ne', 'Ar', 'Kr', 'Na']));
    const coverage = report.coverage!;
    expect(coverage.pixelCount).toBe(1024);
    expect(coverage.linesOnDetector).toBeGreaterThanOrEqual(CUBIC_MIN_LINES);
    expect(coverage.enoughLinesForCubic).toBe(true);
    expect(coverage.note).toBeNull();
    expect(coverage.spanPixels).toBeGreaterThan(0);
    expect(coverage.spanPixels).toBeLessThanOrEqual(1023);
    expectClose(coverage.spanPixels, coverage.lastLinePixel! - coverage.firstLinePixel!, 1e-12);
    const fit = coverage.fit!;
    expect(fit.litFraction).toBe(1);
    expect(fit.maxResidualNm).toBeLessThan(0.001); // ≪ 0.01 nm (the issue's own bound)
    expect(fit.rmsResidualNm).toBeLessThanOrEqual(fit.maxResidualNm);
    expect(fit.maxResidualPerPixel).toBeLessThan(0.01);
  });

  it('the residual grows for a much wider detector behind a shorter camera', () => {
    // 4096 × 25 µm = 102.4 mm behind f = 100 mm spans ±27° of β: far more than a cubic follows.
    const lines = calibrationLineList(['Ne']);
    const small = calibrationReport(exampleDesign, lines).coverage!.fit!;
    const wide = calibrationReport(
      makeDesign({ layout: { collimatorFocalMm: 100, cameraFocalMm: 100 }, detector: { pixelPitchUm: 25, pixelCount: 4096 } }),
      lines,
    ).coverage!.fit!;
    expect(wide.maxResidualNm).toBeGreaterThan(1000 * small.maxResidualNm);
    expect(wide.maxResidualPerBandpass).toBeGreaterThan(small.maxResidualPerBandpass);
  });

  it('says when fewer than 4 lines land on the detector (a cubic needs 4, common practice)', () => {
    // Only Hg 576.9598 and 579.0663 nm fall on the example detector (about 568–634 nm).
    const coverage = calibrationReport(exampleDesign, calibrationLineList(['Hg'])).coverage!;
    expect(coverage.linesOnDetector).toBe(2);
    expect(coverage.enoughLinesForCubic).toBe(false);
    expect(coverage.note).toMatch(/at least 4/);
    const none = calibrationReport(exampleDesign, userLines(400)).coverage!;
    expect(none.linesOnDetector).toBe(0);
    expect(none.firstLinePixel).toBeNull();
    expect(none.spanPixels).toBe(0);
  });
});

describe('the line list', () => {
  it('merges built-in and user lines in wavelength order, each element once', () => {
    const list = calibrationLineList(['Na', 'Na'], [{ wavelengthNm: 500, label: 'laser' }]);
    expect(list.filter((l) => l.wavelengthNm === 588.995)).toHaveLength(1);
    expect(list.map((l) => l.wavelengthNm)).toEqual([...list.map((l) => l.wavelengthNm)].sort((a, b) => a - b));
    const user = list.find((l) => l.origin === 'user')!;
    expect(user).toMatchObject({ wavelengthNm: 500, label: 'laser', element: null, vacuumWavelengthNm: null });
  });

  it('converts user lines stated in vacuum to air: Na D2 589.1583 → 588.9950 nm (NIST ASD, from memory)', () => {
    const [line] = calibrationLineList([], [{ wavelengthNm: 589.1583 }], 'vacuum') as [CalibrationLine];
    expectClose(line.wavelengthNm, 588.995, 0, 5e-4);
    expect(line.vacuumWavelengthNm).toBe(589.1583);
    expect(calibrationLineList([], [{ wavelengthNm: 589.1583 }], 'unstated')[0]!.wavelengthNm).toBe(589.1583);
  });

  it('leaves out wavelengths that are not positive finite numbers', () => {
    expect(userLines(0, -3, Number.NaN, Number.POSITIVE_INFINITY, 500)).toHaveLength(1);
  });
});

describe('bounded and finite on any schema-valid design', () => {
  it.each([
    { name: 'example', design: exampleDesign },
    // A source over decades in order 1000: millions of ghosts, listed up to the cap.
    {
      name: 'echelle order 1000, wide source',
      design: makeDesign({ grating: { order: 1000, grooveDensityPerMm: 0.5 }, range: { startNm: 500, endNm: 510 }, source: { minNm: 0.001, maxNm: 10_000_000 } }),
    },
    { name: 'one pixel', design: makeDesign({ detector: { pixelPitchUm: 25, pixelCount: 1 } }) },
    { name: 'range past reach', design: makeDesign({ range: { startNm: 0.001, endNm: 10_000_000 } }) },
    { name: 'negative order', design: makeDesign({ grating: { order: -3 } }) },
  ])('$name', ({ design }) => {
    expect(designSchema.safeParse(design).success).toBe(true);
    const many = calibrationLineList(
      ['Hg', 'Ne', 'Ar', 'Kr', 'Na'],
      Array.from({ length: 3000 }, (_, i) => ({ wavelengthNm: 300 + i * 0.2 })),
    );
    const report = calibrationReport(design, many);
    expectAllFinite(report);
    expect(report.linesInRange.length).toBeLessThanOrEqual(MAX_LISTED_CALIBRATION_ITEMS);
    expect(report.pairs.length).toBeLessThanOrEqual(MAX_LISTED_CALIBRATION_ITEMS);
    expect(report.ghosts.length).toBeLessThanOrEqual(MAX_LISTED_CALIBRATION_ITEMS);
    expect(report.ghostsTruncated).toBe(report.ghostCount > report.ghosts.length);
    expect(report.pairsTruncated).toBe(report.pairCount > report.pairs.length);
  });
});
