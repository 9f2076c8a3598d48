/**
 * The calibration card's sentences, pure (no React) so the card and any printed page say the same
 * thing. Wavelengths of lines are printed to the decimals their list gives (up to seven figures),
 * derived figures (separations, bandpasses, residuals) to three.
 */

import type {
  CalibrationCoverage,
  CalibrationLine,
  DetectorLanding,
  Ghost,
  LinePair,
} from '../solver/calibration-lines';
import type { OrderSortingFilter } from '../../shared/filters';
import { MINUS, formatFixed, formatInteger, formatNumber, formatPercent, withUnit } from '../../shared/format';

/** A line's own wavelength: the list's decimals kept, never padded. */
export const lineNm = (nm: number) => formatNumber(nm, 7);

/** Who a line belongs to: its lamp's element, or the name of the uploaded list it came from. */
export function lineSource(line: CalibrationLine): string {
  return line.element ?? line.label ?? 'your list';
}

/** "Hg 546.0735 nm". */
export function lineName(line: CalibrationLine): string {
  return `${lineSource(line)} ${withUnit(lineNm(line.wavelengthNm), 'nm')}`;
}

/** "48 lines fall in 300–900 nm". */
export function linesInRangeSentence(count: number, startNm: number, endNm: number): string {
  const range = withUnit(`${formatNumber(startNm)}–${formatNumber(endNm)}`, 'nm');
  return `${formatInteger(count)} ${count === 1 ? 'line falls' : 'lines fall'} in ${range}`;
}

/** A detector pixel, to a tenth: where a line's centre falls between pixel centres matters. */
export const pixelText = (pixel: number) => formatFixed(pixel, 1);

/** The table's pixel cell: the pixel on the detector, else where the line goes instead. */
export function placementCell(landing: DetectorLanding | null, pixelCount: number | null): string {
  if (!landing) return '—';
  switch (landing.placement) {
    case 'on-detector':
      return pixelText(landing.pixel as number);
    case 'short-of-detector':
      return 'before pixel 0';
    case 'past-detector':
      return `past pixel ${formatInteger((pixelCount ?? 1) - 1)}`;
    case 'misses-camera':
      return 'misses the camera';
  }
}

/** Two lines as one name: "Na 588.995 / 589.5924 nm", or "Hg 576.9598 / Ne 577.03 nm" across lamps. */
function pairName(pair: LinePair): string {
  const a = lineSource(pair.shorter);
  const b = lineSource(pair.longer);
  const longer = withUnit(lineNm(pair.longer.wavelengthNm), 'nm');
  return a === b
    ? `${a} ${lineNm(pair.shorter.wavelengthNm)} / ${longer}`
    : `${a} ${lineNm(pair.shorter.wavelengthNm)} / ${b} ${longer}`;
}

/** "Na 588.995 / 589.5924 nm: 0.597 nm apart, bandpass 0.83 nm — not resolved". */
export function pairSentence(pair: LinePair): string {
  const apart = `${withUnit(formatNumber(pair.separationNm, 3), 'nm')} apart`;
  if (pair.bandpassNm === null || pair.resolved === null) {
    return `${pairName(pair)}: ${apart}; the mount cannot reach them, so no bandpass`;
  }
  const verdict = pair.resolved ? 'resolved' : 'not resolved';
  return `${pairName(pair)}: ${apart}, bandpass ${withUnit(formatNumber(pair.bandpassNm, 3), 'nm')} — ${verdict}`;
}

/** "46 of 47 neighbouring pairs are resolved". */
export function resolvedPairsSentence(pairCount: number, unresolvedCount: number): string {
  if (pairCount === 0) return 'Fewer than two lines fall in the range: there are no neighbouring pairs to resolve.';
  const resolved = pairCount - unresolvedCount;
  return `${formatInteger(resolved)} of ${formatInteger(pairCount)} neighbouring ${
    pairCount === 1 ? 'pair is' : 'pairs are'
  } resolved.`;
}

/** "2nd order", "3rd order"; a negative order keeps its sign: "order −2". */
export function orderWords(order: number): string {
  if (order < 0) return `order ${MINUS}${Math.abs(order)}`;
  const tens = order % 100;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : ({ 1: 'st', 2: 'nd', 3: 'rd' } as Record<number, string>)[order % 10] ?? 'th';
  return `${order}${suffix} order`;
}

