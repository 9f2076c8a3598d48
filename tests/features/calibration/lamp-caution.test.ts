import { describe, expect, it } from 'vitest';
import { mercuryLampCautions } from '../../../features/calibration/lamp-caution';
import { cautionsFor } from '../../../features/safety/cautions';
import { exampleDesign, type Design } from '../../../shared/design';

describe('the mercury-lamp caution', () => {
  it('gives the UV, high-voltage and breakage cautions whatever the range, in the safety module’s own words', () => {
    // A visible-only design: the safety card itself would not raise the UV caution for it.
    const visible: Design = { ...exampleDesign, range: { startNm: 600, endNm: 700 }, source: { minNm: 550, maxNm: 750 } };
    expect(cautionsFor(visible).map((c) => c.id)).not.toContain('deep-uv');
    const cautions = mercuryLampCautions(visible);
    expect(cautions.map((c) => c.id)).toEqual(['deep-uv', 'lamp-high-voltage', 'mercury-breakage']);
    // One copy of the words: the same text the safety module gives a UV design.
    const uv = cautionsFor({ ...exampleDesign, range: { startNm: 250, endNm: 600 } });
    for (const c of cautions) expect(c.text).toBe(uv.find((u) => u.id === c.id)!.text);
    expect(cautions[0]!.text).toMatch(/ultraviolet below 300 nm/);
  });
});
