import { describe, expect, it } from 'vitest';
import { flattenDesign } from '@/shared/design-diff';
import { exampleDesign, type Design } from '@/shared/design';
import { formatStoredValue } from '@/shared/design-values';
import { versionHeaderSchema, type RequirementsSummary, type VersionSummary } from '@/shared/notebooks';
import {
  editorFieldName,
  editorSectionTitle,
  formatParamAt,
  formatRequirementsMet,
  requirementsChange,
  requirementsMetLabel,
  summaryFigures,
} from '@/features/notebooks/format';
import { compareSeries } from '@/features/notebooks/compare-series';

/**
 * Requirements as the history row and the compare screen word them: "4 of 5 met", a label that
 * names the failing ones, the change between two versions in words, and the requirements' own
 * values in the parameter table (a list as its items, yes/no for a switch).
 */

const summary = (requirements?: RequirementsSummary | null): VersionSummary => ({
  rangeStartNm: 300,
  rangeEndNm: 900,
  centreWavelengthNm: 600,
  centreReachable: true,
  bandpassAtCentreNm: 0.2758,
  resolvingPowerAtCentre: 2174,
  reciprocalDispersionAtCentreNmPerMm: 2.758,
  fNumber: 7.5,
  warningCount: 2,
  ...(requirements === undefined ? {} : { requirements }),
});

const fourOfFive: RequirementsSummary = { met: 4, total: 5, unknown: 0, failing: ['maxBandpassNm'] };

describe('the history row’s requirements figure', () => {
  it('reads "n of m met", and a dash when there are none or the summary predates them', () => {
    expect(formatRequirementsMet(fourOfFive)).toBe('4 of 5 met');
    expect(formatRequirementsMet(null)).toBe('—');
    expect(formatRequirementsMet(undefined)).toBe('—');
    expect(summaryFigures(summary()).requirements).toBe('—');
    expect(summaryFigures(summary()).hasRequirements).toBe(false);
    expect(summaryFigures(summary(fourOfFive)).requirements).toBe('4 of 5 met');
  });

  it('names the failing ones and the unchecked count in its accessible label', () => {
    expect(requirementsMetLabel({ met: 2, total: 5, unknown: 1, failing: ['maxBandpassNm', 'maxFNumber'] })).toBe(
      'Requirements: 2 of 5 met; failing: bandpass, f-number; 1 not checked',
    );
    expect(requirementsMetLabel({ met: 3, total: 3, unknown: 0, failing: [] })).toBe('Requirements: 3 of 3 met');
    expect(requirementsMetLabel(undefined)).toBe('Requirements: none stated');
  });

  it('parses a version header stored before requirements existed, and one with them', () => {
    const header = { number: 1, message: 'Old', author: null, createdAt: '2025-01-01T00:00:00.000Z', parentNumber: null };
    expect(versionHeaderSchema.parse({ ...header, summary: summary() }).summary.requirements).toBeUndefined();
    expect(versionHeaderSchema.parse({ ...header, summary: summary(fourOfFive) }).summary.requirements).toEqual(fourOfFive);
    expect(versionHeaderSchema.safeParse({ ...header, summary: summary({ ...fourOfFive, failing: ['maxBandpass' as never] }) }).success).toBe(false);
  });
});

describe('the change in requirements between two versions', () => {
  it.each([
    { name: 'nothing on either side', before: null, after: null, text: '—', tone: 'muted', delta: '—', detail: null },
    { name: 'added', before: null, after: fourOfFive, text: 'requirements added', tone: 'muted', delta: '—', detail: 'requirements added' },
    { name: 'removed', before: fourOfFive, after: undefined, text: 'requirements removed', tone: 'muted', delta: '—', detail: 'requirements removed' },
    { name: 'the same', before: fourOfFive, after: fourOfFive, text: 'no change', tone: 'muted', delta: '±0 met', detail: null },
    {
      name: 'a failing one fixed',
      before: fourOfFive,
      after: { met: 5, total: 5, unknown: 0, failing: [] },
      text: '1 more met; bandpass no longer fails',
      tone: 'ok',
      delta: '+1 met',
      detail: 'bandpass no longer fails',
    },
    {
      name: 'a new failure',
      before: { met: 5, total: 5, unknown: 0, failing: [] },
      after: { met: 3, total: 5, unknown: 0, failing: ['maxFNumber', 'orderOverlap'] },
      text: '2 fewer met; f-number, order overlap now fail',
      tone: 'danger',
      delta: '−2 met',
      detail: 'f-number, order overlap now fail',
    },
    {
      name: 'one fixed and another broken',
      before: fourOfFive,
      after: { met: 4, total: 5, unknown: 0, failing: ['maxFNumber'] },
      text: 'f-number now fails; bandpass no longer fails',
      tone: 'muted',
      delta: '±0 met',
      detail: 'f-number now fails; bandpass no longer fails',
    },
    {
      name: 'one more requirement, still all met',
      before: { met: 2, total: 2, unknown: 0, failing: [] },
      after: { met: 3, total: 3, unknown: 0, failing: [] },
      text: '1 more met',
      tone: 'ok',
      delta: '+1 met',
      detail: null,
    },
  ] satisfies {
    name: string;
    before: RequirementsSummary | null | undefined;
    after: RequirementsSummary | null | undefined;
    text: string;
    tone: string;
    delta: string;
    detail: string | null;
  }[])(
    'words $name',
    ({ before, after, text, tone, delta, detail }) => {
      expect(requirementsChange(before, after)).toEqual({ text, tone, delta, detail });
    },
  );
});

