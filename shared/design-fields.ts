import { z } from 'zod';
import { CURVE_KIND_WORDS, type CurveKind, type DesignCurve } from './curves';
import { designSchema, type Design, type LayoutKind } from './design';
import type { OrderSortingFilter } from './filters';
import type { InputKind, LightInput } from './light-input';
import { describeRequirementPath } from './requirements';

/**
 * How each field of a design is shown and named: the one description beside the schema from
 * which the editor's fields, the editor's text form, the draft format and the compare tables'
 * words are derived. It is keyed by the design's own type, so a field added to or dropped from
 * the schema without its description here fails to compile; the order of sections and fields,
 * and whether one is optional, are read from the zod schema itself.
 */

/** Units the editor reads typed text in (mathjs spellings). */
export type DesignFieldUnit = 'nm' | 'um' | 'mm' | 'deg' | 'mm^-1';

type Names = {
  /** The editor's label; also names the field in "fix …" notes and warnings. */
  label: string;
  /** The field's name under its section heading in compare and conflict tables ("exit width"). */
  short: string;
};

export type QuantityDescription = Names & {
  kind: 'quantity';
  unit: DesignFieldUnit;
  /** Unit as printed after the value. */
  unitLabel: string;
  /** Stepper increments; a list walks through common values instead of adding a step. */
  step: number | readonly number[];
  /** Smallest value the stepper goes down to. */
  min?: number;
  /** Largest value the stepper goes up to (the schema's bound, on the step grid). */
  max?: number;
  help: string;
};

export type IntegerDescription = Names & {
  kind: 'integer';
  /** Stepper increment (ArrowUp/ArrowDown; ×10 with Shift). */
  step: number;
  /** Whether 0 is skipped by the stepper (diffraction order). */
  skipZero?: boolean;
  min?: number;
  max?: number;
  help: string;
};

export type ChoiceDescription<V extends string = string> = Names & {
  kind: 'choice';
  options: Readonly<Record<V, { label: string; description: string }>>;
};

type FieldDescriptions<S> = {
  [K in keyof S]-?: Exclude<S[K], undefined> extends number
    ? QuantityDescription | IntegerDescription
    : ChoiceDescription<Extract<S[K], string>>;
};

/**
 * The editor's sections: every part of a design but its requirements, which are limits on the
 * results rather than parameters (shared/requirements.ts describes them), and the lists and
 * choices that have cards of their own (filters, the light input, measured curves).
 */
export type SectionId = Exclude<keyof Design, 'requirements' | 'filters' | 'input' | 'curves'>;

type DesignDescription = {
  [S in SectionId]-?: {
    /** The editor's heading. */
    title: string;
    /** The section's name in compare and conflict tables. */
    short: string;
    note?: string;
    fields: FieldDescriptions<NonNullable<Design[S]>>;
  };
};

/** Catalogue groove densities (common practice), walked by the stepper. */
const grooveDensities = [50, 75, 150, 300, 600, 900, 1200, 1800, 2400, 3600] as const;

