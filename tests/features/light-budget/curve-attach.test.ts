import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { baseName, designCurveFrom, sha256Hex } from '@/features/light-budget/curve-attach';
import { parseCurveFile } from '@/shared/curve-file';

const csv = 'wavelength (nm),efficiency (%)\n400,50\n500,70\n600,60\n';

describe('attaching a parsed upload to a design', () => {
  it('fingerprints the bytes with SHA-256 exactly as node:crypto does', async () => {
    const bytes = new TextEncoder().encode(csv);
    expect(await sha256Hex(bytes)).toBe(createHash('sha256').update(bytes).digest('hex'));
  });
  it('names a curve after its file without the extension', () => {
    expect(baseName('C:\\reports\\grating-1200.CSV')).toBe('grating-1200');
    expect(baseName('/tmp/mirror.tsv')).toBe('mirror');
    expect(baseName('.csv')).toBe('Measured curve');
  });
  it('makes a schema-valid design curve with the role fields of its kind only', () => {
    const parsed = parseCurveFile(csv, 'grating-efficiency');
    if (!parsed.ok) throw new Error('expected the demo file to parse');
    const made = designCurveFrom(parsed, ' Batch 7 ', 'd'.repeat(64), { order: 1, polarisation: 'te', mirror: 'camera' });
    expect(made).toEqual({
      ok: true,
      curve: {
        kind: 'grating-efficiency',
        name: 'Batch 7',
        checksum: 'd'.repeat(64),
        medium: 'unstated',
        order: 1,
        polarisation: 'te',
        // Percent read from the header and stored as fractions.
        wavelengthsNm: [400, 500, 600],
        values: [0.5, 0.7, 0.6],
      },
    });
  });
  it('refuses an empty name, naming the field', () => {
    const parsed = parseCurveFile(csv, 'detector-response');
    if (!parsed.ok) throw new Error('expected the demo file to parse');
    const made = designCurveFrom(parsed, '  ', 'd'.repeat(64), {});
    expect(made.ok ? null : made.fields).toEqual({ name: 'must not be empty' });
  });
});
