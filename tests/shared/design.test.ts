import { describe, expect, it } from 'vitest';
import { designSchema, exampleDesign, solveRequestSchema, type Design } from '@/shared/design';
import { fieldErrors } from '@/shared/validation';

function errorsFor(mutate: (d: Record<string, any>) => void) {
  const design = structuredClone(exampleDesign) as Record<string, any>;
  mutate(design);
  const r = designSchema.safeParse(design);
  return r.success ? {} : fieldErrors(r.error);
}

describe('design schema', () => {
  it('accepts the example design and the minimal one without optional sections', () => {
    expect(designSchema.safeParse(exampleDesign).success).toBe(true);
    const { source: _s, detector: _d, ...minimal } = exampleDesign;
    const layout = { ...minimal.layout };
    delete layout.collimatorOffAxisDeg;
    delete layout.cameraOffAxisDeg;
    const grating = { ...minimal.grating };
    delete grating.blazeWavelengthNm;
    expect(designSchema.safeParse({ ...minimal, layout, grating }).success).toBe(true);
  });

  it.each([
    { field: 'grating.grooveDensityPerMm', set: (d: any) => (d.grating.grooveDensityPerMm = 0), message: 'must be greater than 0' },
    { field: 'grating.grooveDensityPerMm', set: (d: any) => (d.grating.grooveDensityPerMm = '1200'), message: 'must be a number' },
    { field: 'grating.order', set: (d: any) => (d.grating.order = 0), message: 'must be a whole number other than 0' },
    { field: 'grating.order', set: (d: any) => (d.grating.order = 1.5), message: 'must be a whole number other than 0' },
    { field: 'layout.deviationAngleDeg', set: (d: any) => (d.layout.deviationAngleDeg = 180), message: 'must be at least 0° and less than 180°' },
    { field: 'layout.deviationAngleDeg', set: (d: any) => (d.layout.deviationAngleDeg = -1), message: 'must be at least 0° and less than 180°' },
    { field: 'layout.kind', set: (d: any) => (d.layout.kind = 'rowland'), message: 'must be one of czerny-turner, littrow or ebert-fastie' },
    { field: 'slits.heightMm', set: (d: any) => delete d.slits.heightMm, message: 'is required' },
    { field: 'range.endNm', set: (d: any) => (d.range.endNm = 300), message: 'must be greater than range.startNm' },
    { field: 'source.maxNm', set: (d: any) => (d.source.maxNm = 100), message: 'must be greater than source.minNm' },
    { field: 'detector.pixelCount', set: (d: any) => (d.detector.pixelCount = 10.5), message: 'must be a whole number' },
    { field: 'grating', set: (d: any) => (d.grating.grooveDensityPerMM = 1200), message: "has an unknown field 'grooveDensityPerMM' (check the spelling)" },
  ] satisfies readonly { field: string; set: (d: Record<string, any>) => unknown; message: string }[])(
    '$field: "$message"',
    ({ field, set, message }) => {
      expect(errorsFor(set)[field]).toBe(message);
    },
  );

  it('Littrow requires a deviation of 0, reported on layout.deviationAngleDeg', () => {
    expect(errorsFor((d) => (d.layout.kind = 'littrow'))).toEqual({
      'layout.deviationAngleDeg': 'must be 0 for a Littrow layout (the light returns along its own path)',
    });
    expect(errorsFor((d) => Object.assign(d.layout, { kind: 'littrow', deviationAngleDeg: 0 }))).toEqual({});
  });

  it('Ebert–Fastie requires one focal length, reported on layout.cameraFocalMm', () => {
    const errors = errorsFor((d) => Object.assign(d.layout, { kind: 'ebert-fastie', cameraFocalMm: 350 }));
    expect(errors).toEqual({ 'layout.cameraFocalMm': 'must equal collimatorFocalMm: an Ebert–Fastie layout uses one mirror for both' });
  });

  it('reports every bad section at once', () => {
    const errors = errorsFor((d) => {
      d.grating.order = 0;
      d.range.endNm = 1;
      d.slits.exitWidthUm = -3;
    });
    expect(Object.keys(errors).sort()).toEqual(['grating.order', 'range.endNm', 'slits.exitWidthUm']);
  });

  it('types the stored format', () => {
    const d: Design = exampleDesign;
    expect(d.layout.kind).toBe('czerny-turner');
  });
});

describe('solve request schema', () => {
  it('accepts a design with optional wavelengths or a point count', () => {
    expect(solveRequestSchema.safeParse({ design: exampleDesign }).success).toBe(true);
    expect(solveRequestSchema.safeParse({ design: exampleDesign, at: [400, 500] }).success).toBe(true);
    expect(solveRequestSchema.safeParse({ design: exampleDesign, points: 2 }).success).toBe(true);
  });

  it('names bad wavelengths and counts by path', () => {
    const r = solveRequestSchema.safeParse({ design: exampleDesign, at: [400, -1], points: 1001 });
    expect(r.success).toBe(false);
    if (!r.success) {
      expect(fieldErrors(r.error)).toEqual({ 'at.1': 'must be greater than 0', points: 'must be a whole number from 2 to 1000' });
    }
    const tooMany = solveRequestSchema.safeParse({ design: exampleDesign, at: Array.from({ length: 1001 }, () => 500) });
    expect(tooMany.success).toBe(false);
  });

  it('prefixes design errors with design.', () => {
    const r = solveRequestSchema.safeParse({ design: { ...exampleDesign, range: { startNm: 500, endNm: 400 } } });
    expect(r.success ? {} : fieldErrors(r.error)).toEqual({ 'design.range.endNm': 'must be greater than range.startNm' });
  });
});
