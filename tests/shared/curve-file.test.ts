import { describe, expect, it } from 'vitest';
import {
  decodeCurveFile,
  describeCurveFileError,
  MAX_REPORTED_ERRORS,
  parseCurveFile,
  type CurveFileParsed,
  type CurveFileResult,
} from '../../shared/curve-file';
import { MAX_CURVE_POINTS, type CurveKind } from '../../shared/curves';

/**
 * The curve file reader. Conversions are by definition (1 µm = 1000 nm; a percent is a
 * hundredth); the unit rules from values are common practice (optical curves in nm start above
 * 100, so every wavelength below 30 means µm; a measured fraction never reaches 1.5).
 */

function parsed(result: CurveFileResult): CurveFileParsed {
  if (!result.ok) throw new Error(`refused: ${result.errors.map(describeCurveFileError).join('; ')}`);
  return result;
}
function refused(result: CurveFileResult): string[] {
  if (result.ok) throw new Error('expected a refusal');
  return result.errors.map(describeCurveFileError);
}

describe('units from the header', () => {
  it.each([
    { header: 'Wavelength (nm),Efficiency (%)', rows: ['500,45', '550,50'], unit: 'nm', scale: 'percent' },
    { header: 'lambda [µm],QE %', rows: ['0.5,45', '0.55,50'], unit: 'um', scale: 'percent' },
    { header: 'lambda [μm],R', rows: ['0.5,0.45', '0.55,0.5'], unit: 'um', scale: 'fraction' }, // Greek mu, U+03BC
    { header: 'um\tT (fraction)', rows: ['0.5\t0.45', '0.55\t0.5'], unit: 'um', scale: 'fraction' },
    { header: 'wavelength (microns);eff percent', rows: ['0,5;45', '0,55;50'], unit: 'um', scale: 'percent' },
  ] satisfies { header: string; rows: string[]; unit: 'nm' | 'um'; scale: 'percent' | 'fraction' }[])(
    "'$header' reads as $unit and $scale: 500 and 550 nm at 0.45 and 0.50",
    ({ header, rows, unit, scale }) => {
      const result = parsed(parseCurveFile([header, ...rows].join('\n'), 'grating-efficiency'));
      expect(result.detected.wavelengthUnit).toMatchObject({ value: unit, from: 'header' });
      expect(result.detected.valueScale).toMatchObject({ value: scale });
      expect(result.wavelengthsNm).toEqual([500, 550]);
      expect(result.values).toEqual([0.45, 0.5]);
    },
  );

  it('says what it detected and why, quoting the header', () => {
    const result = parsed(parseCurveFile('Wavelength (um),Efficiency (%)\n0.4,45\n0.5,50\n', 'grating-efficiency'));
    expect(result.detected.wavelengthUnit.reason).toBe("µm, from the header 'Wavelength (um)'");
    expect(result.detected.valueScale?.reason).toBe("percent, from the header 'Efficiency (%)'");
  });

  it('trusts the header over the values: nm stated, though every wavelength is below 30 (EUV)', () => {
    const result = parsed(parseCurveFile('wavelength (nm),R\n13.0,0.6\n13.5,0.7\n', 'mirror-reflectance'));
    expect(result.detected.wavelengthUnit).toMatchObject({ value: 'nm', from: 'header' });
    expect(result.wavelengthsNm).toEqual([13, 13.5]);
  });

  it('refuses ångström rather than reading them as nm, unless the uploader gives the unit', () => {
    expect(refused(parseCurveFile('Wavelength (Å),R\n5000,0.9\n6000,0.9\n', 'mirror-reflectance'))[0]).toContain('row 1, column 1 (Wavelength (Å)): gives wavelengths in ångström');
  });
});

