/**
 * What build and drive errors do to the figures that matter: slit widths off by a fraction →
 * bandpass at the worst wavelength; a drive error in arc-seconds → wavelength error at the range
 * start, centre and end; a focal length off by a fraction → reciprocal dispersion at the centre.
 * Every figure comes from the ordinary solver on the changed design.
 */

import type { Design } from '../../shared/design';
import { formatNumber, formatPercent, formatQuantity } from '../../shared/format';
import { evaluateDesign, type WavelengthPoint } from '../solver';
import { REQUIREMENT_POINTS } from './check';
import { applyDesignChanges, type DesignChange } from './design-change';

export interface ToleranceOptions {
  /** Slit width error, a fraction (default 0.1: ±10 %). */
  slitFraction?: number;
  /** Drive error, arc-seconds (default the requirements' drive step, else 1″). */
  driveErrorArcsec?: number;
  /** Focal length error, a fraction (default 0.01: ±1 %). */
  focalFraction?: number;
}

export interface SlitTolerance {
  fraction: number;
  /** Where the bandpass is largest, nm. */
  wavelengthNm: number;
  nominalNm: number;
  /** Bandpass with both slits narrower / wider by `fraction`. */
  lowNm: number;
  highNm: number;
  text: string;
}

export interface DriveTolerancePoint {
  position: 'start' | 'centre' | 'end';
  wavelengthNm: number;
  /** `error × |dλ/dφ|`, nm; null where the wavelength is unreachable. */
  errorNm: number | null;
}

export interface DriveTolerance {
  errorArcsec: number;
  points: DriveTolerancePoint[];
  text: string;
}

export interface FocalTolerance {
  fraction: number;
  wavelengthNm: number;
  nominalNmPerMm: number;
  /** Reciprocal dispersion with the camera focal length shorter / longer by `fraction`. */
  shortFocalNmPerMm: number;
  longFocalNmPerMm: number;
  /** The larger departure from nominal, nm/mm. */
  errorNmPerMm: number;
  text: string;
}

export interface ToleranceView {
  /** Null when no wavelength of the range is reachable. */
  slits: SlitTolerance | null;
  drive: DriveTolerance;
  /** Null when the range centre is unreachable. */
  focal: FocalTolerance | null;
}

const DEFAULT_SLIT_FRACTION = 0.1;
const DEFAULT_FOCAL_FRACTION = 0.01;
const DEFAULT_DRIVE_ARCSEC = 1;

const nm = (value: number) => formatQuantity(value, 'nm');
const percent = (fraction: number) => formatPercent(fraction, { maximumFractionDigits: 2 });

function fraction(name: string, value: number | undefined, fallback: number): number {
  if (value === undefined) return fallback;
  if (!(Number.isFinite(value) && value > 0 && value < 1)) {
    throw new RangeError(`${name} must be a fraction greater than 0 and less than 1 (0.1 means ±10 %)`);
  }
  return value;
}

function pointAt(design: Design, wavelengthNm: number): WavelengthPoint {
  return evaluateDesign(design, { wavelengthsNm: [wavelengthNm] }).points[0]!;
}

function scaledSlits(design: Design, factor: number): DesignChange[] {
  return [
    { path: 'slits.entranceWidthUm', value: design.slits.entranceWidthUm * factor },
    { path: 'slits.exitWidthUm', value: design.slits.exitWidthUm * factor },
  ];
}

/** Littrow's one lens and Ebert–Fastie's one mirror change both focal lengths together. */
function scaledCamera(design: Design, factor: number): DesignChange[] {
  const single = design.layout.kind === 'littrow' || design.layout.kind === 'ebert-fastie';
  const camera = { path: 'layout.cameraFocalMm', value: design.layout.cameraFocalMm * factor };
  return single ? [{ path: 'layout.collimatorFocalMm', value: design.layout.collimatorFocalMm * factor }, camera] : [camera];
}

