import { describe, expect, it } from 'vitest';
import { requirementFixField } from '../../../features/workbench/warning-fields';

describe('the field a failing requirement’s fix link opens', () => {
  it('is the design field the check names', () => {
    expect(requirementFixField({ id: 'maxBandpassNm', fixPath: 'slits.exitWidthUm' })).toBe('slits.exitWidthUm');
  });

  it('is a typed field, never the footprint block that holds two', () => {
    expect(requirementFixField({ id: 'maxFootprintMm', fixPath: 'requirements.maxFootprintMm' })).toBe(
      'requirements.maxFootprintMm.widthMm',
    );
    expect(requirementFixField({ id: 'maxFootprintMm', fixPath: null })).toBe('requirements.maxFootprintMm.widthMm');
  });

  it('is the requirement’s own field when no design field fits, so its limit can be eased', () => {
    expect(requirementFixField({ id: 'orderOverlap', fixPath: null })).toBe('requirements.orderOverlap');
  });
});
