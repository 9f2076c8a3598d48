import { beforeAll, describe, expect, it } from 'vitest';
import { designInterferenceFilter, loadUnitParser } from '../../../features/solver';
import { THIN_FILM_DEFAULTS, checkThinFilm, thinFilmCurve, type ThinFilmText } from '../../../features/selectors/thin-film-form';

// mathjs loads in seconds, but a machine shared by several test runs has taken over 10 s.
beforeAll(loadUnitParser, 60_000);

const withText = (patch: Partial<ThinFilmText>): ThinFilmText => ({ ...THIN_FILM_DEFAULTS, ...patch });

function errorsOf(text: ThinFilmText) {
  const check = checkThinFilm(text);
  expect(check.ok).toBe(false);
  return check.ok ? {} : check.errors;
}

describe('the thin-film filter calculator', () => {
  it('makes the API input from the defaults, with the tilts spread from the first to the last angle', () => {
    const check = checkThinFilm(THIN_FILM_DEFAULTS);
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.input.rangeNm).toEqual({ startNm: 350, endNm: 800 });
    expect(check.input.tiltsDeg?.[0]).toBe(0);
    expect(check.input.tiltsDeg?.at(-1)).toBe(30);
    expect(check.input.effectiveIndex).toBe(1.8);
  });

  it('reads units: a target of 0.55 µm is 550 nm', () => {
    const check = checkThinFilm(withText({ targetNm: '0.55 um' }));
    expect(check.ok && check.input.targetNm).toBeCloseTo(550, 9);
  });

  it('puts each of the schema’s refusals on the field that shows it, naming the field', () => {
    expect(errorsOf(withText({ mirrorReflectance: '1' })).mirrorReflectance).toBe(
      'Mirror reflectance must be less than 1 (a fraction: 0.9 means 90 %)',
    );
    expect(errorsOf(withText({ order: '0' })).order).toBe('Order must be a whole number from 1 to 1000');
    expect(errorsOf(withText({ spacerIndex: '0.5' })).spacerIndex).toBe('Spacer index must be at least 1');
    expect(errorsOf(withText({ tiltToDeg: '95' })).tiltToDeg).toBe('Tilt to must be at most 89°');
    expect(errorsOf(withText({ tiltFromDeg: '-5' })).tiltFromDeg).toBe('Tilt from must be at least 0°');
  });

  it('refuses a range that ends before it starts on the range end', () => {
    expect(errorsOf(withText({ endNm: '300' })).endNm).toBe('Range end must be greater than the range start');
  });

  it('leaves the effective index out when it is blank (the solver then uses the spacer index)', () => {
    const check = checkThinFilm(withText({ effectiveIndex: '' }));
    expect(check.ok && 'effectiveIndex' in check.input).toBe(false);
  });

  it('draws every peak at its full height, even one far narrower than the grid step', () => {
    // Order 200 at 550 nm with R = 0.99: finesse π√0.99/0.01 = 312.6, FSR = 550/200 = 2.75 nm,
    // FWHM = 2.75/312.6 = 0.0088 nm (Hecht, Optics, §9.6) against a 0.75 nm grid step; a lossless
    // Airy function is exactly 1 at each peak.
    const check = checkThinFilm(withText({ order: '200', mirrorReflectance: '0.99', startNm: '545', endNm: '555' }));
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    const answer = designInterferenceFilter(check.input);
    const curve = thinFilmCurve(check.input, answer);
    for (const peakNm of answer.peaksNm) {
      const i = curve.xs.findIndex((x) => Math.abs(x - peakNm) < 1e-9 * peakNm);
      expect(i).toBeGreaterThanOrEqual(0);
      expect(curve.ys[i]).toBeCloseTo(1, 6);
    }
    // 2nt = mλ = 110 000 nm; peaks 110000/k in 545–555 nm: k = 199, 200, 201 (hand count).
    expect(answer.peaksNm.length).toBe(3);
  });

  it('finds the default’s second peak: 2nt = 2 × 550 = 1100 nm, so 1100/3 = 366.7 nm lies in 350–800 nm', () => {
    const check = checkThinFilm(THIN_FILM_DEFAULTS);
    if (!check.ok) throw new Error('defaults refused');
    const answer = designInterferenceFilter(check.input);
    expect(answer.peaksNm.map((p) => Math.round(p * 10) / 10)).toEqual([366.7, 550]);
    expect(answer.warnings.map((w) => w.code)).toContain('other-peaks');
  });
});