describe('units from the values', () => {
  it('takes wavelengths all below 30 as µm and says so', () => {
    const result = parsed(parseCurveFile('0.4,0.2\n0.5,0.3\n29.9,0.1\n', 'detector-response'));
    expect(result.detected.wavelengthUnit).toMatchObject({ value: 'um', from: 'values' });
    expect(result.detected.wavelengthUnit.reason).toContain('below 30');
    // 0.4 µm × 1000 = 400 nm, 29.9 µm = 29 900 nm.
    expect(result.wavelengthsNm).toEqual([400, 500, 29900]);
  });

  it('takes wavelengths reaching 30 as nm', () => {
    expect(parsed(parseCurveFile('30,0.2\n40,0.3\n', 'detector-response')).detected.wavelengthUnit.value).toBe('nm');
  });

  it('takes a fraction kind with a value above 1.5 as percent, and one without as a fraction', () => {
    const percent = parsed(parseCurveFile('400,1.2\n500,1.6\n', 'filter-transmission'));
    expect(percent.detected.valueScale).toMatchObject({ value: 'percent', from: 'values' });
    expect(percent.values).toEqual([0.012, 0.016]);
    const fraction = parsed(parseCurveFile('400,0.2\n500,0.9\n', 'filter-transmission'));
    expect(fraction.detected.valueScale).toMatchObject({ value: 'fraction', from: 'values' });
  });

  it('keeps a source spectrum’s values as given: no value scale', () => {
    const result = parsed(parseCurveFile('400,1200\n500,3400.5\n', 'source-spectrum'));
    expect(result.detected.valueScale).toBeNull();
    expect(result.applied.valueScale).toBeNull();
    expect(result.values).toEqual([1200, 3400.5]);
  });

  it('leaves no binary tails from the conversion: 0.55 µm is 550 nm and 33.3 % is 0.333', () => {
    const result = parsed(parseCurveFile('um,%\n0.55,33.3\n0.57,66.7\n', 'grating-efficiency'));
    expect(result.wavelengthsNm).toEqual([550, 570]);
    expect(result.values).toEqual([0.333, 0.667]);
  });
});

describe('the medium', () => {
  it.each([
    { file: '# wavelengths in air\n500,0.4\n600,0.5\n', value: 'air', from: 'comment' },
    { file: '#Vacuum wavelengths\n500,0.4\n600,0.5\n', value: 'vacuum', from: 'comment' },
    { file: 'lambda vac (nm),T\n500,0.4\n600,0.5\n', value: 'vacuum', from: 'header' },
    { file: 'Air wavelength (nm),T\n500,0.4\n600,0.5\n', value: 'air', from: 'header' },
    { file: '# air, and vacuum below 200 nm\n500,0.4\n600,0.5\n', value: 'unstated', from: 'comment' },
    { file: '# repaired 2024\n500,0.4\n600,0.5\n', value: 'unstated', from: 'not-stated' },
  ] satisfies { file: string; value: 'air' | 'vacuum' | 'unstated'; from: string }[])('$value from $from: $file', ({ file, value, from }) => {
    expect(parsed(parseCurveFile(file, 'filter-transmission')).detected.medium).toMatchObject({ value, from });
  });
});

describe('corrections', () => {
  it('override what was detected and say which were corrected', () => {
    const result = parsed(parseCurveFile('10,0.1\n20,0.2\n', 'filter-transmission', { wavelengthUnit: 'nm', valueScale: 'percent', medium: 'vacuum' }));
    expect(result.detected.wavelengthUnit.value).toBe('um');
    expect(result.applied).toEqual({
      wavelengthUnit: { value: 'nm', corrected: true },
      valueScale: { value: 'percent', corrected: true },
      medium: { value: 'vacuum', corrected: true },
    });
    expect(result.wavelengthsNm).toEqual([10, 20]);
    expect(result.values).toEqual([0.001, 0.002]);
  });

  it('repeating the detected unit is no correction', () => {
    expect(parsed(parseCurveFile('500,0.1\n600,0.2\n', 'filter-transmission', { wavelengthUnit: 'nm' })).applied.wavelengthUnit).toEqual({ value: 'nm', corrected: false });
  });
});

