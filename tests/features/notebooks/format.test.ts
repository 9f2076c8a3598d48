import { describe, expect, it } from 'vitest';
import { describedFieldByPath, layoutKindOptions } from '../../../shared/design-fields';
import {
  changeTone,
  describePath,
  editorFieldName,
  editorSectionTitle,
  formatFigure,
  formatParam,
  formatParamAt,
  formatRelativeChange,
  withArticle,
} from '../../../features/notebooks/format';

describe('changes between versions, in words', () => {
  it.each([
    { relative: -0.12, text: '−12\u202F%' },
    { relative: 0.034, text: '+3.4\u202F%' },
    { relative: 0, text: '±0\u202F%' },
    { relative: 0.00001, text: '±0\u202F%' },
    { relative: 1.5, text: '+150\u202F%' },
    { relative: -0.00001, text: '±0\u202F%' },
    { relative: 0.0996, text: '+10\u202F%' },
    { relative: -123.4, text: '\u221212\u202F340\u202F%' },
    { relative: null, text: '—' },
  ] satisfies { relative: number | null; text: string }[])('$relative reads "$text"', ({ relative, text }) => {
    expect(formatRelativeChange(relative)).toBe(text);
  });

  it('calls a narrower bandpass better and a lower R worse', () => {
    expect(changeTone('bandpassAtCentreNm', -0.12)).toBe('ok');
    expect(changeTone('resolvingPowerAtCentre', -0.12)).toBe('danger');
    expect(changeTone('fNumber', 0.2)).toBe('muted');
  });

  it('writes figures with their units', () => {
    expect(formatFigure('bandpassAtCentreNm', 0.5234)).toBe('0.5234 nm');
    expect(formatFigure('fNumber', 4.06)).toBe('f/4.06');
    expect(formatFigure('resolvingPowerAtCentre', null)).toBe('—');
  });

  it('shows a stored parameter in full, with a true minus and grouped digits', () => {
    expect(formatParam(-0.1 - 0.2)).toBe('\u22120.3');
    expect(formatParam(123456.789)).toBe('123\u202F456.789');
    expect(formatParam(null)).toBe('not set');
  });

  it('names parameter paths the way the editor labels them', () => {
    expect(describePath('slits.exitWidthUm')).toBe('Slits: exit width (µm)');
    expect(describePath('detector')).toBe('Detector');
  });
});

describe('the compare table in the editor’s words', () => {
  it('names each field by the editor’s label and unit, and each section by its heading', () => {
    const field = describedFieldByPath.get('slits.exitWidthUm');
    expect(field?.kind).toBe('quantity');
    expect(editorFieldName('slits.exitWidthUm')).toBe(`${field?.label} (µm)`);
    expect(editorFieldName('layout.kind')).toBe('Mount type');
    expect(editorSectionTitle('layout.kind')).toBe('Mount');
    expect(editorFieldName('layout')).toBe('Mount');
  });

  it('shows every mount kind by the label its editor chip carries, never the stored value', () => {
    for (const option of layoutKindOptions) {
      expect(formatParamAt('layout.kind', option.value)).toBe(option.label);
      expect(formatParamAt('layout.kind', option.value)).not.toBe(option.value);
    }
    expect(formatParamAt('layout.kind', 'czerny-turner')).toBe('Czerny–Turner');
    expect(formatParamAt('layout.deviationAngleDeg', -12.5)).toBe('\u221212.5');
  });

  it('puts the right article before a role', () => {
    expect(withArticle('reviewer')).toBe('a reviewer');
    expect(withArticle('owner')).toBe('an owner');
    expect(withArticle('editor')).toBe('an editor');
    expect(withArticle('viewer')).toBe('a viewer');
  });
});
