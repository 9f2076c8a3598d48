/**
 * Built-in calibration lamp lines: the strong lines of the neutral atoms (spectrum I) of the
 * pen-ray and hollow-cathode lamps a bench has (Hg, Ne, Ar, Kr, Na), about 250 to 1000 nm.
 *
 * SOURCE: NIST Atomic Spectra Database (ASD), lines of Hg I, Ne I, Ar I, Kr I and Na I.
 * MEDIUM: air (standard air; the ASD quotes air wavelengths from 200 nm to 2000 nm and converts
 * with the Peck & Reeder (1972) formula — features/solver/air-index.ts uses the same).
 *
 * TO BE VERIFIED: these values were transcribed from memory of the ASD tables (and of the
 * wavelengths lamp makers print from them), not copied from a download: the ASD could not be
 * reached when the list was written. The lines the product's tests name (Hg 576.9598 / 579.0663,
 * Na 588.9950 / 589.5924, Hg 253.652) are the best known; the rest should be checked line by line
 * against the ASD before anyone quotes a fourth decimal. Values are given to the decimals
 * remembered (three or four), never padded.
 *
 * `strength` is a rough class for choosing lines, not an ASD intensity: 'strong' lines dominate a
 * typical lamp's spectrum, 'medium' ones are clearly usable with a few seconds' exposure.
 */

export const LAMP_ELEMENTS = ['Hg', 'Ne', 'Ar', 'Kr', 'Na'] as const;
export type LampElement = (typeof LAMP_ELEMENTS)[number];

export const LAMP_ELEMENT_WORDS: Readonly<Record<LampElement, string>> = {
  Hg: 'mercury',
  Ne: 'neon',
  Ar: 'argon',
  Kr: 'krypton',
  Na: 'sodium',
};

export const LINE_STRENGTHS = ['strong', 'medium'] as const;
export type LineStrength = (typeof LINE_STRENGTHS)[number];

/** Where the numbers come from, for the sheet and the screen to print beside the list. */
export const LAMP_LINES_SOURCE =
  'NIST Atomic Spectra Database (neutral-atom lines), transcribed from memory and to be verified against the database';
/** The medium the built-in wavelengths are in. */
export const LAMP_LINES_MEDIUM = 'air' as const;

export interface LampLine {
  element: LampElement;
  /** Wavelength in standard air, nm. */
  wavelengthNm: number;
  strength: LineStrength;
  note?: string;
}

const line = (element: LampElement, wavelengthNm: number, strength: LineStrength, note?: string): LampLine =>
  note === undefined ? { element, wavelengthNm, strength } : { element, wavelengthNm, strength, note };

const HG: readonly LampLine[] = [
  line('Hg', 253.652, 'strong', 'resonance line, the strongest of a low-pressure lamp (UV-C: eye and skin hazard)'),
  line('Hg', 296.728, 'medium'),
  line('Hg', 302.15, 'medium'),
  line('Hg', 312.567, 'medium'),
  line('Hg', 313.155, 'medium', 'blends with 313.184 at bandpasses above about 0.03 nm'),
  line('Hg', 313.184, 'medium'),
  line('Hg', 334.148, 'medium'),
  line('Hg', 365.0153, 'strong', 'the i-line of photolithography'),
  line('Hg', 365.484, 'medium'),
  line('Hg', 366.328, 'medium'),
  line('Hg', 404.6563, 'strong', 'the h-line'),
  line('Hg', 407.783, 'medium'),
  line('Hg', 435.8328, 'strong', 'the g-line'),
  line('Hg', 491.607, 'medium'),
  line('Hg', 546.0735, 'strong', 'the green e-line'),
  line('Hg', 576.9598, 'strong', 'yellow pair, with 579.0663'),
  line('Hg', 579.0663, 'strong', 'yellow pair, with 576.9598'),
];

const NA: readonly LampLine[] = [
  line('Na', 330.237, 'medium'),
  line('Na', 330.298, 'medium'),
  line('Na', 568.263, 'medium'),
  line('Na', 568.821, 'medium'),
  line('Na', 588.995, 'strong', 'D2; the D pair needs a resolving power near 1000'),
  line('Na', 589.5924, 'strong', 'D1'),
  line('Na', 615.423, 'medium'),
  line('Na', 616.075, 'medium'),
  line('Na', 818.326, 'strong'),
  line('Na', 819.482, 'strong'),
];

