/**
 * The simpler wavelength selectors' calculators from the command line, for lab scripts:
 *
 *   npm run --silent selectors -- <input.json | ->
 *
 * The input is the body of POST /api/selectors: `kind` (interference-filter, absorption-stack or
 * prism) and that calculator's fields. Prints the answer JSON on stdout. Exit 2 with one
 * `path: message` line per bad field on stderr for bad flags, unreadable or invalid JSON, or
 * input the schema rejects (the same schema and limits as the HTTP route).
 */

import { realpathSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { runSelector } from '../features/solver/selectors';
import { PRISM_MATERIAL_IDS, SELECTOR_LIMITS, selectorInputSchema, type SelectorAnswer } from '../shared/selectors';
import { fieldErrors, formatFieldErrors } from '../shared/validation';
import { parseInputArgs, parseInputJson, runJsonCommand, type InputArgs, type JsonOutcome } from './json-input';
import { runCommand } from './run-command';

// The examples are written out as JSON so the help shows exactly what a file holds (a test parses
// each one and runs it).
export const EXAMPLES = {
  'interference-filter': {
    kind: 'interference-filter',
    targetNm: 500,
    order: 1,
    spacerIndex: 1.5,
    mirrorReflectance: 0.9,
    tiltsDeg: [0, 10, 20],
    rangeNm: { startNm: 300, endNm: 1100 },
  },
  'absorption-stack': {
    kind: 'absorption-stack',
    filters: [
      {
        shape: 'long-pass',
        edgeNm: 420,
        edgeWidthNm: 20,
        peakInternalTransmission: 0.95,
        referenceThicknessMm: 3,
        thicknessMm: 6,
        refractiveIndex: 1.52,
      },
    ],
    wavelengthsNm: [400, 420, 450, 500],
  },
  prism: { kind: 'prism', material: 'fused-silica', apexDeg: 60, baseMm: 50, wavelengthsNm: [400, 587.6, 700] },
} as const;

const example = (kind: keyof typeof EXAMPLES) => JSON.stringify(EXAMPLES[kind]);

export const USAGE = `usage: npm run --silent selectors -- <input.json | ->
The input is POST /api/selectors's body; "kind" chooses the calculator. Prints the answer JSON
(with the same "kind" and a "warnings" list of { code, message }). Exit 0 with the answer, 2 with
one "field: reason" line per bad field on stderr (this help, too, goes to stderr with exit 2).

kind "interference-filter" (Fabry–Pérot; Hecht, Optics)
  in:  targetNm           peak wavelength at normal incidence, nm
       order              interference order m, 1 to 1000
       spacerIndex        spacer refractive index n, 1 to 5
       mirrorReflectance  each mirror's reflectance R, a fraction between 0 and 1
       effectiveIndex     optional n_eff for tilt tuning (default: spacerIndex)
       tiltsDeg           optional list of tilts from the normal, 0 to 89°, at most ${SELECTOR_LIMITS.maxTilts}
       rangeNm            { startNm, endNm }: where to list every transmission peak
  out: spacerThicknessNm  t = mλ/(2n)
       peaksNm            every peak 2nt/k in rangeNm, ascending; past ${SELECTOR_LIMITS.maxListedPeaks}, the ${SELECTOR_LIMITS.maxListedPeaks} around
                          the target (peakCount counts them all, peaksTruncated says the list was cut)
       finesse            π√R/(1 − R)
       freeSpectralRangeNm  λ/m at the target
       fwhmNm             freeSpectralRangeNm / finesse
       tilt               [{ tiltDeg, peakNm }], λ(θ) = λ₀ √(1 − (sin θ / n_eff)²)
  e.g. ${example('interference-filter')}

kind "absorption-stack" (coloured-glass filters in series; Beer–Lambert)
  in:  filters            1 to ${SELECTOR_LIMITS.maxStackFilters} filters, each { shape ("long-pass" or "band-pass"), edgeNm,
                          upperEdgeNm (band-pass only), edgeWidthNm (10–90 %), peakInternalTransmission,
                          referenceThicknessMm, thicknessMm, refractiveIndex }
       wavelengthsNm      1 to ${SELECTOR_LIMITS.maxWavelengths} wavelengths, nm
  out: points             [{ wavelengthNm, transmission }]: the product over the filters of the
                          internal transmittance (a logistic edge below a plateau) scaled as
                          T_ref^(t/t_ref), times (1 − ((n−1)/(n+1))²)² for the two surfaces
       peakTransmission   the highest transmission among the points
  e.g. ${example('absorption-stack')}

kind "prism" (at minimum deviation; Born & Wolf, Hecht)
  in:  material           ${PRISM_MATERIAL_IDS.map((id) => `"${id}"`).join(', ')}, or
                          { "sellmeier": { "B": [..], "C": [..] } }: n² − 1 = Σ B λ²/(λ² − C²), λ and
                          the resonance wavelengths C in µm (Malitson's form), at most ${SELECTOR_LIMITS.maxSellmeierTerms} terms
       apexDeg            apex angle, above 0 and below 180°
       baseMm             base length b, mm
       wavelengthsNm      1 to ${SELECTOR_LIMITS.maxWavelengths} wavelengths, nm
       collimatorFocalMm, cameraFocalMm, entranceWidthUm, exitWidthUm
                          optional: with all four, each point gains bandpassNm
  out: material           { id, label, source, validFromNm, validToNm }
       points             [{ wavelengthNm, index, dnDlambdaPerNm, minDeviationDeg,
                          angularDispersionDegPerNm, resolvingPower (b |dn/dλ|), bandpassNm, reason }];
                          null figures with a reason where the formula gives no real index
                          or the prism passes no light (past total internal reflection)
  e.g. ${example('prism')}

The same schema and limits as POST /api/selectors.`;

export type SelectorsArgs = InputArgs;

/** Reads the command line (without `node` and the script); throws a `UsageError` naming what is wrong. */
export const parseSelectorsArgs = parseInputArgs;

export type SelectorsOutcome = JsonOutcome<SelectorAnswer>;

/** Parses the input JSON read from `args.input`, checks it with the HTTP API's schema, and calculates. */
export function selectorsInput(text: string, args: SelectorsArgs): SelectorsOutcome {
  const read = parseInputJson(text, args.input);
  if (!read.ok) return read;
  const input = selectorInputSchema.safeParse(read.json);
  if (!input.success) return { ok: false, message: formatFieldErrors(fieldErrors(input.error)) };
  return { ok: true, answer: runSelector(input.data) };
}

/** The command: 0 with the answer on stdout, 2 with the reason on stderr. */
export function main(argv: readonly string[] = process.argv.slice(2)): Promise<number> {
  return runJsonCommand(argv, USAGE, parseSelectorsArgs, selectorsInput);
}

// Run only as the script, so tests can import the functions above.
if (process.argv[1] !== undefined && realpathSync(process.argv[1]) === realpathSync(fileURLToPath(import.meta.url))) {
  runCommand(() => main());
}
