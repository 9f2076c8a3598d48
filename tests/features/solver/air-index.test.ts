import * as fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  AIR_WAVELENGTHS_FROM_NM,
  airIndex,
  airToVacuumNm,
  edlen1966Refractivity,
  peckReederRefractivity,
  vacuumToAirNm,
} from '@/features/solver/air-index';
import { expectClose } from './close-to';

describe('refractivity of standard air', () => {
  it('Peck & Reeder (1972) at 500 nm vacuum, by hand', () => {
    // σ = 1000/500 = 2 µm⁻¹, σ² = 4 (J. Opt. Soc. Am. 62, 958; hand computation):
    //   2 480 990 / (132.274 − 4) = 2 480 990 / 128.274  = 19 341.3318
    //   17 455.7  / (39.32957 − 4) = 17 455.7 / 35.32957 =    494.0819
    //   8060.51 + 19 341.3318 + 494.0819 = 27 895.9237  →  n − 1 = 2.789592 × 10⁻⁴
    expectClose(peckReederRefractivity(500), 2.789592e-4, 0, 1e-10);
    expectClose(airIndex(500), 1.0002789592, 0, 1e-10);
  });

  it('Edlén (1966) at 500 nm vacuum, by hand, agrees with Peck & Reeder to 10⁻⁹', () => {
    // Metrologia 2, 71: 2 406 030/126 = 19 095.476; 15 997/34.9 = 458.367;
    //   8342.13 + 19 095.476 + 458.367 = 27 895.973  →  n − 1 = 2.789597 × 10⁻⁴
    expectClose(edlen1966Refractivity(500), 2.789597e-4, 0, 1e-10);
    expect(Math.abs(edlen1966Refractivity(500) - peckReederRefractivity(500))).toBeLessThan(1e-9);
  });

  it.each([250, 300, 400, 589, 700, 1000, 1600])(
    'the two published formulas agree to 5 × 10⁻⁹ in n at %d nm (two independent fits to the same air)',
    (nm) => {
      // Hand evaluation of both at 50 nm steps: the largest gap is 4.5 × 10⁻⁹, at 1600 nm.
      expect(Math.abs(edlen1966Refractivity(nm) - peckReederRefractivity(nm))).toBeLessThan(5e-9);
    },
  );

  it('is the familiar 1.00028 in the visible, larger in the UV (common practice)', () => {
    expectClose(airIndex(589.3), 1.000277, 0, 1e-6);
    expect(airIndex(300)).toBeGreaterThan(airIndex(600));
  });

  it('is 1 below 200 nm (NIST ASD lists vacuum wavelengths there) and for nonsense input', () => {
    expect(AIR_WAVELENGTHS_FROM_NM).toBe(200);
    for (const nm of [150, 86.9, 0, -5, Number.NaN, Number.POSITIVE_INFINITY]) expect(airIndex(nm)).toBe(1);
    expect(vacuumToAirNm(150)).toBe(150);
    expect(airToVacuumNm(150)).toBe(150);
  });
});

describe('air ↔ vacuum wavelengths', () => {
  it.each([
    // NIST ASD pairs, from memory: Na I D2 and D1, the Hg I resonance line.
    { name: 'Na D2', airNm: 588.995, vacuumNm: 589.1583 },
    { name: 'Na D1', airNm: 589.5924, vacuumNm: 589.7558 },
    { name: 'Hg 253.65', airNm: 253.652, vacuumNm: 253.7283 },
  ] satisfies { name: string; airNm: number; vacuumNm: number }[])(
    '$name: $airNm nm in air is $vacuumNm nm in vacuum (within 0.0005 nm)',
    ({ airNm, vacuumNm }) => {
      expectClose(airToVacuumNm(airNm), vacuumNm, 0, 5e-4);
      expectClose(vacuumToAirNm(vacuumNm), airNm, 0, 5e-4);
    },
  );

  it('Hg 546.0735 nm in air is 546.2253 nm in vacuum: λ·(n − 1) with n − 1 = 2.7790 × 10⁻⁴, by hand', () => {
    // Peck & Reeder at the vacuum wavelength (hand computation): σ = 1/0.5462253 µm⁻¹,
    // σ² = 3.351633; 2 480 990/128.922367 = 19 244.06; 17 455.7/35.977937 = 485.18;
    // n − 1 = (8060.51 + 19 244.06 + 485.18) × 10⁻⁸ = 2.778975 × 10⁻⁴; 546.0735 × 1.0002778975 =
    // 546.22525. (A vacuum value of 546.2260 nm remembered for the ASD is 0.0007 nm off every
    // standard-air formula, so it is not used here.)
    expectClose(airToVacuumNm(546.0735), 546.22525, 0, 2e-5);
  });

  it('round-trips to under 10⁻⁹ nm from 200 nm to 20 µm', () => {
    fc.assert(
      fc.property(fc.double({ min: 200.1, max: 20_000, noNaN: true }), (vacuumNm) => {
        expect(Math.abs(airToVacuumNm(vacuumToAirNm(vacuumNm)) - vacuumNm)).toBeLessThan(1e-9);
      }),
    );
  });

  it('always makes the air wavelength the shorter one above 200 nm', () => {
    for (const nm of [250, 500, 1000]) expect(vacuumToAirNm(nm)).toBeLessThan(nm);
  });
});
