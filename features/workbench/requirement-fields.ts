import { z } from 'zod';
import { parseQuantity } from '@/features/solver';
import type { Requirements } from '@/shared/requirements';
import { BANDPASS_BASES, ORDER_OVERLAP_POLICIES, requirementWords } from '@/shared/requirements';
import { formatMachineNumber } from '@/shared/format';
import type { FieldErrors } from '@/shared/validation';

/**
 * The requirements as the editor holds them: text as typed, like the design's own fields. The
 * footprint nests a level further so its two fields keep the design's paths
 * (`requirements.maxFootprintMm.widthMm`), which the "fix" links and error messages name.
 */
export type RequirementsText = {
  maxBandpassNm: string;
  /** '' is "slit-limited" (the default); a stored 'slit-limited' is kept as typed. */
  bandpassBasis: '' | (typeof BANDPASS_BASES)[number];
  minResolvingPower: string;
  atWavelengthsNm: string;
  minBlazeEfficiency: string;
  minRelativeThroughput: string;
  maxFNumber: string;
  maxFocalLengthMm: string;
  maxFootprintMm: { widthMm: string; depthMm: string };
  minPixelsPerBandpass: string;
  /** '' (not asked), 'true' or 'false' — the stored yes/no kept exactly, shown as off/on. */
  oneShotCoverage: '' | 'true' | 'false';
  maxWavelengthErrorNm: string;
  driveStepArcsec: string;
  maxReciprocalDispersionNmPerMm: string;
  /** '' is "not checked". */
  orderOverlap: '' | (typeof ORDER_OVERLAP_POLICIES)[number];
};

/** How one typed requirement reads: a length, a list of lengths, a plain number, or a fraction typed as one or in percent. */
export type RequirementReading = 'nm' | 'mm' | 'nm-list' | 'number' | 'fraction' | 'arcsec' | 'nm/mm';

export type RequirementFieldSpec = {
  /** Dotted path into the design: `requirements.maxBandpassNm`. */
  path: string;
  /** Key inside `requirements` (`maxFootprintMm.widthMm` for the footprint's two). */
  key: keyof typeof requirementWords;
  label: string;
  reading: RequirementReading;
  /** Printed after the field while the text names no unit of its own. */
  unitLabel?: string;
  help: string;
};

function spec(key: RequirementFieldSpec['key'], reading: RequirementReading, help: string, unitLabel?: string): RequirementFieldSpec {
  return { path: `requirements.${key}`, key, label: requirementWords[key].label, reading, help, ...(unitLabel ? { unitLabel } : {}) };
}

/** The typed requirement fields in the editor's order; the two choices are shown on their own. */
export const requirementTextFields: readonly RequirementFieldSpec[] = [
  spec('maxBandpassNm', 'nm', 'Largest FWHM bandpass, e.g. 0.5 nm or 5 Å; slit-limited or traced as chosen below.', 'nm'),
  spec('minResolvingPower', 'number', 'Smallest λ/Δλ, e.g. 2000.'),
  spec(
    'atWavelengthsNm',
    'nm-list',
    'Where bandpass, resolving power, efficiency and sampling are checked, comma-separated (404.7, 546.1 nm). Empty: across the whole range.',
    'nm',
  ),
  spec(
    'minBlazeEfficiency',
    'fraction',
    'Relative to the blaze peak: type a percent (40 %) or a fraction (0.4); stored as a fraction.',
  ),
  spec(
    'minRelativeThroughput',
    'fraction',
    'Grating × mirrors × filter × detector × input, as the light budget counts them: a percent (20 %) or a fraction (0.2).',
  ),
  spec('maxFNumber', 'number', 'The slower of the collimator’s width and height f-numbers, e.g. 4.'),
  spec('maxFocalLengthMm', 'mm', 'The longer of the collimator and camera focal lengths.', 'mm'),
  spec('maxFootprintMm.widthMm', 'mm', 'Across the instrument (the sketch’s horizontal).', 'mm'),
  spec('maxFootprintMm.depthMm', 'mm', 'Along the bisector (the sketch’s vertical).', 'mm'),
  spec('minPixelsPerBandpass', 'number', 'Detector pixels across one bandpass; 2 is Nyquist (common practice).'),
  spec('maxWavelengthErrorNm', 'nm', 'Wavelength error from one drive step; give the drive step too.', 'nm'),
  spec('driveStepArcsec', 'arcsec', 'The scan drive’s smallest step (or its error) in arc-seconds.', '″'),
  spec('maxReciprocalDispersionNmPerMm', 'nm/mm', 'Largest reciprocal linear dispersion at the exit plane.', 'nm/mm'),
];

