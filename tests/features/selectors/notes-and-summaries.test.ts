import { describe, expect, it } from 'vitest';
import { cautionClosingLine } from '../../../features/safety/cautions';
import { uvNote } from '../../../features/selectors/uv-note';
import { describeXyPlot } from '../../../features/selectors/xy-plot-summary';

describe('the ultraviolet note', () => {
  it('appears when the range starts below 300 nm and hands the decision to the site', () => {
    const note = uvNote(250);
    expect(note?.title).toBe('Ultraviolet below 300\u00A0nm');
    expect(note?.text).toMatch(/^The range starts at 250\u00A0nm\./);
    expect(note?.closing).toBe(cautionClosingLine);
  });

  it('stays away from 300 nm up', () => {
    expect(uvNote(300)).toBeNull();
  });
});

describe('a calculator plot’s accessible summary', () => {
  it('reads the x span and each line’s span in its own format', () => {
    const text = describeXyPlot(
      'Transmission',
      'wavelength',
      'nm',
      [400, 500, 600],
      [
        { label: 'Stack', unit: '', values: [0, 0.5, 0.8], color: '#000', format: (v) => `${Math.round((v ?? 0) * 100)} %` },
        { label: 'Filter 1', unit: 'nm', values: [null, null, null], color: '#000' },
      ],
      'peaks at 550 nm',
    );
    expect(text).toBe(
      'Transmission against wavelength, 400 to 600\u00A0nm; Stack from 0 % to 80 %; no Filter 1 values; peaks at 550 nm',
    );
  });
});