/** "1", "1 and 2", "1, 2 and 3". */
function listed(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/**
 * The design's filters (numbered from 1, as the editor numbers them) that block `lineNm` while the
 * instrument is set to `settingNm`: in the beam there and with their ramp foot at or above the
 * line, the rule the solver's `blocked` flag uses (order-sorting.ts).
 */
export function blockingFilterNumbers(
  filters: readonly OrderSortingFilter[],
  settingNm: number,
  lineNm: number,
): number[] {
  const numbers: number[] = [];
  filters.forEach((f, i) => {
    const inBeam = f.inFromNm <= settingNm && settingNm <= f.inToNm;
    if (inBeam && lineNm <= f.cutOnNm - f.edgeWidthNm / 2) numbers.push(i + 1);
  });
  return numbers;
}

/**
 * "Hg 253.652 nm in 2nd order appears at 507.304 nm — not blocked", with the filters that block
 * it named, and the pixel when it lands on the detector.
 */
export function ghostSentence(ghost: Ghost, filters: readonly OrderSortingFilter[]): string {
  const where = withUnit(lineNm(ghost.apparentWavelengthNm), 'nm');
  let verdict = 'not blocked';
  if (ghost.blocked) {
    const numbers = blockingFilterNumbers(filters, ghost.apparentWavelengthNm, ghost.line.wavelengthNm);
    verdict =
      numbers.length === 0
        ? 'blocked by the filters'
        : `blocked by filter${numbers.length === 1 ? '' : 's'} ${listed(numbers.map(String))}`;
  }
  const extra: string[] = [];
  if (!ghost.reachable) extra.push('the mount cannot reach that setting');
  if (!ghost.blocked && ghost.detector?.placement === 'on-detector') {
    extra.push(`on the detector at pixel ${pixelText(ghost.detector.pixel as number)}`);
  }
  return `${lineName(ghost.line)} in ${orderWords(ghost.order)} appears at ${where} — ${verdict}${
    extra.length > 0 ? ` (${extra.join('; ')})` : ''
  }`;
}

/** Largest cubic residual, under which a polynomial calibration is taken as good (common practice). */
export const GOOD_RESIDUAL_PIXELS = 0.1;

/** The coverage paragraph as sentences: lines on the detector, their span, the cubic's residual. */
export function coverageSentences(coverage: CalibrationCoverage): string[] {
  const out: string[] = [];
  const n = coverage.linesOnDetector;
  const last = formatInteger(coverage.pixelCount - 1);
  if (n === 0 || coverage.firstLinePixel === null || coverage.lastLinePixel === null) {
    out.push(`No line lands on the detector (pixels 0 to ${last}).`);
  } else if (n === 1) {
    out.push(`1 line lands on the detector, at pixel ${pixelText(coverage.firstLinePixel)} (pixels 0 to ${last}).`);
  } else {
    out.push(
      `${formatInteger(n)} lines land on the detector, from pixel ${pixelText(coverage.firstLinePixel)} to ${pixelText(
        coverage.lastLinePixel,
      )}: a span of ${formatInteger(Math.round(coverage.spanPixels))} pixels, ${formatPercent(
        coverage.spanFraction,
      )} of its ${formatInteger(coverage.pixelCount)}.`,
    );
  }
  const fit = coverage.fit;
  if (fit) {
    const nm = (v: number) => withUnit(formatNumber(v, 2), 'nm');
    out.push(
      `A cubic wavelength(pixel) fitted to the design’s own dispersion across the detector is off by at most ${nm(
        fit.maxResidualNm,
      )} (RMS ${nm(fit.rmsResidualNm)}): ${formatNumber(fit.maxResidualPerPixel, 2)} of a pixel.`,
    );
    out.push(
      fit.maxResidualPerPixel < GOOD_RESIDUAL_PIXELS
        ? 'Under a tenth of a pixel: a cubic calibration follows this dispersion well enough (common practice).'
        : 'A tenth of a pixel or more: a cubic leaves a visible error; fit a higher-order polynomial or the grating equation itself.',
    );
  }
  if (coverage.note) out.push(`${coverage.note[0]!.toUpperCase()}${coverage.note.slice(1)}.`);
  return out;
}

/** Said in place of the strip and the coverage when the design has no detector. */
export const NO_DETECTOR_SENTENCE =
  'Pixel placement needs a detector: give the design a pixel pitch and count to see where each line lands and whether a cubic calibration is good enough.';