export const requirementFieldByPath: ReadonlyMap<string, RequirementFieldSpec> = new Map(
  requirementTextFields.map((field) => [field.path, field]),
);

/** The yes/no requirement as two choices; stored `false` and absent both show as off. */
export const oneShotOptions = [
  { value: 'off', label: 'Off', description: 'any detector coverage' },
  { value: 'on', label: 'On', description: 'the detector records the whole range at one grating setting' },
] as const;

/** What the bandpass limit is judged on; '' (not stored) shows as slit-limited. */
export const bandpassBasisOptions = [
  { value: 'slit-limited', label: 'Slit-limited', description: 'the closed-form FWHM of the slit images, at every checked wavelength' },
  {
    value: 'traced',
    label: 'Traced',
    description: 'the FWHM of the exact ray trace’s line shape, mirror aberrations included, at the listed wavelengths or five across the range',
  },
] as const;

/** The order-overlap policy; '' is "not checked". */
export const orderOverlapOptions = [
  { value: 'none', label: 'Not checked', description: 'other orders are not looked at' },
  { value: 'forbidden', label: 'Forbidden', description: 'no other order may land on a working wavelength' },
  { value: 'filtered', label: 'Filtered', description: 'allowed where an order-sorting filter blocks it' },
  { value: 'allowed', label: 'Allowed', description: 'reported, never a failure' },
] as const;

export function blankRequirementsText(): RequirementsText {
  return {
    maxBandpassNm: '',
    bandpassBasis: '',
    minResolvingPower: '',
    atWavelengthsNm: '',
    minBlazeEfficiency: '',
    minRelativeThroughput: '',
    maxFNumber: '',
    maxFocalLengthMm: '',
    maxFootprintMm: { widthMm: '', depthMm: '' },
    minPixelsPerBandpass: '',
    oneShotCoverage: '',
    maxWavelengthErrorNm: '',
    driveStepArcsec: '',
    maxReciprocalDispersionNmPerMm: '',
    orderOverlap: '',
  };
}

const text = z.string().max(400);

type FieldUnit = Parameters<typeof parseQuantity>[1];

/**
 * The requirements' text as a draft stores it. Drafts saved before requirements existed have no
 * `requirements` key: they read as all blank.
 */
export const requirementsTextSchema = z
  .object({
    maxBandpassNm: text,
    // Drafts typed before the traced bandpass existed have no such key: slit-limited.
    bandpassBasis: z.enum(['', ...BANDPASS_BASES]).default(''),
    minResolvingPower: text,
    atWavelengthsNm: text,
    minBlazeEfficiency: text,
    // Drafts typed before the throughput requirement existed have no such key: blank.
    minRelativeThroughput: text.default(''),
    maxFNumber: text,
    maxFocalLengthMm: text,
    maxFootprintMm: z.object({ widthMm: text, depthMm: text }),
    minPixelsPerBandpass: text,
    oneShotCoverage: z.enum(['', 'true', 'false']),
    maxWavelengthErrorNm: text,
    driveStepArcsec: text,
    maxReciprocalDispersionNmPerMm: text,
    orderOverlap: z.enum(['', ...ORDER_OVERLAP_POLICIES]),
  })
  .default(blankRequirementsText);

