import { describe, expect, it } from 'vitest';
import {
  bandpassBasisOptions,
  blankRequirementsText,
  requirementsFromText,
  requirementsTextSchema,
  requirementsToText,
} from '@/features/workbench/requirement-fields';
import { BANDPASS_BASES } from '@/shared/requirements';

/** The editor's bandpass basis: kept as chosen, absent by default, read from drafts typed before it existed. */
describe('the bandpass basis in the requirements editor', () => {
  it('offers exactly the stored choices', () => {
    expect(bandpassBasisOptions.map((option) => option.value)).toEqual([...BANDPASS_BASES]);
  });

  it('stores traced when chosen and nothing when left at the default', () => {
    const text = { ...blankRequirementsText(), maxBandpassNm: '0.5', bandpassBasis: 'traced' as const };
    expect(requirementsFromText(text).requirements).toEqual({ maxBandpassNm: 0.5, bandpassBasis: 'traced' });
    expect(requirementsFromText({ ...text, bandpassBasis: '' }).requirements).toEqual({ maxBandpassNm: 0.5 });
  });

  it('round-trips a stored basis, slit-limited included', () => {
    for (const basis of BANDPASS_BASES) {
      const text = requirementsToText({ maxBandpassNm: 0.5, bandpassBasis: basis });
      expect(text.bandpassBasis).toBe(basis);
      expect(requirementsFromText(text).requirements).toEqual({ maxBandpassNm: 0.5, bandpassBasis: basis });
    }
  });

  it('reads a draft saved before the basis existed as slit-limited', () => {
    const { bandpassBasis: _dropped, ...old } = blankRequirementsText();
    void _dropped;
    expect(requirementsTextSchema.parse(old).bandpassBasis).toBe('');
  });
});
