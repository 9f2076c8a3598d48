import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '@/shared/design';
import { cautionClosingLine, cautionsFor, mercuryLinesInRange } from '@/features/safety/cautions';

function design(range: Design['range'], source: Design['source'] = undefined): Design {
  return { ...structuredClone(exampleDesign), range, source };
}

const ids = (d: Design) => cautionsFor(d).map((caution) => caution.id);

describe('cautionsFor', () => {
  it('warns of ultraviolet when the range starts below 300 nm', () => {
    const uv = cautionsFor(design({ startNm: 250, endNm: 600 })).find((caution) => caution.id === 'deep-uv');
    expect(uv?.why).toContain('250\u00A0nm');
    expect(uv?.why).toMatch(/range starts/);
  });

  it('warns of ultraviolet when only the source reaches below 300 nm', () => {
    const uv = cautionsFor(design({ startNm: 400, endNm: 700 }, { minNm: 190, maxNm: 1100 })).find((c) => c.id === 'deep-uv');
    expect(uv?.why).toContain('190\u00A0nm');
    expect(uv?.why).not.toMatch(/range starts/);
  });

  it.each([
    { range: { startNm: 300, endNm: 900 }, source: undefined },
    { range: { startNm: 400, endNm: 700 }, source: { minNm: 300, maxNm: 1100 } },
  ] satisfies { range: Design['range']; source: Design['source'] }[])(
    'leaves ultraviolet out when nothing goes below 300 nm ($range.startNm nm, source $source.minNm)',
    ({ range, source }) => {
      expect(ids(design(range, source))).not.toContain('deep-uv');
    },
  );

  it('always lists the lamp supply and laser cautions', () => {
    for (const d of [design({ startNm: 1000, endNm: 1500 }), design({ startNm: 200, endNm: 300 })]) {
      expect(ids(d)).toEqual(expect.arrayContaining(['lamp-high-voltage', 'lasers']));
    }
  });

  // Strong Hg I lines, NIST Handbook of Basic Atomic Spectroscopic Data, mercurytable2:
  // 253.652, 296.728, 365.015, 404.656, 435.833, 546.074, 576.960, 579.066 nm.
  it('names the mercury lines inside the range', () => {
    const d = design({ startNm: 540, endNm: 580 });
    expect(mercuryLinesInRange(d)).toEqual([546.07, 576.96, 579.07]);
    const mercury = cautionsFor(d).find((caution) => caution.id === 'mercury-breakage');
    expect(mercury?.why).toContain('546.07, 576.96 and 579.07');
  });

  it('leaves mercury breakage out when no strong mercury line is in the range', () => {
    // 600–1000 nm: the longest line listed is 579.07 nm.
    expect(ids(design({ startNm: 600, endNm: 1000 }))).not.toContain('mercury-breakage');
    // Between 440 and 540 nm: 435.83 below and 546.07 above.
    expect(ids(design({ startNm: 440, endNm: 540 }))).not.toContain('mercury-breakage');
  });

  it('ends every caution with the same closing line', () => {
    const all = cautionsFor(design({ startNm: 200, endNm: 900 }, { minNm: 190, maxNm: 1100 }));
    expect(all.map((caution) => caution.id)).toEqual(['deep-uv', 'lamp-high-voltage', 'mercury-breakage', 'lasers']);
    for (const caution of all) {
      expect(caution.closing).toBe(cautionClosingLine);
      expect(caution.text).not.toContain(cautionClosingLine);
      expect(caution.why.split('\n')).toHaveLength(1);
    }
  });
});
