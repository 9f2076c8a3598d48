/**
 * Prism monochromator at minimum deviation: the ray crosses the prism symmetrically, parallel to
 * the base, so the beam keeps its width (anamorphic magnification 1) and the whole base length b
 * is the glass path difference across the beam. Sources: Born & Wolf, Principles of Optics, §4.7;
 * Hecht, Optics, §5.5.
 *
 * `n sin(A/2) ≥ 1` means no ray passes at all: even a ray entering at grazing incidence meets the
 * second face beyond the critical angle. Such points keep their index and `dn/dλ` and carry a
 * reason instead of the figures that need a path.
 */

import { formatNumber } from '../../shared/format';
import type { PrismAnswer, PrismInput, PrismPoint, SelectorWarning, SellmeierFormula } from '../../shared/selectors';
import { bandpassNm, entranceImageWidthMm } from './bandpass';
import { NM_PER_MM, UM_PER_MM, degToRad, radToDeg } from './math';
import { resolvePrismMaterial, sellmeierDnDlambdaPerNm, sellmeierIndex } from './sellmeier';

/** Wavelengths named in one warning before "and N more". */
const LISTED_IN_WARNING = 5;

/**
 * `n sin(A/2)` at or above this counts as grazing: the ray then skims the faces (within about
 * 1.4 µrad), carries no light, and `1/√(1 − n² sin²(A/2))` is rounding noise — n = 2 on a 60°
 * prism gives 0.9999999999999999 in floating point, which is exactly grazing.
 */
const GRAZING_SINE = 1 - 1e-12;

/** `n sin(A/2)`: the sine of the angle of incidence (and of exit) at minimum deviation. */
function minDeviationSine(index: number, apexRad: number): number {
  return index * Math.sin(apexRad / 2);
}

/**
 * Minimum deviation `D = 2 asin(n sin(A/2)) − A`, radians; null when `n sin(A/2) ≥ 1` (no ray
 * passes) or the inputs give no angle. Inverts to `n = sin((D + A)/2) / sin(A/2)`.
 * Source: Born & Wolf, §4.7; Hecht, §5.5.
 */
export function prismMinDeviationRad(index: number, apexRad: number): number | null {
  const s = minDeviationSine(index, apexRad);
  if (!(s < GRAZING_SINE) || !(s > -GRAZING_SINE) || !Number.isFinite(apexRad)) return null;
  return 2 * Math.asin(s) - apexRad;
}

/**
 * Angular dispersion at minimum deviation, `dD/dλ = 2 sin(A/2) / √(1 − n² sin²(A/2)) · |dn/dλ|`,
 * rad per nm (a magnitude); null where no ray passes. Source: Born & Wolf, §4.7; Hecht, §5.5.
 */
export function prismAngularDispersionRadPerNm(index: number, dnDlambdaPerNm: number, apexRad: number): number | null {
  const s = minDeviationSine(index, apexRad);
  if (!(Math.abs(s) < GRAZING_SINE)) return null;
  const cosine2 = 1 - s * s;
  const value = ((2 * Math.sin(apexRad / 2)) / Math.sqrt(cosine2)) * Math.abs(dnDlambdaPerNm);
  return Number.isFinite(value) ? Math.abs(value) : null;
}

/** Resolving power of a prism whose beam fills the base, `R = b |dn/dλ|`, b in nm. Source: Born & Wolf, §4.7. */
export function prismResolvingPower(baseMm: number, dnDlambdaPerNm: number): number {
  return baseMm * NM_PER_MM * Math.abs(dnDlambdaPerNm);
}

/**
 * Slit-limited bandpass of a prism monochromator, nm: reciprocal linear dispersion
 * `1 / (f_cam dD/dλ)` times the wider of the entrance-slit image (`w_ent f_cam / f_col`, the prism
 * adding no anamorphic magnification at minimum deviation) and the exit slit — the grating's
 * bandpass model (./bandpass) with the prism's dispersion. Infinite where the dispersion is 0.
 */
export function prismBandpassNm(
  angularDispersionRadPerNm: number,
  cameraFocalMm: number,
  collimatorFocalMm: number,
  entranceWidthUm: number,
  exitWidthUm: number,
): number {
  const reciprocalDispersionNmPerMm = 1 / (cameraFocalMm * Math.abs(angularDispersionRadPerNm));
  const imageMm = entranceImageWidthMm(entranceWidthUm / UM_PER_MM, cameraFocalMm / collimatorFocalMm);
  return bandpassNm(reciprocalDispersionNmPerMm, imageMm, exitWidthUm / UM_PER_MM);
}

export interface PrismMonochromatorOptics {
  collimatorFocalMm: number;
  cameraFocalMm: number;
  entranceWidthUm: number;
  exitWidthUm: number;
}

const finiteOrNull = (value: number | null): number | null => (value !== null && Number.isFinite(value) ? value : null);

