import { describe, expect, it } from 'vitest';
import { designSchema, exampleDesign, storedDesignSchema } from '../../shared/design';
import { REQUIREMENT_IDS, describeRequirementPath, requirementWords, requirementsSchema } from '../../shared/requirements';

/**
 * The requirements block's schema: every field refuses a bad value with a message naming what it
 * must be, at that field's path; the drive step comes with the wavelength error it qualifies; an
 * unknown key is named, not dropped; and a design without the block is unchanged.
 */

/** The first issue's path and message for `requirements` as given. */
function issueOf(requirements: unknown): { path: string; message: string } | undefined {
  const result = requirementsSchema.safeParse(requirements);
  if (result.success) return undefined;
  const [issue] = result.error.issues;
  return issue && { path: issue.path.join('.'), message: issue.message };
}

describe('requirements schema', () => {
  it('takes the issue’s example block as it is', () => {
    const block = {
      maxBandpassNm: 0.5,
      minResolvingPower: 2000,
      atWavelengthsNm: [404.7, 546.1],
      minBlazeEfficiency: 0.4,
      maxFNumber: 4,
      maxFocalLengthMm: 400,
      maxFootprintMm: { widthMm: 300, depthMm: 200 },
      minPixelsPerBandpass: 2,
      oneShotCoverage: true,
      maxWavelengthErrorNm: 0.05,
      driveStepArcsec: 2,
      orderOverlap: 'forbidden',
    };
    expect(requirementsSchema.parse(block)).toEqual(block);
  });

  it.each([
    { field: 'maxBandpassNm', value: 0, message: /greater than 0/ },
    { field: 'maxBandpassNm', value: 'half', message: /must be a number/ },
    { field: 'minResolvingPower', value: -5, message: /greater than 0/ },
    { field: 'minBlazeEfficiency', value: 40, message: /at most 1 \(a fraction/ },
    { field: 'minBlazeEfficiency', value: 0, message: /greater than 0/ },
    { field: 'maxFNumber', value: 0.2, message: /at least 0.5/ },
    { field: 'maxFNumber', value: 5000, message: /at most 1000/ },
    { field: 'maxFocalLengthMm', value: -1, message: /greater than 0/ },
    { field: 'minPixelsPerBandpass', value: 0, message: /greater than 0/ },
    { field: 'oneShotCoverage', value: 'yes', message: /true or false/ },
    { field: 'driveStepArcsec', value: 7200, message: /at most 3600 arcsec/ },
    { field: 'maxReciprocalDispersionNmPerMm', value: 0, message: /greater than 0/ },
    { field: 'orderOverlap', value: 'sometimes', message: /one of forbidden, filtered or allowed/ },
    { field: 'atWavelengthsNm', value: 546.1, message: /list of wavelengths/ },
    { field: 'atWavelengthsNm', value: [], message: /at least one wavelength/ },
    { field: 'atWavelengthsNm', value: Array.from({ length: 21 }, (_, i) => 400 + i), message: /at most 20 wavelengths/ },
  ] satisfies { field: string; value: unknown; message: RegExp }[])('refuses $field = $value, naming the field', ({ field, value, message }) => {
    const issue = issueOf({ [field]: value });
    expect(issue?.path).toBe(field);
    expect(issue?.message).toMatch(message);
  });

  it('names the bad item inside the wavelength list and the bad side of the footprint', () => {
    expect(issueOf({ atWavelengthsNm: [404.7, -1] })).toEqual({ path: 'atWavelengthsNm.1', message: 'must be greater than 0' });
    expect(issueOf({ maxFootprintMm: { widthMm: 300 } })).toEqual({ path: 'maxFootprintMm.depthMm', message: 'is required' });
    expect(issueOf({ maxFootprintMm: { widthMm: 300, depthMm: 200, heightMm: 90 } })?.message).toMatch(/unknown field 'heightMm'/);
  });

  it('needs driveStepArcsec with maxWavelengthErrorNm, and says why', () => {
    const issue = issueOf({ maxWavelengthErrorNm: 0.05 });
    expect(issue?.path).toBe('driveStepArcsec');
    expect(issue?.message).toMatch(/required with maxWavelengthErrorNm/);
    expect(requirementsSchema.safeParse({ maxWavelengthErrorNm: 0.05, driveStepArcsec: 2 }).success).toBe(true);
    // A drive step alone is fine: it only qualifies the wavelength error.
    expect(requirementsSchema.safeParse({ driveStepArcsec: 2 }).success).toBe(true);
  });

  it('names an unknown key, so a misspelt limit is not silently dropped', () => {
    expect(issueOf({ maxBandpassNM: 0.5 })).toEqual({ path: '', message: "has an unknown field 'maxBandpassNM' (check the spelling)" });
  });

  it('reports the bad field under params.requirements inside a design', () => {
    const result = designSchema.safeParse({ ...exampleDesign, requirements: { minBlazeEfficiency: 2 } });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((issue) => issue.path.join('.'))).toEqual(['requirements.minBlazeEfficiency']);
  });

  it('leaves a design without requirements exactly as it was', () => {
    expect(storedDesignSchema.parse(exampleDesign)).toEqual(exampleDesign);
    expect('requirements' in storedDesignSchema.parse(exampleDesign)).toBe(false);
    expect(JSON.stringify(designSchema.parse(structuredClone(exampleDesign)))).toBe(JSON.stringify(exampleDesign));
  });

  it('has words for every requirement and names its compare path', () => {
    for (const id of REQUIREMENT_IDS) expect(requirementWords[id].short, id).toBeTruthy();
    expect(describeRequirementPath('requirements.maxFootprintMm.widthMm')).toBe('Requirements: max footprint width (mm)');
    expect(describeRequirementPath('slits.exitWidthUm')).toBeNull();
  });
});