const NE: readonly LampLine[] = [
  line('Ne', 540.056, 'medium'),
  line('Ne', 585.2488, 'strong', 'the brightest yellow line of a neon lamp'),
  line('Ne', 588.1895, 'strong'),
  line('Ne', 594.4834, 'strong'),
  line('Ne', 597.5534, 'medium'),
  line('Ne', 602.9997, 'medium'),
  line('Ne', 607.4338, 'strong'),
  line('Ne', 609.6163, 'strong'),
  line('Ne', 614.3063, 'strong'),
  line('Ne', 616.3594, 'medium'),
  line('Ne', 621.7281, 'medium'),
  line('Ne', 626.6495, 'strong'),
  line('Ne', 630.4789, 'medium'),
  line('Ne', 633.4428, 'strong'),
  line('Ne', 638.2992, 'strong'),
  line('Ne', 640.2248, 'strong', 'the strongest red line'),
  line('Ne', 650.6528, 'strong'),
  line('Ne', 659.8953, 'medium'),
  line('Ne', 667.8276, 'strong'),
  line('Ne', 671.7043, 'medium'),
  line('Ne', 692.9467, 'strong'),
  line('Ne', 703.2413, 'strong'),
  line('Ne', 717.3938, 'medium'),
  line('Ne', 724.5167, 'strong'),
  line('Ne', 743.8899, 'medium'),
  line('Ne', 748.8871, 'medium'),
  line('Ne', 753.5774, 'medium'),
  line('Ne', 754.4044, 'medium'),
  line('Ne', 837.7606, 'strong'),
  line('Ne', 849.536, 'strong'),
  line('Ne', 865.4383, 'strong'),
  line('Ne', 878.0621, 'medium'),
  line('Ne', 885.3867, 'medium'),
];

const AR: readonly LampLine[] = [
  line('Ar', 404.442, 'medium'),
  line('Ar', 415.859, 'medium'),
  line('Ar', 419.832, 'medium'),
  line('Ar', 420.067, 'medium'),
  line('Ar', 425.936, 'medium'),
  line('Ar', 427.217, 'medium'),
  line('Ar', 430.01, 'medium'),
  line('Ar', 433.356, 'medium'),
  line('Ar', 451.073, 'medium'),
  line('Ar', 696.5431, 'strong'),
  line('Ar', 706.7218, 'strong'),
  line('Ar', 714.7042, 'medium'),
  line('Ar', 727.2936, 'strong'),
  line('Ar', 738.398, 'strong'),
  line('Ar', 750.3869, 'strong'),
  line('Ar', 751.4652, 'strong'),
  line('Ar', 763.5106, 'strong', 'the strongest line of an argon lamp'),
  line('Ar', 772.3761, 'strong', 'pair with 772.4207, 0.045 nm apart'),
  line('Ar', 772.4207, 'medium'),
  line('Ar', 794.8176, 'strong'),
  line('Ar', 800.6157, 'strong'),
  line('Ar', 801.4786, 'strong'),
  line('Ar', 810.3693, 'strong'),
  line('Ar', 811.5311, 'strong'),
  line('Ar', 826.4522, 'strong'),
  line('Ar', 840.821, 'strong'),
  line('Ar', 842.4648, 'strong'),
  line('Ar', 852.1442, 'strong'),
  line('Ar', 866.7944, 'medium'),
  line('Ar', 912.2967, 'strong'),
  line('Ar', 922.4499, 'strong'),
  line('Ar', 965.7786, 'strong'),
];

const KR: readonly LampLine[] = [
  line('Kr', 427.397, 'medium'),
  line('Kr', 431.958, 'medium'),
  line('Kr', 437.612, 'medium'),
  line('Kr', 446.369, 'medium'),
  line('Kr', 450.235, 'medium'),
  line('Kr', 557.0289, 'strong'),
  line('Kr', 587.0915, 'strong'),
  line('Kr', 758.7413, 'strong'),
  line('Kr', 760.1545, 'strong'),
  line('Kr', 768.5246, 'medium'),
  line('Kr', 769.4538, 'medium'),
  line('Kr', 785.482, 'medium'),
  line('Kr', 805.9503, 'medium'),
  line('Kr', 810.4364, 'strong'),
  line('Kr', 811.2899, 'strong'),
  line('Kr', 819.0057, 'medium'),
  line('Kr', 826.324, 'strong'),
  line('Kr', 829.8108, 'strong'),
  line('Kr', 850.887, 'strong'),
  line('Kr', 877.6748, 'strong'),
  line('Kr', 892.8692, 'medium'),
];

/** Every built-in line, grouped by element, each group in increasing wavelength. */
export const LAMP_LINES: Readonly<Record<LampElement, readonly LampLine[]>> = {
  Hg: HG,
  Ne: NE,
  Ar: AR,
  Kr: KR,
  Na: NA,
};
