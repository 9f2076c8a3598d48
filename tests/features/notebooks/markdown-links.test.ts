import { describe, expect, it } from 'vitest';
import { inlineText, openableHref, parseInline, parseMarkdown, type Inline } from '../../../features/notebooks/markdown';

/** The spans of a one-paragraph source. */
const spansOf = (source: string, mentions?: readonly string[]): Inline[] => {
  const blocks = parseMarkdown(source, { mentions });
  expect(blocks.map((b) => b.kind)).toEqual(['paragraph']);
  const [block] = blocks;
  return block?.kind === 'paragraph' ? block.children : [];
};

/** Every link span anywhere in the tree. */
const linksIn = (spans: readonly Inline[]): Extract<Inline, { kind: 'link' }>[] =>
  spans.flatMap((span) =>
    span.kind === 'link' ? [span, ...linksIn(span.children)] : span.kind === 'em' || span.kind === 'strong' ? linksIn(span.children) : [],
  );

describe('links in notes and remarks', () => {
  it('makes an https link a link span with the normalised address and its own text', () => {
    expect(spansOf('See [the data sheet](<HTTPS://Example.COM/a b?x=1>).')).toEqual([
      { kind: 'text', text: 'See ' },
      { kind: 'link', href: 'https://example.com/a%20b?x=1', children: [{ kind: 'text', text: 'the data sheet' }] },
      { kind: 'text', text: '.' },
    ]);
  });

  it('makes mailto links and autolinks links too', () => {
    expect(linksIn(spansOf('[write](mailto:lab@example.org) or <https://example.com/x> or <lab@example.org>'))).toEqual([
      { kind: 'link', href: 'mailto:lab@example.org', children: [{ kind: 'text', text: 'write' }] },
      { kind: 'link', href: 'https://example.com/x', children: [{ kind: 'text', text: 'https://example.com/x' }] },
      { kind: 'link', href: 'mailto:lab@example.org', children: [{ kind: 'text', text: 'lab@example.org' }] },
    ]);
  });

  it.each([
    // The parser's own check already refuses these schemes: the brackets stay as written.
    { name: 'a javascript: link', source: '[click](javascript:window.__pwned=3)', text: '[click](javascript:window.__pwned=3)' },
    { name: 'a JavaScript: link with odd case and an entity', source: '[x](JaVaScRiPt&#58;alert(1))', text: '[x](JaVaScRiPt:alert(1))' },
    { name: 'a data: link', source: '[img](data:text/html;base64,PHNjcmlwdD4=)', text: '[img](data:text/html;base64,PHNjcmlwdD4=)' },
    { name: 'a vbscript: link', source: '[v](vbscript:msgbox)', text: '[v](vbscript:msgbox)' },
    { name: 'a file: link', source: '[lab share](file:///etc/passwd)', text: '[lab share](file:///etc/passwd)' },
    // These pass the parser and are refused here: text plus the address.
    { name: 'a relative link', source: '[v2](/notebooks/abc/v/2)', text: 'v2 (/notebooks/abc/v/2)' },
    { name: 'an ftp: link', source: '[old](ftp://example.com/x)', text: 'old (ftp://example.com/x)' },
    { name: 'an address without a scheme', source: '[site](example.com)', text: 'site (example.com)' },
  ])('keeps $name as text, never a link span', ({ source, text }) => {
    const spans = spansOf(source);
    expect(linksIn(spans)).toEqual([]);
    expect(inlineText(spans)).toBe(text);
  });

  it('reads <script> and an <img onerror> as the characters they are', () => {
    const source = '<script>alert(1)</script> and <img src=x onerror=alert(1)>';
    const spans = spansOf(source);
    expect(spans).toEqual([{ kind: 'text', text: source }]);
  });

  it('keeps an image as its alt text, never loading its address', () => {
    expect(spansOf('![slit photo](https://example.com/p.png)')).toEqual([{ kind: 'text', text: 'slit photo' }]);
  });

  it('gives a link without text its address to press', () => {
    expect(spansOf('[](https://example.com/)')).toEqual([
      { kind: 'link', href: 'https://example.com/', children: [{ kind: 'text', text: 'https://example.com/' }] },
    ]);
  });

  it('keeps emphasis inside a link', () => {
    expect(parseInline('[**bold** data](https://example.com)')).toEqual([
      {
        kind: 'link',
        href: 'https://example.com/',
        children: [{ kind: 'strong', children: [{ kind: 'text', text: 'bold' }] }, { kind: 'text', text: ' data' }],
      },
    ]);
  });

  it.each([
    { address: 'https://example.com', href: 'https://example.com/' },
    { address: 'http://EXAMPLE.com:80/a/../b', href: 'http://example.com/b' },
    { address: 'mailto:a@example.org', href: 'mailto:a@example.org' },
    { address: 'javascript:alert(1)', href: null },
    { address: ' javascript:alert(1)', href: null },
    { address: 'data:text/html,<b>', href: null },
    { address: 'file:///tmp/x', href: null },
    { address: '/relative', href: null },
    { address: '//example.com/protocol-relative', href: null },
    { address: 'https://', href: null },
  ])('openableHref($address) is $href', ({ address, href }) => {
    expect(openableHref(address)).toBe(href);
  });
});

