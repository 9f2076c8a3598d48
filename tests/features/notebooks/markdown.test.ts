import { describe, expect, it } from 'vitest';
import { inlineText, parseInline, parseMarkdown } from '../../../features/notebooks/markdown';

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