describe('requirements in the compare screen’s parameter table', () => {
  const design: Design = {
    ...structuredClone(exampleDesign),
    requirements: {
      maxBandpassNm: 0.5,
      atWavelengthsNm: [404.7, 546.1],
      oneShotCoverage: false,
      maxFootprintMm: { widthMm: 300, depthMm: 200 },
      orderOverlap: 'forbidden',
    },
  };
  const flat = flattenDesign(design);

  it('flattens every requirement to its own row', () => {
    expect(Object.keys(flat).filter((path) => path.startsWith('requirements.'))).toEqual([
      'requirements.maxBandpassNm',
      'requirements.atWavelengthsNm',
      'requirements.oneShotCoverage',
      'requirements.maxFootprintMm.widthMm',
      'requirements.maxFootprintMm.depthMm',
      'requirements.orderOverlap',
    ]);
  });

  it('names each under the Requirements heading, with its unit', () => {
    expect(editorSectionTitle('requirements.maxBandpassNm')).toBe('Requirements');
    expect(editorFieldName('requirements.maxBandpassNm')).toBe('Max bandpass (nm)');
    expect(editorFieldName('requirements.atWavelengthsNm')).toBe('At wavelengths (nm)');
    expect(editorFieldName('requirements.maxFootprintMm.depthMm')).toBe('Max footprint depth (mm)');
    // The design's own fields keep the editor's names.
    expect(editorFieldName('slits.exitWidthUm')).toBe('Exit slit width (µm)');
  });

  it('prints the wavelength list as its items and a switch as yes or no', () => {
    expect(formatParamAt('requirements.atWavelengthsNm', flat['requirements.atWavelengthsNm'])).toBe('404.7, 546.1');
    expect(formatParamAt('requirements.oneShotCoverage', false)).toBe('no');
    expect(formatParamAt('requirements.oneShotCoverage', true)).toBe('yes');
    expect(formatParamAt('requirements.orderOverlap', 'forbidden')).toBe('forbidden');
    expect(formatParamAt('requirements.maxBandpassNm', undefined)).toBe('not set');
  });

  it('prints stored values with their unit where the name has none (the sheet, review carry lines)', () => {
    const nbsp = '\u00A0';
    expect(formatStoredValue('requirements.atWavelengthsNm', [404.7, 546.1])).toBe(`404.7, 546.1${nbsp}nm`);
    expect(formatStoredValue('requirements.maxBandpassNm', 0.5)).toBe(`0.5${nbsp}nm`);
    expect(formatStoredValue('requirements.minResolvingPower', 2000)).toBe('2000');
    expect(formatStoredValue('requirements.oneShotCoverage', true)).toBe('yes');
    expect(formatStoredValue('slits.exitWidthUm', 100)).toBe(`100${nbsp}µm`);
  });
});

describe('the compare plots’ hatching', () => {
  it('marks where the after version misses its bandpass limit, from the grating equation', () => {
    // 1200 grooves/mm, 30° deviation, 300 mm focal lengths, 100 µm exit slit (Palmer & Loewen,
    // ch. 2 and 8): bandpass = 0.1 mm × d cos β / f = 0.2778 nm × cos β, with β = φ − 15° and
    // sin φ = λ / (2d cos 15°). It exceeds 0.27 nm while cos β > 0.972, |β| < 13.6°, φ < 28.6°:
    // λ < 2 × 833.33 × 0.9659 × 0.4787 ≈ 771 nm. The entrance image (100 µm × cos α / cos β ≤ 100 µm
    // there) never sets it. The sweep steps 5 nm and a band reaches half a step past its last
    // failing sample, so the hatching ends within a step of 771 nm.
    const after: Design = { ...structuredClone(exampleDesign), requirements: { maxBandpassNm: 0.27 } };
    const compared = compareSeries(exampleDesign, after);
    const intervals = compared.failingB!.bandpass.intervals;
    expect(intervals).toHaveLength(1);
    expect(intervals[0]!.startNm).toBeCloseTo(300, 6);
    expect(intervals[0]!.endNm).toBeGreaterThan(766);
    expect(intervals[0]!.endNm).toBeLessThan(776);
    expect(compared.failingB!.bandpass.summary).toMatch(/^bandpass over 0.27 nm between 300 and 7\d\d nm$/);
    expect(compared.failingB!.efficiency.intervals).toEqual([]);
    // The before version's requirements are not the after version's: nothing to hatch.
    expect(compareSeries(after, exampleDesign).failingB).toBeNull();
  });
});
