import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import type { TextItem } from 'pdfjs-dist/types/src/display/api';
import { describe, expect, it } from 'vitest';
import { exampleDesign, type Design } from '../../../shared/design';
import { buildSheet } from '../../../server/sheets/build';
import { cautionsSection } from '../../../server/sheets/sections/cautions';
import { notesSection } from '../../../server/sheets/sections/notes';
import { reviewSection } from '../../../server/sheets/sections/review';
import { margins } from '../../../server/sheets/writer';
import type { SheetSection } from '../../../server/sheets/section';
import { cautionClosingLine, cautionsFor } from '../../../features/safety/cautions';
import { pdfText } from './pdf-text';
import { sampleReview, sampleSheet, sampleVersion } from './sample';

type Overrides = Parameters<typeof sampleSheet>[0];

/** The text of a sheet of `sections`, with runs of white space (line ends too) as one space. */
async function flatText(sections: SheetSection[], overrides: Overrides = {}): Promise<string> {
  const { text } = await pdfText(await buildSheet(sampleSheet(overrides), sections));
  return flat(text);
}

/**
 * Runs of white space (no-break spaces and line ends too) as one space, in NFKC form: pdfjs reads
 * the micro sign µ (U+00B5) back as the Greek μ (U+03BC), its NFKC equivalent.
 */
function flat(text: string): string {
  return text.normalize('NFKC').replace(/\s+/g, ' ');
}

function withNotes(notes: string): Overrides {
  return { version: sampleVersion(exampleDesign, 3, notes) };
}

function occurrences(text: string, part: string): number {
  return text.split(part).length - 1;
}

describe('version notes on the sheet', () => {
  it('prints the notes as text, without their Markdown marks', async () => {
    const text = await flatText([notesSection]);
    expect(text).toContain('Version notes');
    expect(text).toContain('Why this version');
    expect(text).toContain(flat('The exit slit went from 100 µm to 60 µm'));
    expect(text).toContain('Ask the shop about the slit jaws.');
    for (const mark of ['**', '# Why', '[grating equation]', '> Ask', '- Grating']) expect(text).not.toContain(mark);
  });

  it('writes a link as its text followed by its address', async () => {
    const text = await flatText([notesSection]);
    expect(text).toContain('grating equation (https://en.wikipedia.org/wiki/Diffraction_grating) numbers at 300 nm');
  });

  it('writes an address that may not be opened as text only, and code with its spaces and Greek', async () => {
    const notes = 'See [the plan](docs/plan.md) and `λ = 2d sin θ`.\n\n```\nfor λ in range:\n    print(λ)\n```\n\n1. one\n2. two';
    const text = await flatText([notesSection], withNotes(notes));
    expect(text).toContain('See the plan (docs/plan.md) and λ = 2d sin θ.');
    expect(text).toContain('for λ in range: print(λ)');
    expect(text).not.toContain('`');
    expect(text).toContain('1. one');
    expect(text).toContain('2. two');
  });

  it('says so when the version has no notes', async () => {
    expect(await flatText([notesSection], withNotes('  \n'))).toContain('No notes on this version.');
  });

  it.each(['a4', 'letter'] as const)('breaks a 40,000-character note across pages and keeps every line inside the margins (%s)', async (paper) => {
    const paragraph = 'The grating turns through the range while the exit slit stays put, so the bandpass follows the dispersion. ';
    const longWord = 'x'.repeat(3000);
    const longCode = `\`\`\`\n${'y'.repeat(400)}\n\`\`\``;
    let notes = `${longWord}\n\n${longCode}\n\n`;
    while (notes.length < 40_000) notes += `${paragraph.repeat(4)}\n\n- ${paragraph}\n\n`;
    const bytes = await buildSheet(sampleSheet({ ...withNotes(notes), paper }), [notesSection]);
    const task = getDocument({ data: new Uint8Array(bytes), useSystemFonts: false, isEvalSupported: false, verbosity: 0 });
    const doc = await task.promise;
    try {
      // 40,000 characters at about 110 per line and 12 points a line is over 3,000 points of text.
      expect(doc.numPages).toBeGreaterThanOrEqual(4);
      for (let n = 1; n <= doc.numPages; n += 1) {
        const page = await doc.getPage(n);
        const { width, height } = page.getViewport({ scale: 1 });
        const { items } = await page.getTextContent();
        for (const item of items.filter((i): i is TextItem => 'str' in i && i.str.trim() !== '')) {
          const x = item.transform[4] as number;
          const baseline = height - (item.transform[5] as number);
          expect(x).toBeGreaterThanOrEqual(margins.left - 0.5);
          expect(x + item.width).toBeLessThanOrEqual(width - margins.right + 0.5);
          expect(baseline).toBeGreaterThanOrEqual(margins.top);
          // The footer sits in the bottom margin; body text stays above it.
          if (!/^(Generated|Page \d)/.test(item.str) && !item.str.startsWith('http://localhost')) {
            expect(baseline).toBeLessThanOrEqual(height - margins.bottom + 2);
          }
        }
      }
    } finally {
      await task.destroy();
    }
  });
});

