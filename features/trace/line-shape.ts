/**
 * The traced instrument function: the exit slit scanned across the traced image of the whole
 * entrance slit. Light of wavelength λ + Δλ lands `D·Δλ` further along x (D the traced linear
 * dispersion), so the share passed at offset Δλ is the share of rays with |x + D·Δλ| ≤ w/2: a
 * window count over the sorted x positions, two binary searches per offset. Beside it, the
 * closed-form trapezoid rect(entrance image) ⊗ rect(exit slit) (Palmer & Loewen, Diffraction
 * Grating Handbook, ch. 9) from the solver's slit function.
 */

import type { SlitFunction } from '../solver';
import type { LineShape } from './types';

/** Offsets sampled across the line. */
export const LINE_SHAPE_SAMPLES = 161;

function lowerBound(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function upperBound(sorted: Float64Array, value: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! <= value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** The trapezoid's height at Δλ, peak 1. */
export function trapezoidAt(shape: SlitFunction, offsetNm: number): number {
  const half = shape.baseNm / 2;
  const top = shape.topNm / 2;
  const a = Math.abs(offsetNm);
  if (a <= top) return 1;
  if (a >= half) return 0;
  return (half - a) / (half - top);
}

/** Full width at half maximum of a sampled curve, by linear interpolation at both half crossings; null without two crossings. */
export function fwhmOf(offsetNm: Float64Array, values: Float64Array): number | null {
  let peak = 0;
  let peakAt = 0;
  for (let i = 0; i < values.length; i++) {
    if (values[i]! > peak) {
      peak = values[i]!;
      peakAt = i;
    }
  }
  if (peak <= 0) return null;
  const half = peak / 2;
  let left: number | null = null;
  for (let i = peakAt; i > 0; i--) {
    if (values[i - 1]! < half && values[i]! >= half) {
      left = offsetNm[i - 1]! + ((half - values[i - 1]!) / (values[i]! - values[i - 1]!)) * (offsetNm[i]! - offsetNm[i - 1]!);
      break;
    }
  }
  let right: number | null = null;
  for (let i = peakAt; i < values.length - 1; i++) {
    if (values[i + 1]! < half && values[i]! >= half) {
      right = offsetNm[i]! + ((values[i]! - half) / (values[i]! - values[i + 1]!)) * (offsetNm[i + 1]! - offsetNm[i]!);
      break;
    }
  }
  return left === null || right === null ? null : right - left;
}

/**
 * The line shape from the traced x positions (any order) with the exit slit `exitWidthMm` wide,
 * and its FWHM. The offsets span the wider of the trapezoid's base and the traced image, and more.
 */
export function tracedLineShape(
  xs: Float64Array,
  exitWidthMm: number,
  dispersionMmPerNm: number,
  closedForm: SlitFunction,
): { lineShape: LineShape; fwhmNm: number | null } {
  const sorted = Float64Array.from(xs).sort();
  const d = Math.abs(dispersionMmPerNm);
  const imageSpanMm = sorted.length > 0 ? Math.max(Math.abs(sorted[0]!), Math.abs(sorted[sorted.length - 1]!)) : 0;
  const spanNm = Math.max(closedForm.baseNm, (2 * imageSpanMm + exitWidthMm) / d) * 0.75;
  const offsetNm = new Float64Array(LINE_SHAPE_SAMPLES);
  const traced = new Float64Array(LINE_SHAPE_SAMPLES);
  const trapezoid = new Float64Array(LINE_SHAPE_SAMPLES);
  const half = exitWidthMm / 2;
  let peak = 0;
  for (let k = 0; k < LINE_SHAPE_SAMPLES; k++) {
    const off = -spanNm + (2 * spanNm * k) / (LINE_SHAPE_SAMPLES - 1);
    offsetNm[k] = off;
    // Passed: x + D·Δλ within ±w/2, i.e. x in [−w/2 − D·Δλ, w/2 − D·Δλ] (D signed: x grows with λ).
    const shift = dispersionMmPerNm * off;
    const count = upperBound(sorted, half - shift) - lowerBound(sorted, -half - shift);
    traced[k] = count;
    if (count > peak) peak = count;
    trapezoid[k] = trapezoidAt(closedForm, off);
  }
  if (peak > 0) for (let k = 0; k < LINE_SHAPE_SAMPLES; k++) traced[k] = traced[k]! / peak;
  return { lineShape: { offsetNm, traced, closedForm: trapezoid }, fwhmNm: peak > 0 ? fwhmOf(offsetNm, traced) : null };
}