describe('mentions in remarks', () => {
  it('marks @Name of a mentioned person and leaves other @ text alone', () => {
    expect(spansOf('Thanks @Ines Varga, ask @nobody or lab@Ines Varga.', ['Ines Varga'])).toEqual([
      { kind: 'text', text: 'Thanks ' },
      { kind: 'mention', name: 'Ines Varga' },
      { kind: 'text', text: ', ask @nobody or lab@Ines Varga.' },
    ]);
  });

  it('prefers the longest name and does not take a name that runs on into a longer word', () => {
    expect(spansOf('@Ana Lima and @Ana and @Anabel', ['Ana', 'Ana Lima'])).toEqual([
      { kind: 'mention', name: 'Ana Lima' },
      { kind: 'text', text: ' and ' },
      { kind: 'mention', name: 'Ana' },
      { kind: 'text', text: ' and @Anabel' },
    ]);
  });

  it('compares names with regex characters literally', () => {
    const names = ['T. (Tom) O’Brien+1', 'a.b*', '[x]|y$'];
    expect(spansOf('@T. (Tom) O’Brien+1 @aXb @a.b* @[x]|y$ @T. (Tom) O’Brien+11', names)).toEqual([
      { kind: 'mention', name: 'T. (Tom) O’Brien+1' },
      { kind: 'text', text: ' @aXb ' },
      { kind: 'mention', name: 'a.b*' },
      { kind: 'text', text: ' ' },
      { kind: 'mention', name: '[x]|y$' },
      { kind: 'text', text: ' @T. (Tom) O’Brien+11' },
    ]);
  });

  it('marks mentions inside emphasis, headings and list items, but not inside code', () => {
    const blocks = parseMarkdown('# For @Ines\n\n- *ping @Ines*\n- `@Ines`', { mentions: ['Ines'] });
    expect(blocks).toEqual([
      { kind: 'heading', level: 1, children: [{ kind: 'text', text: 'For ' }, { kind: 'mention', name: 'Ines' }] },
      {
        kind: 'list',
        ordered: false,
        start: 1,
        items: [
          [{ kind: 'em', children: [{ kind: 'text', text: 'ping ' }, { kind: 'mention', name: 'Ines' }] }],
          [{ kind: 'code', text: '@Ines' }],
        ],
      },
    ]);
  });

  it('marks nothing without names, and reads a mention back as its text', () => {
    expect(spansOf('@Ines')).toEqual([{ kind: 'text', text: '@Ines' }]);
    expect(inlineText(spansOf('hi @Ines!', ['Ines']))).toBe('hi @Ines!');
  });
});