const designDescription: DesignDescription = {
  grating: {
    title: 'Grating',
    short: 'Grating',
    fields: {
      grooveDensityPerMm: {
        kind: 'quantity',
        label: 'Groove density',
        short: 'groove density',
        unit: 'mm^-1',
        unitLabel: '/mm',
        step: grooveDensities,
        help: 'Grooves per millimetre, e.g. 1200/mm or 1200 l/mm.',
      },
      order: {
        kind: 'integer',
        label: 'Diffraction order',
        short: 'order',
        step: 1,
        skipZero: true,
        // The schema's bounds (shared/design.ts).
        min: -1000,
        max: 1000,
        help: 'Whole number other than 0; negative orders are allowed.',
      },
      blazeWavelengthNm: {
        kind: 'quantity',
        label: 'Blaze wavelength (first-order Littrow)',
        short: 'blaze wavelength',
        unit: 'nm',
        unitLabel: 'nm',
        step: 50,
        min: 50,
        help: 'As the grating is sold; leave empty for a holographic grating without blaze.',
      },
      ruledWidthMm: {
        kind: 'quantity',
        label: 'Ruled width',
        short: 'ruled width',
        unit: 'mm',
        unitLabel: 'mm',
        step: 5,
        min: 5,
        help: 'Across the grooves; sets the number of grooves illuminated.',
      },
      ruledHeightMm: {
        kind: 'quantity',
        label: 'Ruled height',
        short: 'ruled height',
        unit: 'mm',
        unitLabel: 'mm',
        step: 5,
        min: 5,
        help: 'Along the grooves.',
      },
    },
  },
  layout: {
    title: 'Mount',
    short: 'Layout',
    fields: {
      kind: {
        kind: 'choice',
        label: 'Mount type',
        short: 'kind',
        options: {
          'czerny-turner': { label: 'Czerny–Turner', description: 'two mirrors, collimator and camera' },
          littrow: { label: 'Littrow', description: 'light returns along its own path, deviation 0' },
          'ebert-fastie': { label: 'Ebert–Fastie', description: 'one mirror used twice' },
        },
      },
      deviationAngleDeg: {
        kind: 'quantity',
        label: 'Deviation angle',
        short: 'deviation angle',
        unit: 'deg',
        unitLabel: '°',
        step: 1,
        min: 0,
        // The schema refuses 180° and more.
        max: 179,
        help: 'Full angle between incident and diffracted chief rays; 0 for Littrow.',
      },
      collimatorFocalMm: {
        kind: 'quantity',
        label: 'Collimator focal length',
        short: 'collimator focal length',
        unit: 'mm',
        unitLabel: 'mm',
        step: 10,
        min: 10,
        help: 'e.g. 300 mm or 0.3 m.',
      },
      cameraFocalMm: {
        kind: 'quantity',
        label: 'Camera focal length',
        short: 'camera focal length',
        unit: 'mm',
        unitLabel: 'mm',
        step: 10,
        min: 10,
        help: 'Equal to the collimator for Ebert–Fastie (one mirror).',
      },
      collimatorOffAxisDeg: {
        kind: 'quantity',
        label: 'Collimator off-axis angle',
        short: 'collimator off-axis angle',
        unit: 'deg',
        unitLabel: '°',
        step: 0.5,
        min: 0,
        // The schema refuses 90° and more.
        max: 89.5,
        help: 'Half the angle between the rays to and from the collimator.',
      },
      cameraOffAxisDeg: {
        kind: 'quantity',
        label: 'Camera off-axis angle',
        short: 'camera off-axis angle',
        unit: 'deg',
        unitLabel: '°',
        step: 0.5,
        min: 0,
        // The schema refuses 90° and more.
        max: 89.5,
        help: 'Leave empty to see the coma-free angle.',
      },
    },
  },
  slits: {
    title: 'Slits',
    short: 'Slits',
    fields: {
      entranceWidthUm: {
        kind: 'quantity',
        label: 'Entrance slit width',
        short: 'entrance width',
        unit: 'um',
        unitLabel: 'µm',
        step: 10,
        min: 5,
        help: 'e.g. 100 um or 0.1 mm.',
      },
      exitWidthUm: {
        kind: 'quantity',
        label: 'Exit slit width',
        short: 'exit width',
        unit: 'um',
        unitLabel: 'µm',
        step: 10,
        min: 5,
        help: 'The exit slit, or one detector pixel for a spectrograph.',
      },
      heightMm: {
        kind: 'quantity',
        label: 'Slit height',
        short: 'height',
        unit: 'mm',
        unitLabel: 'mm',
        step: 1,
        min: 1,
        help: 'Along the grooves.',
      },
    },
  },
  range: {
    title: 'Wavelength range',
    short: 'Range',
    fields: {
      startNm: {
        kind: 'quantity',
        label: 'Range start',
        short: 'start',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Shortest wavelength the design must deliver.',
      },
      endNm: {
        kind: 'quantity',
        label: 'Range end',
        short: 'end',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Longest wavelength the design must deliver.',
      },
    },
  },
  source: {
    title: 'Light source',
    short: 'Source',
    note: 'What the lamp emits. Used to find other orders that leave the grating at the same angle. Leave both empty to skip.',
    fields: {
      minNm: {
        kind: 'quantity',
        label: 'Shortest wavelength emitted',
        short: 'shortest wavelength',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Shortest wavelength the source emits.',
      },
      maxNm: {
        kind: 'quantity',
        label: 'Longest wavelength emitted',
        short: 'longest wavelength',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Longest wavelength the source emits.',
      },
    },
  },
  detector: {
    title: 'Detector',
    short: 'Detector',
    note: 'A line detector at the exit plane (spectrograph use). Leave both empty for a scanning monochromator.',
    fields: {
      pixelPitchUm: {
        kind: 'quantity',
        label: 'Pixel pitch',
        short: 'pixel pitch',
        unit: 'um',
        unitLabel: 'µm',
        step: 1,
        min: 1,
        help: 'Centre-to-centre, along the dispersion.',
      },
      pixelCount: {
        kind: 'integer',
        label: 'Pixel count',
        short: 'pixel count',
        step: 1,
        min: 1,
        max: 10_000_000,
        help: 'Pixels along the dispersion.',
      },
    },
  },
};

