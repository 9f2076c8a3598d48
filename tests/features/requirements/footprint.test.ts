import { describe, expect, it } from 'vitest';
import { checkRequirements, designFootprintMm } from '@/features/requirements';
import { expectClose } from '../solver/close-to';
import { makeDesign } from '../solver/fixtures';
import { littrowDesign } from './littrow-fixture';

const deg = (d: number) => (d * Math.PI) / 180;

/**
 * The spec's 0.3 m Czerny–Turner (1200/mm, 2K = 30°) without its own off-axis angles, so the
 * sketch folds each mirror by θ = K and puts both slits level with the grating (sketch geometry's
 * stated default); no detector, so the exit slit is the last element. The sketch sizes the camera
 * mirror to catch every drawn wavelength, so a narrow range (590–610 nm) keeps it inside the slits.
 */
function unfoldedCzernyTurner() {
  const design = makeDesign({ detector: undefined, range: { startNm: 590, endNm: 610 } });
  delete design.layout.collimatorOffAxisDeg;
  delete design.layout.cameraOffAxisDeg;
  return design;
}

describe('designFootprintMm', () => {
  it('an unfolded Czerny–Turner: width 4f sin K plus the slits, depth f cos K plus the grating block', () => {
    const f = 300;
    const K = deg(15);
    // Grating turned to the centre, 600 nm: mλ = 2d cos K sin φ, sin φ = 600 / (2 × 833.33 × cos 15°).
    const phi = Math.asin(600 / ((2 * 1e6) / 1200) / Math.cos(K));
    // Mirrors sit f from the grating at bisector ± K; each slit f beyond its mirror, folded by 2K,
    // lands at (∓2f sin K, 0). Each 0.1 mm slit lies square to its last leg, adding 0.05 cos K.
    const width = 4 * f * Math.sin(K) + 2 * 0.05 * Math.cos(K);
    // Top: both mirrors' surfaces face straight down (θ = K), their highest point the chief-ray
    // hit at f cos K. Bottom: the grating's back corner, 25 sin φ below the face's end and the
    // substrate (drawn 0.18 × 50 = 9 mm deep) 9 cos φ further.
    const depth = f * Math.cos(K) + 25 * Math.sin(phi) + 9 * Math.cos(phi);
    const footprint = designFootprintMm(unfoldedCzernyTurner());
    expectClose(footprint.widthMm, width, 1e-9);
    // The sketch draws each mirror as one quadratic curve through its ends and middle, which
    // matches the circle to a few µm here.
    expectClose(footprint.depthMm, depth, 1e-4);
  });

  it('a mirror sized for a wide range widens the outline (the camera catches 300–900 nm)', () => {
    const wide = unfoldedCzernyTurner();
    wide.range = { startNm: 300, endNm: 900 };
    expect(designFootprintMm(wide).widthMm).toBeGreaterThan(designFootprintMm(unfoldedCzernyTurner()).widthMm + 50);
  });

  it('a Littrow mount lies along the bisector: depth (2f to the slits) beyond its width', () => {
    // One lens f = 500 mm along the bisector, the slits f beyond it: at least 1000 mm deep.
    const footprint = designFootprintMm(littrowDesign());
    expect(footprint.depthMm).toBeGreaterThan(1000);
    expect(footprint.widthMm).toBeLessThan(footprint.depthMm / 4);
  });

  it('fails the footprint requirement just past the outline and passes just inside it', () => {
    const design = unfoldedCzernyTurner();
    const { widthMm, depthMm } = designFootprintMm(design);
    const fits = checkRequirements({ ...design, requirements: { maxFootprintMm: { widthMm: widthMm + 0.1, depthMm: depthMm + 0.1 } } });
    expect(fits.checks[0]?.status).toBe('pass');
    const tooDeep = checkRequirements({ ...design, requirements: { maxFootprintMm: { widthMm: 1000, depthMm: depthMm - 0.1 } } });
    const check = tooDeep.checks[0];
    expect(check?.status).toBe('fail');
    expect(check?.worst).toBe(depthMm);
    expect(check?.message).toMatch(/^footprint depth .* over \(width .* fits\)$/);
    expect(check?.fixPath).toBe('layout.collimatorFocalMm');
  });
});
