import { selectorAnswerSchema } from '../selector-answers';
import { SELECTOR_LIMITS, selectorInputSchema } from '../selectors';
import { route } from './route';

/** The simpler wavelength selectors' calculators for scripts and other tools: the maths the selectors screens run. */
export const selectors = {
  run: route({
    tag: 'Solver',
    method: 'POST',
    path: '/selectors',
    summary: 'Calculate an interference (Fabry–Pérot) filter, an absorption filter stack or a prism, chosen by `kind`',
    description:
      'No sign-in and no Origin header needed. `kind` chooses the calculator and the answer has the same `kind`:\n\n' +
      '- `interference-filter`: `targetNm`, `order`, `spacerIndex`, `mirrorReflectance`, optional `effectiveIndex` and `tiltsDeg`, ' +
      '`rangeNm: { startNm, endNm }` → `spacerThicknessNm`, `peaksNm` (every peak in the range), `finesse`, `freeSpectralRangeNm`, ' +
      '`fwhmNm`, `tilt: [{ tiltDeg, peakNm }]`.\n' +
      '- `absorption-stack`: `filters` (each a long-pass or band-pass coloured-glass edge at a reference thickness, used at `thicknessMm`), ' +
      '`wavelengthsNm` → `points: [{ wavelengthNm, transmission }]`, `peakTransmission`.\n' +
      '- `prism`: `material` (`fused-silica`, `calcium-fluoride`, `borosilicate-crown`, or `{ "sellmeier": { "B": [..], "C": [..] } }` ' +
      'with C the resonance wavelengths in µm), `apexDeg`, `baseMm`, `wavelengthsNm`, optional focal lengths and slits → ' +
      '`points: [{ wavelengthNm, index, dnDlambdaPerNm, minDeviationDeg, angularDispersionDegPerNm, resolvingPower, bandpassNm, reason }]`.\n\n' +
      `At most ${SELECTOR_LIMITS.maxWavelengths} wavelengths, ${SELECTOR_LIMITS.maxTilts} tilts, ${SELECTOR_LIMITS.maxStackFilters} filters ` +
      `and ${SELECTOR_LIMITS.maxSellmeierTerms} Sellmeier terms; at most ${SELECTOR_LIMITS.maxListedPeaks} peaks listed, those around the target (\`peakCount\` counts them all). ` +
      'A bad field is a 400 naming it (`filters.0.thicknessMm`). Each call is bounded by these limits and cheap, so ' +
      '60 calls a minute per address, then 429 `rate_limited`.',
    access: { kind: 'anyone' },
    originExempt: true,
    body: selectorInputSchema,
    output: selectorAnswerSchema,
  }),
};
