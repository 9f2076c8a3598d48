/**
 * Blazebook's wavelength → stroke map for drawings on warm paper (`#F4F1EA`). Visible light runs
 * through moderate-saturation hues darkened where the eye is most sensitive (yellow–green), so
 * every stroke keeps at least 3:1 contrast with the paper; light outside the visible band gets
 * its own colour and a dash pattern, so it reads as "not seen" even in greyscale print.
 * Pure: no React, no platform code (the server's PDF sheet uses it too).
 */

import { hsl } from 'd3-color';

/** Below this the sketch draws ultraviolet, nm (common practice: 380–750 nm visible). */
export const VISIBLE_MIN_NM = 380;
/** Above this the sketch draws infrared, nm. */
export const VISIBLE_MAX_NM = 750;

export type SpectralBand = 'ultraviolet' | 'visible' | 'infrared';

export interface WavelengthStroke {
  /** `#rrggbb`. */
  stroke: string;
  /** SVG `stroke-dasharray` in user units (px at scale 1), or null for a solid stroke. */
  dash: string | null;
  band: SpectralBand;
}

const ULTRAVIOLET: WavelengthStroke = { stroke: '#655C86', dash: '5 3', band: 'ultraviolet' };
const INFRARED: WavelengthStroke = { stroke: '#7D1E22', dash: '8 3 1.5 3', band: 'infrared' };

/** Hue stops (degrees on the HSL wheel) through the visible band; our own choice of anchors. */
const HUE_STOPS: readonly (readonly [nm: number, hueDeg: number])[] = [
  [380, 272],
  [440, 232],
  [485, 196],
  [520, 140],
  [570, 62],
  [600, 36],
  [640, 14],
  [700, 356],
  [750, 346],
];

export function spectralBand(wavelengthNm: number): SpectralBand {
  if (wavelengthNm < VISIBLE_MIN_NM) return 'ultraviolet';
  if (wavelengthNm > VISIBLE_MAX_NM) return 'infrared';
  return 'visible';
}

/** The stroke colour and dash pattern for light of `wavelengthNm`. */
export function wavelengthStroke(wavelengthNm: number): WavelengthStroke {
  const band = spectralBand(wavelengthNm);
  if (band === 'ultraviolet' || !(wavelengthNm === wavelengthNm)) return ULTRAVIOLET;
  if (band === 'infrared') return INFRARED;
  const hue = hueAt(wavelengthNm);
  // Yellow and green look far brighter than blue or red at the same HSL lightness: darken them
  // so they stay readable on paper (a smooth dip centred on 540 nm, wide enough for cyan).
  const dip = Math.exp(-(((wavelengthNm - 540) / 70) ** 2));
  const lightness = 0.44 - 0.15 * dip;
  return { stroke: hsl(hue, 0.62, lightness).formatHex(), dash: null, band };
}

function hueAt(wavelengthNm: number): number {
  for (let i = 1; i < HUE_STOPS.length; i++) {
    const [nm1, h1] = HUE_STOPS[i] as readonly [number, number];
    if (wavelengthNm <= nm1) {
      const [nm0, h0] = HUE_STOPS[i - 1] as readonly [number, number];
      // Interpolate the short way round the wheel (the red end wraps through 360°).
      let delta = h1 - h0;
      if (delta > 180) delta -= 360;
      if (delta < -180) delta += 360;
      const hue = h0 + (delta * (wavelengthNm - nm0)) / (nm1 - nm0);
      return (hue + 360) % 360;
    }
  }
  return HUE_STOPS[HUE_STOPS.length - 1]?.[1] ?? 0;
}