function readText(values: RequirementsText, key: RequirementFieldSpec['key']): string {
  if (key === 'maxFootprintMm.widthMm') return values.maxFootprintMm.widthMm;
  if (key === 'maxFootprintMm.depthMm') return values.maxFootprintMm.depthMm;
  const value = (values as unknown as Record<string, unknown>)[key];
  return typeof value === 'string' ? value : '';
}

const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

type Read = { ok: true; value: number } | { ok: false; message: string };

function plainNumber(trimmed: string, expected: string): Read {
  const normal = trimmed.replace(/\u2212/g, '-');
  if (!PLAIN_NUMBER.test(normal)) return { ok: false, message: `could not read "${trimmed}"; expected ${expected}` };
  const value = Number(normal);
  return Number.isFinite(value) ? { ok: true, value } : { ok: false, message: `"${trimmed}" is too large` };
}

/** mathjs reads "angstrom" but not the Å sign. */
function quantity(trimmed: string, unit: FieldUnit): Read {
  return parseQuantity(trimmed.replace(/\s*[ÅÅ]/g, ' angstrom'), unit);
}

/** One requirement's text as a number (or list); `undefined` when blank. Never throws. */
export function parseRequirementText(
  field: RequirementFieldSpec,
  typed: string,
): { ok: true; value: number | number[] | undefined } | { ok: false; message: string } {
  const trimmed = typed.trim();
  if (trimmed === '') return { ok: true, value: undefined };
  switch (field.reading) {
    case 'nm':
      return quantity(trimmed, 'nm');
    case 'mm':
      return quantity(trimmed, 'mm');
    case 'number':
      return plainNumber(trimmed, 'a number such as 2000');
    case 'arcsec': {
      const bare = trimmed.replace(/\s*(arcsec|″|")$/i, '');
      if (bare !== trimmed || PLAIN_NUMBER.test(bare)) return plainNumber(bare, 'arc-seconds such as 2');
      // "0.001 deg": any angle mathjs reads, in arc-seconds.
      const deg = parseQuantity(trimmed, 'deg');
      return deg.ok ? { ok: true, value: Number((deg.value * 3600).toPrecision(15)) } : deg;
    }
    case 'fraction': {
      const percent = /^(.*?)\s*%$/.exec(trimmed);
      if (percent) {
        const read = plainNumber((percent[1] ?? '').trim(), 'a percent such as 40 %');
        return read.ok ? { ok: true, value: read.value / 100 } : read;
      }
      return plainNumber(trimmed, 'a fraction such as 0.4, or a percent such as 40 %');
    }
    case 'nm/mm': {
      const per = /^(.*?)\s*\/\s*mm$/i.exec(trimmed);
      if (!per) return plainNumber(trimmed, 'a reciprocal dispersion such as 2 nm/mm');
      const numerator = (per[1] ?? '').trim();
      return PLAIN_NUMBER.test(numerator) ? plainNumber(numerator, 'a number') : quantity(numerator, 'nm');
    }
    case 'nm-list': {
      const items = trimmed.split(/[,;]/).map((item) => item.trim());
      // "404.7, 546.1 nm": a unit after the last item applies to the bare numbers before it.
      const lastUnit = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?\s*([^\d\s.].*)$/i.exec(items[items.length - 1] ?? '')?.[1];
      const values: number[] = [];
      for (const [index, item] of items.entries()) {
        if (item === '') return { ok: false, message: `has an empty item ${index + 1} (separate wavelengths with commas)` };
        const withUnit = lastUnit && PLAIN_NUMBER.test(item) ? `${item} ${lastUnit}` : item;
        const read = quantity(withUnit, 'nm');
        if (!read.ok) return { ok: false, message: `wavelength ${index + 1}: ${read.message}` };
        values.push(read.value);
      }
      return { ok: true, value: values };
    }
  }
}

function setPath(target: Record<string, unknown>, key: string, value: unknown): void {
  const [head, tail] = key.split('.') as [string, string | undefined];
  if (tail === undefined) {
    target[head] = value;
    return;
  }
  const inner = (target[head] ??= {}) as Record<string, unknown>;
  inner[tail] = value;
}

/**
 * The requirements block the typed text makes, with a plain-words reason per field it cannot
 * read. `undefined` when every field is blank, so a design that had none keeps none.
 */
export function requirementsFromText(values: RequirementsText | undefined): {
  requirements: Record<string, unknown> | undefined;
  errors: FieldErrors;
} {
  const source = values ?? blankRequirementsText();
  const errors: FieldErrors = {};
  const out: Record<string, unknown> = {};
  for (const field of requirementTextFields) {
    const read = parseRequirementText(field, readText(source, field.key));
    if (!read.ok) errors[field.path] = read.message;
    else if (read.value !== undefined) setPath(out, field.key, read.value);
  }
  // A footprint with one side typed is half a limit: the schema says the other is required.
  const footprint = out.maxFootprintMm as Record<string, unknown> | undefined;
  if (footprint === undefined && (source.maxFootprintMm.widthMm.trim() !== '' || source.maxFootprintMm.depthMm.trim() !== '')) {
    out.maxFootprintMm = {};
  }
  if (source.oneShotCoverage !== '') out.oneShotCoverage = source.oneShotCoverage === 'true';
  if (source.orderOverlap !== '') out.orderOverlap = source.orderOverlap;
  if (source.bandpassBasis !== '') out.bandpassBasis = source.bandpassBasis;
  const empty = Object.keys(out).length === 0;
  return { requirements: empty ? undefined : out, errors };
}

function numberText(value: unknown): string {
  return typeof value === 'number' ? formatMachineNumber(value) : '';
}

/** The editor's text for a stored requirements block; blank fields for none. */
export function requirementsToText(requirements: Requirements | undefined): RequirementsText {
  const text = blankRequirementsText();
  if (!requirements) return text;
  text.maxBandpassNm = numberText(requirements.maxBandpassNm);
  text.bandpassBasis = requirements.bandpassBasis ?? '';
  text.minResolvingPower = numberText(requirements.minResolvingPower);
  text.atWavelengthsNm = requirements.atWavelengthsNm?.map((nm) => formatMachineNumber(nm)).join(', ') ?? '';
  text.minBlazeEfficiency = numberText(requirements.minBlazeEfficiency);
  text.minRelativeThroughput = numberText(requirements.minRelativeThroughput);
  text.maxFNumber = numberText(requirements.maxFNumber);
  text.maxFocalLengthMm = numberText(requirements.maxFocalLengthMm);
  text.maxFootprintMm = {
    widthMm: numberText(requirements.maxFootprintMm?.widthMm),
    depthMm: numberText(requirements.maxFootprintMm?.depthMm),
  };
  text.minPixelsPerBandpass = numberText(requirements.minPixelsPerBandpass);
  text.oneShotCoverage = requirements.oneShotCoverage === undefined ? '' : requirements.oneShotCoverage ? 'true' : 'false';
  text.maxWavelengthErrorNm = numberText(requirements.maxWavelengthErrorNm);
  text.driveStepArcsec = numberText(requirements.driveStepArcsec);
  text.maxReciprocalDispersionNmPerMm = numberText(requirements.maxReciprocalDispersionNmPerMm);
  text.orderOverlap = requirements.orderOverlap ?? '';
  return text;
}

/** The editor's label for a requirements path (`requirements.maxFootprintMm.widthMm`); null for other paths. */
export function requirementLabel(path: string): string | null {
  if (!path.startsWith('requirements.')) return null;
  const key = path.slice('requirements.'.length).replace(/\.\d+$/, '');
  return requirementWords[key as keyof typeof requirementWords]?.label ?? null;
}