/** Every figure of the prism at one wavelength; never throws — a missing figure is null with a reason. */
export function prismPoint(
  sellmeier: SellmeierFormula,
  apexRad: number,
  baseMm: number,
  wavelengthNm: number,
  mono?: PrismMonochromatorOptics,
): PrismPoint {
  const empty: PrismPoint = {
    wavelengthNm,
    index: null,
    dnDlambdaPerNm: null,
    minDeviationDeg: null,
    angularDispersionDegPerNm: null,
    resolvingPower: null,
    bandpassNm: null,
    reason: null,
  };
  const index = sellmeierIndex(sellmeier, wavelengthNm);
  const dnDlambdaPerNm = sellmeierDnDlambdaPerNm(sellmeier, wavelengthNm);
  if (index === null || dnDlambdaPerNm === null) {
    return {
      ...empty,
      reason: `The Sellmeier formula gives no real index at ${formatNumber(wavelengthNm, 5)} nm (n² ≤ 0, or at a resonance wavelength C).`,
    };
  }
  const resolvingPower = finiteOrNull(prismResolvingPower(baseMm, dnDlambdaPerNm));
  const deviationRad = prismMinDeviationRad(index, apexRad);
  const dispersionRadPerNm = prismAngularDispersionRadPerNm(index, dnDlambdaPerNm, apexRad);
  if (deviationRad === null || dispersionRadPerNm === null) {
    return {
      ...empty,
      index,
      dnDlambdaPerNm,
      reason:
        `No ray passes the prism at ${formatNumber(wavelengthNm, 5)} nm: n sin(A/2) = ` +
        `${formatNumber(minDeviationSine(index, apexRad), 5)} ≥ 1, so even a grazing ray is totally ` +
        'internally reflected at the second face; use a smaller apex angle.',
    };
  }
  let bandpass: number | null = null;
  let reason: string | null = null;
  if (mono) {
    bandpass = finiteOrNull(
      prismBandpassNm(dispersionRadPerNm, mono.cameraFocalMm, mono.collimatorFocalMm, mono.entranceWidthUm, mono.exitWidthUm),
    );
    if (bandpass === null) {
      reason = `The prism does not disperse at ${formatNumber(wavelengthNm, 5)} nm (zero angular dispersion), so the slit bandpass is unbounded.`;
    }
  }
  return {
    wavelengthNm,
    index,
    dnDlambdaPerNm,
    minDeviationDeg: radToDeg(deviationRad),
    angularDispersionDegPerNm: radToDeg(dispersionRadPerNm),
    resolvingPower,
    bandpassNm: bandpass,
    reason,
  };
}

function listWavelengths(wavelengthsNm: number[]): string {
  const shown = wavelengthsNm.slice(0, LISTED_IN_WARNING).map((w) => formatNumber(w, 5));
  const more = wavelengthsNm.length - shown.length;
  return `${shown.join(', ')} nm${more > 0 ? ` and ${more} more` : ''}`;
}

/** The prism's figures across the wavelengths, with the material's source and warnings in plain words. */
export function prismMonochromator(input: PrismInput): PrismAnswer {
  const material = resolvePrismMaterial(input.material);
  const apexRad = degToRad(input.apexDeg);
  const { collimatorFocalMm, cameraFocalMm, entranceWidthUm, exitWidthUm } = input;
  const given = [collimatorFocalMm, cameraFocalMm, entranceWidthUm, exitWidthUm].filter((v) => v !== undefined).length;
  const mono =
    collimatorFocalMm !== undefined && cameraFocalMm !== undefined && entranceWidthUm !== undefined && exitWidthUm !== undefined
      ? { collimatorFocalMm, cameraFocalMm, entranceWidthUm, exitWidthUm }
      : undefined;
  const points = input.wavelengthsNm.map((w) => prismPoint(material.sellmeier, apexRad, input.baseMm, w, mono));

  const warnings: SelectorWarning[] = [];
  const { validFromNm, validToNm } = material;
  if (validFromNm !== null && validToNm !== null) {
    const outside = input.wavelengthsNm.filter((w) => w < validFromNm || w > validToNm);
    if (outside.length > 0) {
      warnings.push({
        code: 'outside-data',
        message:
          `${listWavelengths(outside)} ${outside.length === 1 ? 'lies' : 'lie'} outside ${formatNumber(validFromNm, 5)}–` +
          `${formatNumber(validToNm, 5)} nm, where the coefficients for ${material.label} were fitted; the index there is extrapolated ` +
          'and the glass may absorb.',
      });
    }
  }
  const noIndex = points.filter((p) => p.index === null).map((p) => p.wavelengthNm);
  if (noIndex.length > 0) {
    warnings.push({
      code: 'no-index',
      message: `The Sellmeier formula gives no real index at ${listWavelengths(noIndex)} (n² ≤ 0, or at a resonance); check its B and C.`,
    });
  }
  const noPath = points.filter((p) => p.index !== null && p.minDeviationDeg === null).map((p) => p.wavelengthNm);
  if (noPath.length > 0) {
    warnings.push({
      code: 'no-path',
      message:
        `No ray passes a ${formatNumber(input.apexDeg, 4)}° prism at ${listWavelengths(noPath)}: n sin(A/2) ≥ 1 ` +
        '(total internal reflection at the second face). Use a smaller apex angle.',
    });
  }
  if (given > 0 && given < 4) {
    warnings.push({
      code: 'incomplete-monochromator',
      message:
        'The bandpass needs all four of collimatorFocalMm, cameraFocalMm, entranceWidthUm and exitWidthUm; ' +
        'with only some of them no bandpass is given.',
    });
  }
  return {
    kind: 'prism',
    material: {
      id: material.id,
      label: material.label,
      source: material.source,
      validFromNm: material.validFromNm,
      validToNm: material.validToNm,
    },
    points,
    warnings,
  };
}