/** Where a described field sits, read from the schema. */
type Place = {
  section: SectionId;
  key: string;
  /** Dotted path into the design, e.g. `slits.exitWidthUm`. */
  path: string;
  /** Optional inside its section (e.g. the blaze wavelength). */
  optional: boolean;
};

export type DescribedQuantity = QuantityDescription & Place;
export type DescribedInteger = IntegerDescription & Place;
export type DescribedChoice = ChoiceDescription & Place;
export type DescribedField = DescribedQuantity | DescribedInteger | DescribedChoice;

export type DescribedSection = {
  id: SectionId;
  title: string;
  short: string;
  note?: string;
  /** Sections the design may leave out altogether. */
  optional: boolean;
  fields: readonly DescribedField[];
};

function objectShape(schema: z.ZodType): Record<string, z.ZodType> {
  const inner = schema instanceof z.ZodOptional ? schema.unwrap() : schema;
  return inner instanceof z.ZodObject ? (inner.shape as Record<string, z.ZodType>) : {};
}

const NOT_SECTIONS: ReadonlySet<string> = new Set(['requirements', 'filters', 'input', 'curves']);

/** Every section and field of the design in the schema's order, with its description. */
export const describedSections: readonly DescribedSection[] = Object.entries(designSchema.shape)
  // Requirements, filters, the light input and curves are limits, lists and choices beside the
  // parameters, described on their own.
  .filter(([id]) => !NOT_SECTIONS.has(id))
  .map(([id, sectionSchema]) => {
    const section = designDescription[id as SectionId];
    const descriptions = section.fields as Record<
      string,
      QuantityDescription | IntegerDescription | ChoiceDescription
    >;
    const fields = Object.entries(objectShape(sectionSchema)).map(
      ([key, fieldSchema]) =>
        ({
          ...descriptions[key],
          section: id as SectionId,
          key,
          path: `${id}.${key}`,
          optional: fieldSchema.isOptional(),
        }) as DescribedField,
    );
    return {
      id: id as SectionId,
      title: section.title,
      short: section.short,
      ...(section.note === undefined ? {} : { note: section.note }),
      optional: sectionSchema.isOptional(),
      fields,
    };
  });

export const describedFields: readonly DescribedField[] = describedSections.flatMap(
  (section) => section.fields,
);

export const describedFieldByPath: ReadonlyMap<string, DescribedField> = new Map(
  describedFields.map((field) => [field.path, field]),
);

/** The mount kinds in the schema's order, with the words the editor shows for each. */
export const layoutKindOptions: readonly { value: LayoutKind; label: string; description: string }[] =
  (() => {
    const kind = designDescription.layout.fields.kind;
    return Object.entries(kind.options).map(([value, words]) => ({ value: value as LayoutKind, ...words }));
  })();

/**
 * Words for an order-sorting filter's fields (shared/filters.ts): the filter card's labels, the
 * compare and conflict tables' names, and how a schema message says the field ("must be greater
 * than the “in the beam from” setting"). Keyed by the filter's type, so a new field needs words.
 */
export const filterFieldWords: Readonly<
  Record<keyof OrderSortingFilter, { label: string; short: string; unitLabel: string; spoken: string }>
> = {
  kind: { label: 'Kind', short: 'kind', unitLabel: '', spoken: 'the kind' },
  cutOnNm: { label: 'Cut-on', short: 'cut-on', unitLabel: 'nm', spoken: 'the cut-on' },
  inFromNm: { label: 'In the beam from', short: 'in the beam from', unitLabel: 'nm', spoken: 'the “in the beam from” setting' },
  inToNm: { label: 'In the beam to', short: 'in the beam to', unitLabel: 'nm', spoken: 'the “in the beam to” setting' },
  edgeWidthNm: { label: 'Edge width', short: 'edge width', unitLabel: 'nm', spoken: 'the edge width' },
};

