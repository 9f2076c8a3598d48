import type { FieldUnit } from '@/features/solver';

/** Where each editable value sits in the design, and how the editor shows it. */
export type SectionId = 'grating' | 'layout' | 'slits' | 'range' | 'source' | 'detector';

export type QuantityField = {
  kind: 'quantity';
  path: string;
  label: string;
  unit: FieldUnit;
  /** Unit as printed after the value. */
  unitLabel: string;
  /** Optional inside its section (e.g. the blaze wavelength). */
  optional?: boolean;
  /** Stepper increments; a list walks through common values instead of adding a step. */
  step: number | readonly number[];
  /** Smallest value the stepper goes down to. */
  min?: number;
  help: string;
};

export type IntegerField = {
  kind: 'integer';
  path: string;
  label: string;
  optional?: boolean;
  /** Whether 0 is skipped by the stepper (diffraction order). */
  skipZero?: boolean;
  min?: number;
  help: string;
};

export type FieldSpec = QuantityField | IntegerField;

export type SectionSpec = {
  id: SectionId;
  title: string;
  /** Sections the design may leave out altogether (then their fields stay empty). */
  optional?: boolean;
  note?: string;
  fields: readonly FieldSpec[];
};

/** Catalogue groove densities (common practice), walked by the stepper. */
const grooveDensities = [50, 75, 150, 300, 600, 900, 1200, 1800, 2400, 3600] as const;

export const sections: readonly SectionSpec[] = [
  {
    id: 'grating',
    title: 'Grating',
    fields: [
      {
        kind: 'quantity',
        path: 'grating.grooveDensityPerMm',
        label: 'Groove density',
        unit: 'mm^-1',
        unitLabel: '/mm',
        step: grooveDensities,
        help: 'Grooves per millimetre, e.g. 1200/mm or 1200 l/mm.',
      },
      {
        kind: 'integer',
        path: 'grating.order',
        label: 'Diffraction order',
        skipZero: true,
        help: 'Whole number other than 0; negative orders are allowed.',
      },
      {
        kind: 'quantity',
        path: 'grating.blazeWavelengthNm',
        label: 'Blaze wavelength (first-order Littrow)',
        unit: 'nm',
        unitLabel: 'nm',
        optional: true,
        step: 50,
        min: 50,
        help: 'As the grating is sold; leave empty for a holographic grating without blaze.',
      },
      {
        kind: 'quantity',
        path: 'grating.ruledWidthMm',
        label: 'Ruled width',
        unit: 'mm',
        unitLabel: 'mm',
        step: 5,
        min: 5,
        help: 'Across the grooves; sets the number of grooves illuminated.',
      },
      {
        kind: 'quantity',
        path: 'grating.ruledHeightMm',
        label: 'Ruled height',
        unit: 'mm',
        unitLabel: 'mm',
        step: 5,
        min: 5,
        help: 'Along the grooves.',
      },
    ],
  },
  {
    id: 'layout',
    title: 'Mount',
    fields: [
      {
        kind: 'quantity',
        path: 'layout.deviationAngleDeg',
        label: 'Deviation angle',
        unit: 'deg',
        unitLabel: '°',
        step: 1,
        min: 0,
        help: 'Full angle between incident and diffracted chief rays; 0 for Littrow.',
      },
      {
        kind: 'quantity',
        path: 'layout.collimatorFocalMm',
        label: 'Collimator focal length',
        unit: 'mm',
        unitLabel: 'mm',
        step: 10,
        min: 10,
        help: 'e.g. 300 mm or 0.3 m.',
      },
      {
        kind: 'quantity',
        path: 'layout.cameraFocalMm',
        label: 'Camera focal length',
        unit: 'mm',
        unitLabel: 'mm',
        step: 10,
        min: 10,
        help: 'Equal to the collimator for Ebert–Fastie (one mirror).',
      },
      {
        kind: 'quantity',
        path: 'layout.collimatorOffAxisDeg',
        label: 'Collimator off-axis angle',
        unit: 'deg',
        unitLabel: '°',
        optional: true,
        step: 0.5,
        min: 0,
        help: 'Half the angle between the rays to and from the collimator.',
      },
      {
        kind: 'quantity',
        path: 'layout.cameraOffAxisDeg',
        label: 'Camera off-axis angle',
        unit: 'deg',
        unitLabel: '°',
        optional: true,
        step: 0.5,
        min: 0,
        help: 'Leave empty to see the coma-free angle.',
      },
    ],
  },
  {
    id: 'slits',
    title: 'Slits',
    fields: [
      {
        kind: 'quantity',
        path: 'slits.entranceWidthUm',
        label: 'Entrance slit width',
        unit: 'um',
        unitLabel: 'µm',
        step: 10,
        min: 5,
        help: 'e.g. 100 um or 0.1 mm.',
      },
      {
        kind: 'quantity',
        path: 'slits.exitWidthUm',
        label: 'Exit slit width',
        unit: 'um',
        unitLabel: 'µm',
        step: 10,
        min: 5,
        help: 'The exit slit, or one detector pixel for a spectrograph.',
      },
      {
        kind: 'quantity',
        path: 'slits.heightMm',
        label: 'Slit height',
        unit: 'mm',
        unitLabel: 'mm',
        step: 1,
        min: 1,
        help: 'Along the grooves.',
      },
    ],
  },
  {
    id: 'range',
    title: 'Wavelength range',
    fields: [
      {
        kind: 'quantity',
        path: 'range.startNm',
        label: 'Range start',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Shortest wavelength the design must deliver.',
      },
      {
        kind: 'quantity',
        path: 'range.endNm',
        label: 'Range end',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Longest wavelength the design must deliver.',
      },
    ],
  },
  {
    id: 'source',
    title: 'Light source',
    optional: true,
    note: 'What the lamp emits. Used to find other orders that leave the grating at the same angle. Leave both empty to skip.',
    fields: [
      {
        kind: 'quantity',
        path: 'source.minNm',
        label: 'Shortest wavelength emitted',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Shortest wavelength the source emits.',
      },
      {
        kind: 'quantity',
        path: 'source.maxNm',
        label: 'Longest wavelength emitted',
        unit: 'nm',
        unitLabel: 'nm',
        step: 10,
        min: 10,
        help: 'Longest wavelength the source emits.',
      },
    ],
  },
  {
    id: 'detector',
    title: 'Detector',
    optional: true,
    note: 'A line detector at the exit plane (spectrograph use). Leave both empty for a scanning monochromator.',
    fields: [
      {
        kind: 'quantity',
        path: 'detector.pixelPitchUm',
        label: 'Pixel pitch',
        unit: 'um',
        unitLabel: 'µm',
        step: 1,
        min: 1,
        help: 'Centre-to-centre, along the dispersion.',
      },
      {
        kind: 'integer',
        path: 'detector.pixelCount',
        label: 'Pixel count',
        min: 1,
        help: 'Pixels along the dispersion.',
      },
    ],
  },
];

export const allFields: readonly FieldSpec[] = sections.flatMap((section) => section.fields);

export const fieldByPath: ReadonlyMap<string, FieldSpec> = new Map(
  allFields.map((field) => [field.path, field]),
);

/** A short plain name for a field path, for "fix <field>" notes. */
export function fieldLabel(path: string): string {
  return fieldByPath.get(path)?.label ?? (path === 'layout.kind' ? 'Mount type' : path);
}