describe('the file’s shape', () => {
  it('reads comma, tab and semicolon files, with decimal commas only in semicolon files', () => {
    expect(parsed(parseCurveFile('500,0.4\n600,0.5', 'mirror-reflectance')).delimiter).toBe(',');
    expect(parsed(parseCurveFile('500\t0.4\n600\t0.5', 'mirror-reflectance')).delimiter).toBe('\t');
    const semicolon = parsed(parseCurveFile('500;0,4\n600,5;0,5', 'mirror-reflectance'));
    expect(semicolon).toMatchObject({ delimiter: ';', decimalComma: true, wavelengthsNm: [500, 600.5], values: [0.4, 0.5] });
  });

  it('counts rows as file lines from 1, comments and blank lines included', () => {
    const result = parsed(parseCurveFile('# source: bench test\n\nnm,R\n500,0.4\n\n600,0.5\r\n', 'mirror-reflectance'));
    expect(result.header).toEqual({ row: 3, cells: ['nm', 'R'] });
    expect(result.firstRows).toEqual([
      { row: 4, cells: ['500', '0.4'] },
      { row: 6, cells: ['600', '0.5'] },
    ]);
  });

  it('reads quoted cells and a byte-order mark, and names the columns it ignored', () => {
    const result = parsed(parseCurveFile('\uFEFF"Wavelength, nm","Efficiency, %",TM\n500,45,40\n600,50,47\n', 'grating-efficiency'));
    expect(result.columns.wavelength).toEqual({ column: 1, name: 'Wavelength, nm' });
    expect(result.columns.ignored).toEqual([{ column: 3, name: 'TM' }]);
    expect(result.values).toEqual([0.45, 0.5]);
  });

  it('reads a line list of one, two or three columns', () => {
    expect(parsed(parseCurveFile('253.652\n404.656\n', 'line-list')).values).toEqual([1, 1]);
    expect(parsed(parseCurveFile('253.652,1000\n404.656,1800\n', 'line-list')).values).toEqual([1000, 1800]);
    const labelled = parsed(parseCurveFile('253.652,1000,Hg I\n404.656,,Hg I\n435.833,4000\n', 'line-list'));
    expect(labelled.values).toEqual([1000, 1, 4000]);
    expect(labelled.labels).toEqual(['Hg I', 'Hg I', '']);
    expect(labelled.columns.label).toEqual({ column: 3, name: null });
  });
});