const FILTER_PATH = /^filters(?:\.(\d+)(?:\.([A-Za-z]+))?)?$/;

/** A `filters.…` path split into the filter's place (0-based) and field; null for other paths. */
export function filterPathParts(path: string): { index: number | null; key: keyof OrderSortingFilter | null } | null {
  const match = FILTER_PATH.exec(path);
  if (!match) return null;
  const key = match[2];
  return {
    index: match[1] === undefined ? null : Number(match[1]),
    key: key !== undefined && key in filterFieldWords ? (key as keyof OrderSortingFilter) : null,
  };
}

/**
 * A filter path as the compare and conflict tables name it, counting filters from 1 as the card
 * does: `filters.1.cutOnNm` → "Filter 2: cut-on (nm)", `filters.0` → "Filter 1", `filters` →
 * "Filters"; null for other paths.
 */
export function describeFilterPath(path: string): string | null {
  const parts = filterPathParts(path);
  if (!parts) return null;
  if (parts.index === null) return 'Filters';
  const head = `Filter ${parts.index + 1}`;
  if (parts.key === null) return head;
  const words = filterFieldWords[parts.key];
  return `${head}: ${words.short}${words.unitLabel ? ` (${words.unitLabel})` : ''}`;
}

/** Every field any light input may carry (shared/light-input.ts), across its kinds. */
type LightInputKey = { [K in InputKind]: keyof Extract<LightInput, { kind: K }> }[InputKind];

/** The light input's heading, as its card and the compare and conflict tables show it. */
export const INPUT_TITLE = 'Light input';

/**
 * Words for the light input's fields: the card's labels and the compare and conflict tables'
 * names ("Light input: numerical aperture"). Keyed by the input's type, so a new field needs words.
 */
export const inputFieldWords: Readonly<Record<LightInputKey, { label: string; short: string; unitLabel: string }>> = {
  kind: { label: 'Light input', short: 'kind', unitLabel: '' },
  fNumber: { label: 'Input f-number', short: 'f-number', unitLabel: '' },
  numericalAperture: { label: 'Numerical aperture', short: 'numerical aperture', unitLabel: '' },
  coreDiameterUm: { label: 'Core diameter', short: 'core diameter', unitLabel: 'µm' },
};

/** The input kinds by the words their chips carry. */
export const inputKindLabels: Readonly<Record<InputKind, string>> = {
  'free-space': 'Free space',
  fibre: 'Fibre',
  lens: 'Lens',
};

/** What a design without an input block reads as wherever its input is shown. */
export const NO_INPUT_TEXT = 'not given: taken as matched';

/** An `input.…` path's field; null for other paths, `null` key for the block itself. */
export function inputPathKey(path: string): { key: LightInputKey | null } | null {
  if (path === 'input') return { key: null };
  const match = /^input\.([A-Za-z]+)$/.exec(path);
  if (!match) return null;
  const key = match[1]!;
  return { key: key in inputFieldWords ? (key as LightInputKey) : null };
}

/** `input.numericalAperture` → "Light input: numerical aperture", `input` → "Light input"; null for other paths. */
export function describeInputPath(path: string): string | null {
  const parts = inputPathKey(path);
  if (!parts) return null;
  if (parts.key === null) return path === 'input' ? INPUT_TITLE : `${INPUT_TITLE}: ${path.slice('input.'.length)}`;
  const words = inputFieldWords[parts.key];
  return `${INPUT_TITLE}: ${words.short}${words.unitLabel ? ` (${words.unitLabel})` : ''}`;
}

/**
 * A curve's points are one value in diffs, compare tables and rebases (`curves.N.points`): the
 * wavelengths and values only make sense together, and thousands of numbers are never listed.
 */
export const CURVE_POINTS_KEY = 'points';

/** Words for a measured curve's fields (shared/curves.ts), and for its points taken as one. */
export const curveFieldWords: Readonly<Record<Exclude<keyof DesignCurve, 'wavelengthsNm' | 'values'> | typeof CURVE_POINTS_KEY, { short: string }>> = {
  kind: { short: 'kind' },
  name: { short: 'name' },
  checksum: { short: 'file checksum' },
  medium: { short: 'medium' },
  order: { short: 'order' },
  polarisation: { short: 'polarisation' },
  mirror: { short: 'mirror' },
  filterNumber: { short: 'filter' },
  points: { short: 'points' },
};

