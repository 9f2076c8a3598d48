/**
 * A deliberately small Markdown reader for version notes: headings, paragraphs, bullet and
 * numbered lists, fenced code, and inline emphasis, strong and code. It returns a tree of plain
 * strings, never HTML, so notes can only ever become React Native `Text`: a `<script>` in a note
 * is shown as the characters it is.
 */

export type Inline =
  | { kind: 'text'; text: string }
  | { kind: 'em'; children: Inline[] }
  | { kind: 'strong'; children: Inline[] }
  | { kind: 'code'; text: string };

export type Block =
  | { kind: 'heading'; level: 1 | 2 | 3; children: Inline[] }
  | { kind: 'paragraph'; children: Inline[] }
  | { kind: 'list'; ordered: boolean; start: number; items: Inline[][] }
  | { kind: 'code'; text: string };

const heading = /^(#{1,6})\s+(.*?)\s*#*\s*$/;
const bullet = /^\s{0,3}[-*+]\s+(.*)$/;
const numbered = /^\s{0,3}(\d{1,9})[.)]\s+(.*)$/;
const fence = /^\s{0,3}(```|~~~)/;

/** Splits notes into blocks; a blank line ends a paragraph or a list. */
export function parseMarkdown(source: string): Block[] {
  const lines = source.replace(/\r\n?/g, '\n').split('\n');
  const blocks: Block[] = [];
  let paragraph: string[] = [];
  let list: { ordered: boolean; start: number; items: string[] } | null = null;

  const flushParagraph = () => {
    if (paragraph.length > 0) blocks.push({ kind: 'paragraph', children: parseInline(paragraph.join(' ')) });
    paragraph = [];
  };
  const flushList = () => {
    if (list) blocks.push({ kind: 'list', ordered: list.ordered, start: list.start, items: list.items.map(parseInline) });
    list = null;
  };

  for (let i = 0; i < lines.length; i++) {
    const line = lines[i] as string;
    const fenceMatch = fence.exec(line);
    if (fenceMatch) {
      flushParagraph();
      flushList();
      const marker = fenceMatch[1] as string;
      const body: string[] = [];
      i++;
      while (i < lines.length && !(lines[i] as string).trimStart().startsWith(marker)) {
        body.push(lines[i] as string);
        i++;
      }
      blocks.push({ kind: 'code', text: body.join('\n') });
      continue;
    }
    if (line.trim() === '') {
      flushParagraph();
      flushList();
      continue;
    }
    const headingMatch = heading.exec(line);
    if (headingMatch) {
      flushParagraph();
      flushList();
      const level = Math.min(3, (headingMatch[1] as string).length) as 1 | 2 | 3;
      blocks.push({ kind: 'heading', level, children: parseInline(headingMatch[2] as string) });
      continue;
    }
    const bulletMatch = bullet.exec(line);
    const numberedMatch = bulletMatch ? null : numbered.exec(line);
    if (bulletMatch || numberedMatch) {
      flushParagraph();
      const ordered = numberedMatch !== null;
      const text = (bulletMatch ? bulletMatch[1] : numberedMatch?.[2]) as string;
      if (!list || list.ordered !== ordered) {
        flushList();
        list = { ordered, start: numberedMatch ? Number(numberedMatch[1]) : 1, items: [] };
      }
      list.items.push(text);
      continue;
    }
    if (list && /^\s{2,}\S/.test(line)) {
      // An indented line continues the list item above it.
      list.items[list.items.length - 1] += ` ${line.trim()}`;
      continue;
    }
    flushList();
    paragraph.push(line.trim());
  }
  flushParagraph();
  flushList();
  return blocks;
}

/** Inline spans: `code` first (nothing inside it is read), then **strong** / __strong__, then *em* / _em_. */
export function parseInline(text: string): Inline[] {
  const out: Inline[] = [];
  let plain = '';
  const pushPlain = () => {
    if (plain) out.push({ kind: 'text', text: plain });
    plain = '';
  };
  let i = 0;
  while (i < text.length) {
    const ch = text[i] as string;
    if (ch === '\\' && i + 1 < text.length && /[\\`*_#]/.test(text[i + 1] as string)) {
      plain += text[i + 1];
      i += 2;
      continue;
    }
    if (ch === '`') {
      const end = text.indexOf('`', i + 1);
      if (end > i + 1) {
        pushPlain();
        out.push({ kind: 'code', text: text.slice(i + 1, end) });
        i = end + 1;
        continue;
      }
    }
    if ((ch === '*' || ch === '_') && text[i + 1] === ch) {
      const marker = ch + ch;
      const end = text.indexOf(marker, i + 2);
      if (end > i + 2) {
        pushPlain();
        out.push({ kind: 'strong', children: parseInline(text.slice(i + 2, end)) });
        i = end + 2;
        continue;
      }
    }
    if (ch === '*' || ch === '_') {
      const end = findClosing(text, ch, i + 1);
      // Underscores inside words (file_name_v2) are not emphasis.
      const wordy = ch === '_' && /\w/.test(text[i - 1] ?? '');
      if (end > i + 1 && !wordy && text[i + 1] !== ' ') {
        pushPlain();
        out.push({ kind: 'em', children: parseInline(text.slice(i + 1, end)) });
        i = end + 1;
        continue;
      }
    }
    plain += ch;
    i++;
  }
  pushPlain();
  return out;
}

function findClosing(text: string, marker: string, from: number): number {
  for (let j = from; j < text.length; j++) {
    if (text[j] === marker && text[j + 1] !== marker && text[j - 1] !== ' ' && text[j - 1] !== marker) return j;
  }
  return -1;
}

/** The plain text of inline spans (for accessibility labels and tests). */
export function inlineText(spans: readonly Inline[]): string {
  return spans.map((span) => (span.kind === 'text' || span.kind === 'code' ? span.text : inlineText(span.children))).join('');
}