describe('design review on the sheet', () => {
  it('shows team members the open threads, their pins and remarks', async () => {
    const text = await flatText([reviewSection]);
    expect(text).toContain('Design review');
    expect(text).toContain('Signed off with remarks');
    expect(text).toContain('Exit slit width');
    expect(text).toContain('Bandpass at 589 nm');
    expect(text).toContain('Still applies (from v2)');
    expect(text).toContain(flat('Is 60 µm at the exit the value we agreed on? The requirement says 0.2 nm.'));
    expect(text).not.toContain('**60');
    expect(text).toContain('Bandpass at 589 nm needs a second look once the slit is cut.');
    expect(text).toContain('Fine to build once the exit slit question is settled.');
    expect(text).toContain('Tomas Lindqvist');
    expect(text).toContain('4 Dec 2026');
  });

  it('shows a share link holder the state and decisions but no thread text', async () => {
    const text = await flatText([reviewSection], { audience: 'link' });
    expect(text).toContain('Signed off with remarks');
    expect(text).toContain('Fine to build once the exit slit question is settled.');
    expect(text).toMatch(/Open threads 2\b/);
    expect(text).toContain('Remarks are shown to team members only.');
    for (const hidden of ['Is 60', 'second look', 'Exit slit width', 'Bandpass at 589 nm', 'Still applies']) {
      expect(text).not.toContain(hidden);
    }
  });

  it('writes a mention as the plain name and emphasis without its marks', async () => {
    const review = sampleReview();
    const first = review.threads[0]!;
    review.threads[0] = {
      ...first,
      remarks: [{ ...first.remarks[0]!, body: '@Mira Okafor, is *this* the slit we ordered?', mentions: [{ id: 'u_author', displayName: 'Mira Okafor' }] }],
    };
    const text = await flatText([reviewSection], { review });
    expect(text).toContain('Mira Okafor, is this the slit we ordered?');
    expect(text).not.toContain('@Mira');
  });

  it('counts resolved threads without printing them', async () => {
    const review = sampleReview();
    review.threads[1] = { ...review.threads[1]!, status: 'resolved', resolvedAt: '2026-11-30T09:00:00.000Z' };
    const text = await flatText([reviewSection], { review });
    expect(text).toContain('1 resolved thread not shown.');
    expect(text).not.toContain('second look');
  });

  it('says so when the version has no review', async () => {
    expect(await flatText([reviewSection], { review: null })).toContain('No review yet.');
  });
});

describe('safety cautions on the sheet', () => {
  const design = (range: Design['range'], source: Design['source']): Design => ({ ...structuredClone(exampleDesign), range, source });

  it('ends every caution with the closing line, once each', async () => {
    const params = design({ startNm: 250, endNm: 600 }, { minNm: 200, maxNm: 1100 });
    const text = await flatText([cautionsSection], { params, version: sampleVersion(params) });
    const cautions = cautionsFor(params);
    expect(cautions).toHaveLength(4);
    expect(occurrences(text, cautionClosingLine)).toBe(cautions.length);
    // Each caution reads title, text, reason, then the closing line before the next title.
    let from = 0;
    for (const caution of cautions) {
      const title = text.indexOf(caution.title, from);
      const why = text.indexOf(flat(caution.why), title);
      const closing = text.indexOf(cautionClosingLine, why);
      expect(title).toBeGreaterThanOrEqual(from);
      expect(why).toBeGreaterThan(title);
      expect(closing).toBeGreaterThan(why);
      from = closing + cautionClosingLine.length;
    }
  });

  it('prints the ultraviolet caution only when the design reaches below 300 nm', async () => {
    const deep = design({ startNm: 250, endNm: 600 }, undefined);
    const visible = design({ startNm: 400, endNm: 700 }, { minNm: 350, maxNm: 1100 });
    const deepText = await flatText([cautionsSection], { params: deep, version: sampleVersion(deep) });
    const visibleText = await flatText([cautionsSection], { params: visible, version: sampleVersion(visible) });
    expect(deepText).toContain('Ultraviolet below 300 nm');
    expect(deepText).toContain('The range starts at 250 nm');
    expect(visibleText).not.toContain('Ultraviolet below 300 nm');
    expect(visibleText).toContain('Lasers');
    expect(visibleText).toContain('High-voltage lamp supplies');
  });
});
