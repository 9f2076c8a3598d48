import { describe, expect, it } from 'vitest';
import { exportFileName } from '@/shared/export-file-name';

describe('the export file name', () => {
  it.each([
    { title: 'Export me', expected: 'export-me.blazebook.json' },
    { title: 'Café spectrograph', expected: 'cafe-spectrograph.blazebook.json' },
    { title: '  UV   scanner  ', expected: 'uv-scanner.blazebook.json' },
    { title: 'Ｆｕｌｌｗｉｄｔｈ 1200', expected: 'fullwidth-1200.blazebook.json' },
    { title: 'near_IR - v2', expected: 'near_ir---v2.blazebook.json' },
  ] satisfies { title: string; expected: string }[])(
    'turns "$title" into $expected',
    ({ title, expected }) => {
      expect(exportFileName(title)).toBe(expected);
    },
  );

  it('never carries a path: slashes, dots and backslashes are dropped', () => {
    expect(exportFileName('../../etc/passwd')).toBe('etcpasswd.blazebook.json');
    expect(exportFileName('C:\\notes\\ct.json')).toBe('cnotesctjson.blazebook.json');
  });

  it('falls back to "notebook" when no plain letter is left', () => {
    expect(exportFileName('')).toBe('notebook.blazebook.json');
    expect(exportFileName('★ ☆ ✦')).toBe('notebook.blazebook.json');
    expect(exportFileName('Ωμέγα')).toBe('notebook.blazebook.json');
  });

  it('keeps at most 60 characters of the title', () => {
    const name = exportFileName('a'.repeat(100));
    expect(name).toBe(`${'a'.repeat(60)}.blazebook.json`);
  });
});
