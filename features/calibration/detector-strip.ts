/**
 * The detector strip's content, pure: which lines land on the detector and at which pixel, which
 * miss it and on which side, where their labels go without overlapping, and the strip's spoken
 * summary. Every line of the list is placed, not only those in the range, so the tick count is
 * the coverage's `linesOnDetector`.
 */

import { detectorFrame, detectorLanding, type CalibrationLine } from '../solver/calibration-lines';
import { wavelengthAtDetectorNm } from '../solver/detector';
import type { Design } from '../../shared/design';
import { formatInteger, formatNumber, withUnit } from '../../shared/format';
import { lineName, lineNm, lineSource, pixelText } from './calibration-words';

export interface StripTick {
  line: CalibrationLine;
  /** Fractional pixel, 0 at the first pixel's centre (calibration-lines.ts). */
  pixel: number;
}

export interface DetectorStrip {
  pixelCount: number;
  /** Wavelength at the centre of the first and the last pixel, nm; null past grazing. */
  firstPixelNm: number | null;
  lastPixelNm: number | null;
  /** On the detector, in pixel order. */
  ticks: StripTick[];
  /** Lines in the design range that fall short of the first pixel, or past the last. */
  shortOf: CalibrationLine[];
  pastEnd: CalibrationLine[];
  /** Lines in the range whose light misses the camera altogether. */
  missing: CalibrationLine[];
}

/**
 * Lines against the detector in spectrograph mode (grating fixed at the range centre, as the
 * solver's `detectorFrame`); null without a detector or when the mount cannot reach the centre.
 */
export function detectorStrip(design: Design, lines: readonly CalibrationLine[]): DetectorStrip | null {
  const frame = detectorFrame(design);
  if (!frame) return null;
  const { startNm, endNm } = design.range;
  const edgeMm = ((frame.pixelCount - 1) / 2) * frame.pitchMm;
  const strip: DetectorStrip = {
    pixelCount: frame.pixelCount,
    firstPixelNm: wavelengthAtDetectorNm(frame.geometry, -edgeMm),
    lastPixelNm: wavelengthAtDetectorNm(frame.geometry, edgeMm),
    ticks: [],
    shortOf: [],
    pastEnd: [],
    missing: [],
  };
  for (const line of lines) {
    if (!(Number.isFinite(line.wavelengthNm) && line.wavelengthNm > 0)) continue;
    const landing = detectorLanding(frame, line.wavelengthNm);
    if (landing.placement === 'on-detector') {
      strip.ticks.push({ line, pixel: landing.pixel as number });
      continue;
    }
    if (line.wavelengthNm < startNm || line.wavelengthNm > endNm) continue;
    if (landing.placement === 'short-of-detector') strip.shortOf.push(line);
    else if (landing.placement === 'past-detector') strip.pastEnd.push(line);
    else strip.missing.push(line);
  }
  strip.ticks.sort((a, b) => a.pixel - b.pixel);
  return strip;
}

/**
 * Rows for labels centred on ticks at `xs` (ascending), each `widthsPx` wide: a label takes the
 * first of `rows` rows where it clears the previous label by `gapPx` and stays inside
 * `[0, stripWidthPx]` once nudged in from the ends; a label with no free row gets null (the
 * tick stays; the table names every line).
 */
export function placeStripLabels(
  xs: readonly number[],
  widthsPx: readonly number[],
  stripWidthPx: number,
  rows: number,
  gapPx = 3,
): { row: number | null; leftPx: number }[] {
  const rightEdge = new Array<number>(rows).fill(Number.NEGATIVE_INFINITY);
  return xs.map((x, i) => {
    const w = widthsPx[i] ?? 0;
    const leftPx = Math.min(Math.max(0, x - w / 2), Math.max(0, stripWidthPx - w));
    for (let row = 0; row < rows; row++) {
      if (leftPx >= (rightEdge[row] as number) + gapPx) {
        rightEdge[row] = leftPx + w;
        return { row, leftPx };
      }
    }
    return { row: null, leftPx };
  });
}

/** A short range of wavelengths of lines: "302.15–546.0735 nm", or one wavelength. */
function span(lines: readonly CalibrationLine[]): string {
  const first = lines[0] as CalibrationLine;
  const last = lines[lines.length - 1] as CalibrationLine;
  return lines.length === 1
    ? withUnit(lineNm(first.wavelengthNm), 'nm')
    : withUnit(`${lineNm(first.wavelengthNm)}–${lineNm(last.wavelengthNm)}`, 'nm');
}

const count = (n: number, one: string, many: string) => `${formatInteger(n)} ${n === 1 ? one : many}`;

/** "Off the detector: 14 lines before pixel 0 (302.15–546.0735 nm); 19 past pixel 1023 (…)". */
export function offDetectorSentence(strip: DetectorStrip): string | null {
  const parts: string[] = [];
  const last = formatInteger(strip.pixelCount - 1);
  if (strip.shortOf.length > 0) parts.push(`${count(strip.shortOf.length, 'line', 'lines')} before pixel 0 (${span(strip.shortOf)})`);
  if (strip.pastEnd.length > 0) parts.push(`${count(strip.pastEnd.length, 'line', 'lines')} past pixel ${last} (${span(strip.pastEnd)})`);
  if (strip.missing.length > 0) parts.push(`${count(strip.missing.length, 'line misses', 'lines miss')} the camera (${span(strip.missing)})`);
  return parts.length > 0 ? `Off the detector: ${parts.join('; ')}.` : null;
}

/** The strip's accessible name: how many lines land, where, and what misses. */
export function stripSummary(strip: DetectorStrip): string {
  const last = formatInteger(strip.pixelCount - 1);
  const ends =
    strip.firstPixelNm !== null && strip.lastPixelNm !== null
      ? ` (${withUnit(`${formatNumber(strip.firstPixelNm, 5)}–${formatNumber(strip.lastPixelNm, 5)}`, 'nm')})`
      : '';
  const head = `Detector strip, pixels 0 to ${last}${ends}: `;
  const first = strip.ticks[0];
  const final = strip.ticks[strip.ticks.length - 1];
  let body: string;
  if (!first || !final) body = 'no lamp line lands on it.';
  else if (strip.ticks.length === 1) body = `1 lamp line lands on it, ${lineName(first.line)} at pixel ${pixelText(first.pixel)}.`;
  else {
    const sources = [...new Set(strip.ticks.map((t) => lineSource(t.line)))].join(', ');
    body =
      `${formatInteger(strip.ticks.length)} lamp lines (${sources}) land on it, from ${lineName(first.line)} at pixel ` +
      `${pixelText(first.pixel)} to ${lineName(final.line)} at pixel ${pixelText(final.pixel)}.`;
  }
  const off = offDetectorSentence(strip);
  return off ? `${head}${body} ${off}` : `${head}${body}`;
}