/** The measured curves' heading in tables. */
export const CURVES_TITLE = 'Measured curves';

const CURVE_PATH = /^curves(?:\.(\d+)(?:\.([A-Za-z]+))?)?$/;

/** A `curves.…` path split into the curve's place (0-based) and field; null for other paths. */
export function curvePathParts(path: string): { index: number | null; key: string | null } | null {
  const match = CURVE_PATH.exec(path);
  if (!match) return null;
  return { index: match[1] === undefined ? null : Number(match[1]), key: match[2] ?? null };
}

/** The kind of the curve at `index` in the first of `designs` that has one there. */
function curveKindAt(index: number, designs: readonly unknown[]): CurveKind | null {
  for (const design of designs) {
    const curves = (design as { curves?: unknown } | null | undefined)?.curves;
    const kind = Array.isArray(curves) ? (curves[index] as { kind?: unknown } | undefined)?.kind : undefined;
    if (typeof kind === 'string' && kind in CURVE_KIND_WORDS) return kind as CurveKind;
  }
  return null;
}

/**
 * A curve path as the compare and conflict tables name it, counting curves from 1 as the curve
 * list does: `curves.1.name` → "Curve 2 (grating efficiency): name" when one of `designs` (the
 * two sides compared) says what curve 2 is, else "Curve 2: name"; `curves` → "Measured curves";
 * null for other paths.
 */
export function describeCurvePath(path: string, designs: readonly unknown[] = []): string | null {
  const parts = curvePathParts(path);
  if (!parts) return null;
  if (parts.index === null) return CURVES_TITLE;
  const kind = curveKindAt(parts.index, designs);
  const head = `Curve ${parts.index + 1}${kind ? ` (${CURVE_KIND_WORDS[kind]})` : ''}`;
  if (parts.key === null) return head;
  const words = (curveFieldWords as Record<string, { short: string } | undefined>)[parts.key];
  return `${head}: ${words?.short ?? parts.key}`;
}

/** The editor's label for a field path, for "fix <field>" notes; the path itself when unknown. */
export function fieldLabel(path: string): string {
  const input = inputPathKey(path);
  if (input) return input.key === null ? (describeInputPath(path) ?? path) : inputFieldWords[input.key].label;
  const curve = curvePathParts(path);
  if (curve && curve.index !== null && curve.key !== null) return describeCurvePath(path)!.replace(':', '');
  if (curve) return describeCurvePath(path) ?? path;
  const filter = filterPathParts(path);
  if (filter && filter.index !== null && filter.key !== null) {
    return `Filter ${filter.index + 1} ${filterFieldWords[filter.key].short}`;
  }
  if (filter) return describeFilterPath(path) ?? path;
  return describedFieldByPath.get(path)?.label ?? path;
}

function tableWords(field: DescribedField): string {
  return field.kind === 'quantity' ? `${field.short} (${field.unitLabel})` : field.short;
}

// Field keys are unique across sections (a test holds this), so a key alone names a field.
const fieldByKey: ReadonlyMap<string, DescribedField> = new Map(
  describedFields.map((field) => [field.key, field]),
);

/** A field's name in tables from its key alone: `exitWidthUm` → "exit width (µm)". */
export function fieldTableName(key: string): string {
  const field = fieldByKey.get(key);
  return field ? tableWords(field) : key;
}

/**
 * A path as compare and conflict tables name it: `slits.exitWidthUm` → "Slits: exit width (µm)";
 * a section → "Detector"; `input.numericalAperture` → "Light input: numerical aperture". Given the
 * designs compared, a curve is named with its kind ("Curve 2 (grating efficiency): name").
 */
export function describeDesignPath(path: string, ...designs: unknown[]): string {
  const requirement = describeRequirementPath(path) ?? describeFilterPath(path) ?? describeInputPath(path) ?? describeCurvePath(path, designs);
  if (requirement !== null) return requirement;
  const [sectionId, key] = path.split('.');
  const section = describedSections.find((s) => s.id === sectionId);
  const head = section?.short ?? sectionId ?? path;
  return key ? `${head}: ${fieldTableName(key)}` : head;
}
