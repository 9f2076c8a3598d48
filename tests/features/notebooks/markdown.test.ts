import { describe, expect, it } from 'vitest';
import { inlineText, parseInline, parseMarkdown, type Block, type Inline } from '../../../features/notebooks/markdown';

describe('the notes reader', () => {
  it('reads headings, paragraphs joined across lines, and both kinds of list', () => {
    const blocks = parseMarkdown('# Why 1200/mm\nThe blaze sits\nat 500 nm.\n\n- wider slit\n- f/4\n\n2. first\n3. second');
    expect(blocks.map((b) => b.kind)).toEqual(['heading', 'paragraph', 'list', 'list']);
    expect(blocks[1]).toEqual({ kind: 'paragraph', children: [{ kind: 'text', text: 'The blaze sits at 500 nm.' }] });
    expect(blocks[2]).toMatchObject({ kind: 'list', ordered: false, items: [[{ text: 'wider slit' }], [{ text: 'f/4' }]] });
    expect(blocks[3]).toMatchObject({ kind: 'list', ordered: true, start: 2 });
  });

  it('keeps fenced code verbatim, Markdown marks included', () => {
    expect(parseMarkdown('```\n*not em* # nor heading\n```')).toEqual([{ kind: 'code', text: '*not em* # nor heading' }]);
  });

  it('reads emphasis, strong and inline code, and leaves snake_case words alone', () => {
    expect(parseInline('a *b* **c** `d*e` file_name_v2')).toEqual([
      { kind: 'text', text: 'a ' },
      { kind: 'em', children: [{ kind: 'text', text: 'b' }] },
      { kind: 'text', text: ' ' },
      { kind: 'strong', children: [{ kind: 'text', text: 'c' }] },
      { kind: 'text', text: ' ' },
      { kind: 'code', text: 'd*e' },
      { kind: 'text', text: ' file_name_v2' },
    ]);
  });

  it('turns HTML into the characters it is written with, never markup', () => {
    const [block] = parseMarkdown('<script>alert(1)</script> <img src=x onerror=y>');
    expect(block?.kind).toBe('paragraph');
    expect(block && block.kind === 'paragraph' ? inlineText(block.children) : '').toBe('<script>alert(1)</script> <img src=x onerror=y>');
  });

  it('gives nothing for empty notes', () => {
    expect(parseMarkdown('  \n\n')).toEqual([]);
  });
});

/** Paragraph text of a one-paragraph note. */
const paragraphText = (source: string) => {
  const blocks = parseMarkdown(source);
  expect(blocks.map((b) => b.kind)).toEqual(['paragraph']);
  const [block] = blocks;
  return block?.kind === 'paragraph' ? inlineText(block.children) : '';
};

/** How deeply spans nest (the views draw one `Text` per level). */
const depth = (spans: readonly Inline[]): number =>
  Math.max(0, ...spans.map((span) => (span.kind === 'em' || span.kind === 'strong' ? 1 + depth(span.children) : 0)));

describe('the notes reader on pathological notes', () => {
  // The old hand-written reader took about 10 s on the first of these (issue 10); a linear parser
  // reads each in well under a second, so the 3 s limit fails only if the time grows with n².
  const LIMIT_MS = 3_000;

  it.each([
    // A line of three or more `*` is a thematic break (CommonMark 0.31, §4.1).
    { name: '"**" × 25,000', source: '**'.repeat(25_000), expected: [{ kind: 'rule' }] },
    // Fifty thousand backticks open a fence that runs to the end: an empty code block (§4.5).
    { name: 'a 50,000-character line of backticks', source: '`'.repeat(50_000), expected: [{ kind: 'code', text: '' }] },
  ] satisfies { name: string; source: string; expected: Block[] }[])('reads $name in time', ({ source, expected }) => {
    expect(parseMarkdown(source)).toEqual(expected);
  }, LIMIT_MS);

  it.each([
    { name: '"[" × 20,000 (link openers that never close)', source: '['.repeat(20_000) },
    { name: '"[a](" × 20,000 (links that never end)', source: '[a]('.repeat(20_000) },
    { name: 'backticks mid-line, no span closes', source: `a ${'`'.repeat(50_000)}` },
    { name: '"**" × 25,000 after a word', source: `a ${'**'.repeat(25_000)}` },
  ])('keeps $name as its characters, in time', ({ source }) => {
    expect(paragraphText(source)).toBe(source);
  }, LIMIT_MS);

  it('reads "*a" × 20,000 as alternating emphasis, in time', () => {
    const [block] = parseMarkdown('*a'.repeat(20_000));
    expect(block?.kind === 'paragraph' ? inlineText(block.children) : '').toBe('a'.repeat(20_000));
  }, LIMIT_MS);

  it('reads 20,000 nested emphasis marks in time, nesting spans at most eight deep', () => {
    const [block] = parseMarkdown(`${'*'.repeat(20_000)}a${'*'.repeat(20_000)}`);
    expect(block?.kind === 'paragraph' ? inlineText(block.children) : '').toBe('a');
    expect(block?.kind === 'paragraph' ? depth(block.children) : Infinity).toBe(8);
  }, LIMIT_MS);

  it.each([
    { name: '20,000 nested quotes', source: `${'>'.repeat(20_000)} x` },
    { name: '20,000 nested lists', source: `${'- '.repeat(20_000)}x` },
    { name: '20,000 lines of quote', source: '> a\n'.repeat(20_000) },
  ])('reads $name in time', ({ source }) => {
    expect(Array.isArray(parseMarkdown(source))).toBe(true);
  }, LIMIT_MS);

  it('keeps the text of quotes and lists nested as deep as real notes go', () => {
    expect(parseMarkdown(`${'> '.repeat(30)}deep`)).toEqual([{ kind: 'paragraph', children: [{ kind: 'text', text: 'deep' }] }]);
    expect(parseMarkdown(`${'- '.repeat(30)}deep`)).toEqual([
      { kind: 'list', ordered: false, start: 1, items: [[{ kind: 'text', text: 'deep' }]] },
    ]);
  });
});

describe('the notes reader keeps notes inert', () => {
  it('shows a relative link as its text and address, an https link as its text (it becomes a link), and a javascript: link as its characters', () => {
    expect(paragraphText('[v2](/notebooks/a/v/2) [grating](https://example.org/g) <https://example.org/h>')).toBe(
      'v2 (/notebooks/a/v/2) grating https://example.org/h',
    );
    expect(paragraphText('[x](javascript:alert(1))')).toBe('[x](javascript:alert(1))');
  });

  it('keeps an HTML block as the characters it is written with', () => {
    expect(paragraphText('<div onclick="x()">\n<b>hi</b>\n</div>')).toBe('<div onclick="x()"> <b>hi</b> </div>');
  });

  it('lists a nested list after its item and numbers the rest on', () => {
    expect(parseMarkdown('1. one\n   - a\n   - b\n2. two')).toEqual([
      { kind: 'list', ordered: true, start: 1, items: [[{ kind: 'text', text: 'one' }]] },
      { kind: 'list', ordered: false, start: 1, items: [[{ kind: 'text', text: 'a' }], [{ kind: 'text', text: 'b' }]] },
      { kind: 'list', ordered: true, start: 2, items: [[{ kind: 'text', text: 'two' }]] },
    ]);
  });
});