describe('refusals name the row and column', () => {
  const cases = [
    { label: 'a word for a number', kind: 'grating-efficiency', file: 'nm,value\n500,0.4\nabc,0.5\n', message: "row 3, column 1 (nm): 'abc' is not a number" },
    { label: 'a value with a unit glued on', kind: 'grating-efficiency', file: '500,0.4\n600,0.5 %\n', message: "row 2, column 2 (value): '0.5 %' is not a number" },
    { label: 'a wavelength of 0', kind: 'source-spectrum', file: '0,1\n600,2\n', message: 'row 1, column 1 (wavelength): 0 must be greater than 0' },
    { label: 'falling wavelengths', kind: 'source-spectrum', file: '500,1\n400,2\n', message: 'row 2, column 1 (wavelength): 400 is not greater than 500 on row 1: wavelengths must increase' },
    { label: 'a repeated wavelength', kind: 'source-spectrum', file: '500,1\n500,2\n', message: 'row 2, column 1 (wavelength): 500 repeats the wavelength of row 1' },
    { label: 'a negative value', kind: 'line-list', file: '500,1\n600,-2\n', message: 'row 2, column 2 (relative intensity): -2 is negative' },
    { label: 'above 100 %', kind: 'mirror-reflectance', file: 'nm,R %\n500,99\n600,101\n', message: 'row 3, column 2 (R %): 101 is above 100 %' },
    { label: 'above 1 as a fraction', kind: 'detector-response', file: '500,0.9\n600,1.01\n', message: 'row 2, column 2 (value): 1.01 is above 1 as a fraction (if the file is in percent, correct the value scale)' },
    { label: 'one point', kind: 'mirror-reflectance', file: '# one\n500,0.9\n', message: 'row 2: is the only point: a curve needs at least 2' },
    { label: 'an unclosed quote', kind: 'mirror-reflectance', file: '500,0.9\n"600,0.9\n', message: 'row 2: has a quoted cell that is not closed on its line' },
    { label: 'a quoted cell across lines', kind: 'mirror-reflectance', file: 'nm,R\n500,"0.9\n0.8"\n600,0.5\n', message: 'row 2: has a quoted cell that is not closed on its line' },
    { label: 'a number too large', kind: 'source-spectrum', file: '500,1\n600,1e999\n', message: "row 2, column 2 (value): '1e999' is too large" },
    { label: 'a wavelength past 10 000 000 nm once converted', kind: 'source-spectrum', file: 'um,counts\n1,1\n20000,1\n', message: 'row 3, column 1 (um): after conversion must be greater than 0 and at most 10000000 nm' },
    { label: 'an empty file', kind: 'source-spectrum', file: '', message: 'is empty: it holds no rows of data' },
  ] satisfies { label: string; kind: CurveKind; file: string; message: string }[];

  it.each(cases)('$label', ({ kind, file, message }) => {
    expect(refused(parseCurveFile(file, kind))).toContain(message);
  });

  it('reports every bad cell, up to a bound', () => {
    const rows = Array.from({ length: 50 }, (_, i) => `${400 + i},x`);
    const errors = refused(parseCurveFile(rows.join('\n'), 'mirror-reflectance'));
    expect(errors).toHaveLength(MAX_REPORTED_ERRORS);
    expect(errors[1]).toBe("row 2, column 2 (value): 'x' is not a number");
  });

  it(`refuses point ${MAX_CURVE_POINTS + 1}, and reads ${MAX_CURVE_POINTS}`, () => {
    const rows = (n: number) => Array.from({ length: n }, (_, i) => `${300 + i},0.5`).join('\n');
    expect(parsed(parseCurveFile(rows(MAX_CURVE_POINTS), 'mirror-reflectance')).pointCount).toBe(MAX_CURVE_POINTS);
    expect(refused(parseCurveFile(rows(MAX_CURVE_POINTS + 1), 'mirror-reflectance'))[0]).toBe(
      `row ${MAX_CURVE_POINTS + 1}: is point ${MAX_CURVE_POINTS + 1}: a curve keeps at most ${MAX_CURVE_POINTS} points (the file has ${MAX_CURVE_POINTS + 1})`,
    );
  });
});

describe('text or not', () => {
  it('refuses NUL bytes, UTF-16 and invalid UTF-8, and reads UTF-8 with a byte-order mark', () => {
    const bytes = (text: string, encoding: BufferEncoding = 'utf8') => new Uint8Array(Buffer.from(text, encoding));
    expect(refused(parseCurveFile(bytes('500,0.4\n600,0.5\n', 'utf16le'), 'mirror-reflectance'))).toEqual(['is not a text file (save it as CSV or TSV in UTF-8)']);
    expect(refused(parseCurveFile(new Uint8Array([0x35, 0x30, 0x30, 0x2c, 0xc3, 0x28]), 'mirror-reflectance'))).toEqual(['is not a text file (save it as CSV or TSV in UTF-8)']);
    expect(refused(parseCurveFile('500,0.4\u0000\n600,0.5\n', 'mirror-reflectance'))).toEqual(['is not a text file (save it as CSV or TSV in UTF-8)']);
    const withBom = parsed(parseCurveFile(new Uint8Array([0xef, 0xbb, 0xbf, ...bytes('λ (nm),R\n500,0.4\n600,0.5\n')]), 'mirror-reflectance'));
    expect(withBom.header?.cells[0]).toBe('λ (nm)');
  });

  it('decodes text and bytes alike', () => {
    const text = 'µm,R\n0.5,0.4\n0.6,0.5\n';
    expect(decodeCurveFile(new TextEncoder().encode(text))).toEqual({ ok: true, text });
    expect(parseCurveFile(new TextEncoder().encode(text), 'mirror-reflectance')).toEqual(parseCurveFile(text, 'mirror-reflectance'));
  });
});