function slitTolerance(design: Design, f: number): SlitTolerance | null {
  const wavelengths = design.requirements?.atWavelengthsNm;
  const points = evaluateDesign(design, wavelengths ? { wavelengthsNm: wavelengths } : { points: REQUIREMENT_POINTS }).points;
  let worst: WavelengthPoint | null = null;
  for (const point of points) {
    if (point.bandpassNm !== null && (worst === null || point.bandpassNm > (worst.bandpassNm ?? 0))) worst = point;
  }
  if (worst === null || worst.bandpassNm === null) return null;
  const at = worst.wavelengthNm;
  const lowNm = pointAt(applyDesignChanges(design, scaledSlits(design, 1 - f)), at).bandpassNm ?? worst.bandpassNm;
  const highNm = pointAt(applyDesignChanges(design, scaledSlits(design, 1 + f)), at).bandpassNm ?? worst.bandpassNm;
  return {
    fraction: f,
    wavelengthNm: at,
    nominalNm: worst.bandpassNm,
    lowNm,
    highNm,
    text:
      `Slit widths ±${percent(f)} → bandpass ${formatNumber(lowNm)}–${nm(highNm)} at ${nm(at)} ` +
      `(nominal ${nm(worst.bandpassNm)})`,
  };
}

function driveTolerance(design: Design, errorArcsec: number): DriveTolerance {
  const { startNm, endNm } = design.range;
  const wanted = [
    ['start', startNm],
    ['centre', (startNm + endNm) / 2],
    ['end', endNm],
  ] as const;
  const evaluated = evaluateDesign(design, { wavelengthsNm: wanted.map(([, w]) => w) }).points;
  const points = wanted.map(([position, wavelengthNm], i): DriveTolerancePoint => {
    const sensitivity = evaluated[i]?.scanSensitivityNmPerArcsec ?? null;
    return { position, wavelengthNm, errorNm: sensitivity === null ? null : errorArcsec * Math.abs(sensitivity) };
  });
  const parts = points.map((p) =>
    p.errorNm === null ? `unreachable at ${nm(p.wavelengthNm)}` : `${nm(p.errorNm)} at ${nm(p.wavelengthNm)}`,
  );
  return {
    errorArcsec,
    points,
    text: `A ${formatQuantity(errorArcsec, '″')} drive error → wavelength error ${parts.join(', ')}`,
  };
}

function focalTolerance(design: Design, f: number): FocalTolerance | null {
  const centreNm = (design.range.startNm + design.range.endNm) / 2;
  const nominal = pointAt(design, centreNm).reciprocalDispersionNmPerMm;
  const short = pointAt(applyDesignChanges(design, scaledCamera(design, 1 - f)), centreNm).reciprocalDispersionNmPerMm;
  const long = pointAt(applyDesignChanges(design, scaledCamera(design, 1 + f)), centreNm).reciprocalDispersionNmPerMm;
  if (nominal === null || short === null || long === null) return null;
  const error = Math.max(Math.abs(short - nominal), Math.abs(long - nominal));
  const what = design.layout.kind === 'czerny-turner' ? 'Camera focal length' : 'Focal length';
  return {
    fraction: f,
    wavelengthNm: centreNm,
    nominalNmPerMm: nominal,
    shortFocalNmPerMm: short,
    longFocalNmPerMm: long,
    errorNmPerMm: error,
    text:
      `${what} ±${percent(f)} → reciprocal dispersion ${formatNumber(long)}–${formatQuantity(short, 'nm/mm')} ` +
      `at ${nm(centreNm)} (up to ±${formatQuantity(error, 'nm/mm', 2)})`,
  };
}

/**
 * The tolerance view of `design`: slit widths ±`slitFraction` (10 %), a drive error of
 * `driveErrorArcsec` (the requirements' drive step, else 1″), the camera focal length
 * ±`focalFraction` (1 %). Throws a RangeError naming the option when one is out of bounds.
 */
export function toleranceView(design: Design, options: ToleranceOptions = {}): ToleranceView {
  const slitFraction = fraction('slitFraction', options.slitFraction, DEFAULT_SLIT_FRACTION);
  const focalFraction = fraction('focalFraction', options.focalFraction, DEFAULT_FOCAL_FRACTION);
  const driveErrorArcsec =
    options.driveErrorArcsec ?? design.requirements?.driveStepArcsec ?? DEFAULT_DRIVE_ARCSEC;
  if (!(Number.isFinite(driveErrorArcsec) && driveErrorArcsec > 0)) {
    throw new RangeError('driveErrorArcsec must be a number of arc-seconds greater than 0');
  }
  return {
    slits: slitTolerance(design, slitFraction),
    drive: driveTolerance(design, driveErrorArcsec),
    focal: focalTolerance(design, focalFraction),
  };
}
