/**
 * The solver's output shape, shared by the client, the server's HTTP endpoint, the PDF sheet and
 * the CLI. Field names are part of the public JSON contract; units are in the names. Every number
 * is finite; angle-dependent figures of an unreachable wavelength are null, never NaN.
 */

import type { LayoutKind } from '../../shared/design';
import type { OrderSortingFilter } from '../../shared/filters';
import type { SlitFunction } from './bandpass';
import type { DetectorCoverage } from './detector';
import type { LightBudget } from './light-budget';
import type { Overlap } from './orders';

export interface WavelengthPoint {
  wavelengthNm: number;
  reachable: boolean;
  /** Why no grating angle delivers this wavelength; null when reachable. */
  reason: string | null;
  incidenceDeg: number | null;
  diffractionDeg: number | null;
  gratingRotationDeg: number | null;
  angularDispersionDegPerNm: number | null;
  linearDispersionMmPerNm: number | null;
  /** At the exit plane, with the camera focal length. */
  reciprocalDispersionNmPerMm: number | null;
  /** `(cos α / cos β)(f_cam / f_col)`: entrance-slit image width over slit width. */
  anamorphicMagnification: number | null;
  /** Slit-limited FWHM of the instrument function. */
  bandpassNm: number | null;
  slitFunction: SlitFunction | null;
  diffractionLimitNm: number;
  /**
   * `λ / √(bandpass² + diffraction limit²)`: slit and diffraction widths added in quadrature, as for
   * near-Gaussian profiles (common practice). Always below `theoreticalResolvingPower`.
   */
  resolvingPower: number | null;
  theoreticalResolvingPower: number;
  freeSpectralRangeNm: number;
  /**
   * Scalar blaze envelope `sinc²(π(|m| − λ_B cos K / λ))` relative to its peak (see blaze.ts for
   * the model and where it holds); null without a blaze wavelength or when unreachable.
   */
  blazeEfficiency: number | null;
  /**
   * Other orders whose source light leaves at this angle, by increasing |n|. At most
   * `MAX_LISTED_OVERLAPS` (20): when more overlap, the ones nearest the working order.
   */
  overlaps: readonly Overlap[];
  /** Every overlapping order, listed or not. */
  overlapCount: number;
  /** The overlapping orders the filters in the beam at this setting do not block (all without filters). */
  unblockedOverlapCount: number;
  /** True when `overlaps` lists fewer than `overlapCount` (the list was cut, never silently). */
  overlapsTruncated: boolean;
  /** What the filters in the beam at this setting pass of the working wavelength itself (1 without). */
  filterTransmission: number;
  scanSensitivityNmPerArcsec: number | null;
  /**
   * The light budget's relative throughput here (features/solver/throughput.ts); null where a
   * counted factor is unknown, where nothing is counted, and from `evaluatePoint` alone.
   */
  relativeThroughput: number | null;
}

export interface AberrationSummary {
  /** Shafer–Megill–Droppleman coma-free camera angle at the centre wavelength (null for Littrow or without a collimator angle). */
  comaFreeCameraOffAxisDeg: number | null;
  /** Camera angle the residuals refer to: the design's, else the coma-free one. */
  cameraOffAxisInUseDeg: number | null;
  /** Coma-free camera angle at each wavelength minus the angle in use, degrees. */
  comaResidualAtStartDeg: number | null;
  comaResidualAtCentreDeg: number | null;
  comaResidualAtEndDeg: number | null;
  /** Coddington `f / cos θ − f cos θ` of each off-axis mirror (null without its angle). */
  collimatorAstigmatismMm: number | null;
  cameraAstigmatismMm: number | null;
}

export interface DesignSummary {
  kind: LayoutKind;
  grooveSpacingNm: number;
  /** N, grooves across the ruled width. */
  illuminatedGrooves: number;
  halfDeviationDeg: number;
  centreWavelengthNm: number;
  /** Zero order: the grating turned square to the bisector. */
  reachableMinNm: number;
  /** `2d cos²K / |m|`, where the incidence reaches grazing. */
  reachableMaxNm: number;
  gratingRotationStartDeg: number | null;
  gratingRotationEndDeg: number | null;
  /** Collimator focal / (ruled width · cos α) at the centre wavelength. */
  fNumberProjectedWidth: number | null;
  /** Collimator focal / ruled height. */
  fNumberHeight: number;
  /** Camera focal / (ruled width · cos β) at the centre wavelength: the diffracted beam's width. */
  cameraFNumberProjectedWidth: number | null;
  /** Camera focal / ruled height. */
  cameraFNumberHeight: number;
  /** `λ_B cos K / |m|`, null without a blaze wavelength. */
  blazeWavelengthInMountNm: number | null;
  aberrations: AberrationSummary;
  /** Null without a detector, or when the centre wavelength is unreachable. */
  detector: DetectorCoverage | null;
}

export type WarningCode =
  | 'unreachable'
  | 'near-grazing'
  | 'below-diffraction-limit'
  | 'undersampled'
  | 'order-overlap'
  | 'filter-attenuates'
  | 'low-efficiency'
  | 'beyond-scalar-blaze'
  | 'few-grooves'
  | 'fast-optics'
  | 'degenerate-mount'
  | 'input-overfills'
  | 'input-underfills'
  | 'curve-gap';

/** One kind of design problem in plain words with its fix (built by `collectWarnings`). */
export interface Warning {
  code: WarningCode;
  message: string;
  wavelengthNm?: number;
}

/** The design's order-sorting filters and a proposed plan (features/solver/order-sorting.ts). */
export interface OrderSortingSummary {
  /** A long-pass plan that blocks every shorter overlapping order across the range; empty when none overlaps. */
  proposedFilters: OrderSortingFilter[];
  /** (Point × overlapping order) pairs the design's own filters leave unblocked over the evaluated points. */
  unblockedOverlaps: number;
  /** The same count with the proposed plan in place of the design's filters. */
  proposedUnblockedOverlaps: number;
  /** Settings inside the range where the design's filters in the beam change, ascending. */
  filterChangesNm: number[];
}

export interface Evaluation {
  points: WavelengthPoint[];
  design: DesignSummary;
  orderSorting: OrderSortingSummary;
  /** Étendue, input fill and relative throughput (features/solver/light-budget.ts). */
  lightBudget: LightBudget;
  warnings: Warning[];
}
