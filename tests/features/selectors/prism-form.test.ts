import { beforeAll, describe, expect, it } from 'vitest';
import { loadUnitParser, prismMonochromator } from '../../../features/solver';
import { PRISM_DEFAULTS, checkPrism, missingMonochromatorFields, type PrismText } from '../../../features/selectors/prism-form';
import { bandpassSpread } from '../../../features/selectors/prism-series';

// mathjs loads in seconds, but a machine shared by several test runs has taken over 10 s.
beforeAll(loadUnitParser, 60_000);

const withText = (patch: Partial<PrismText>): PrismText => ({ ...PRISM_DEFAULTS, ...patch });

describe('the prism calculator', () => {
  it('makes the API input from the defaults, with the four monochromator fields', () => {
    const check = checkPrism(PRISM_DEFAULTS);
    expect(check.ok).toBe(true);
    if (!check.ok) return;
    expect(check.input.material).toBe('fused-silica');
    expect(check.input.wavelengthsNm[0]).toBe(350);
    expect(check.input.wavelengthsNm.at(-1)).toBe(1000);
    expect(check.input.exitWidthUm).toBe(50);
  });

  it('sends a formula of one’s own as its B and C lists', () => {
    const check = checkPrism(withText({ material: 'custom' }));
    expect(check.ok && check.input.material).toEqual({
      sellmeier: { B: [0.6961663, 0.4079426, 0.8974794], C: [0.0684043, 0.1162414, 9.896161] },
    });
  });

  it('puts the schema’s refusals on the fields, naming them', () => {
    const apex = checkPrism(withText({ apexDeg: '180' }));
    expect(!apex.ok && apex.errors.apexDeg).toBe('Apex angle must be less than 180°');
    const lists = checkPrism(withText({ material: 'custom', sellmeierC: '0.07, 0.12' }));
    expect(!lists.ok && lists.errors.sellmeierC).toBe(
      'Sellmeier C (µm) must list as many resonance wavelengths as B has coefficients',
    );
    const slit = checkPrism(withText({ exitWidthUm: '0' }));
    expect(!slit.ok && slit.errors.exitWidthUm).toBe('Exit slit must be greater than 0');
  });

  it('ignores the Sellmeier lists for a built-in material', () => {
    expect(checkPrism(withText({ sellmeierB: 'nonsense' })).ok).toBe(true);
  });

  it('names the monochromator fields still blank once some are filled', () => {
    expect(missingMonochromatorFields(PRISM_DEFAULTS)).toEqual([]);
    const blankAll = withText({ collimatorFocalMm: '', cameraFocalMm: '', entranceWidthUm: '', exitWidthUm: '' });
    expect(missingMonochromatorFields(blankAll)).toEqual([]);
    expect(missingMonochromatorFields(withText({ exitWidthUm: '' })).map((f) => f.label)).toEqual(['Exit slit']);
  });

  it('shows the prism’s non-linear dispersion: the bandpass at 1000 nm is several times that at 350 nm', () => {
    // Fused silica's dn/dλ is about −9.4×10⁻⁵/nm near 420 nm ((1.46669 − 1.46961)/31.1 nm) and
    // −1.4×10⁻⁵/nm near 930 nm ((1.45024 − 1.45247)/162 nm), Malitson 1965's table from memory:
    // a ratio near 7 over a shorter span, so more than 5 from 350 to 1000 nm.
    const check = checkPrism(PRISM_DEFAULTS);
    if (!check.ok) throw new Error('defaults refused');
    const spread = bandpassSpread(prismMonochromator(check.input).points);
    expect(spread?.ratio).toBeGreaterThan(5);
    expect(spread!.endNm).toBeGreaterThan(spread!.startNm);
  });

  it('has no spread without a bandpass', () => {
    expect(bandpassSpread([])).toBeNull();
  });
});
