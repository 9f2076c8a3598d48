import MarkdownIt, { type Token } from 'markdown-it';

/**
 * Version notes are read by markdown-it (CommonMark preset): a CommonMark parser that stays
 * linear on the pathological inputs of the CommonMark reference parsers (runs of `*`, `[`,
 * backticks, unclosed links, deep quotes and lists), so a pasted note cannot freeze the page the
 * way the hand-written reader did. micromark (mdast-util-from-markdown 2.0.2) was measured first
 * and is not: `"*a"` × 40,000 took 36 s and 4,000 nested lists 23 s (`npm run bench:markdown`
 * gives markdown-it's figures). The tokens become a tree of plain strings, never HTML, so notes
 * and remarks can only ever become React Native `Text`: with `html: false` a `<script>` or an
 * `<img onerror>` is read as the characters it is. A link becomes a `link` span only when its
 * address is an absolute http:, https: or mailto: URL (`openableHref`); any other address
 * (javascript:, data:, vbscript:, file:, a relative path) keeps its text and shows the address
 * as text, never as an anchor.
 */

export type Inline =
  | { kind: 'text'; text: string }
  | { kind: 'em'; children: Inline[] }
  | { kind: 'strong'; children: Inline[] }
  | { kind: 'code'; text: string }
  /** `href` is the URL parser's normal form of an http:, https: or mailto: address. */
  | { kind: 'link'; href: string; children: Inline[] }
  /** `@name` of one of the names the caller passed as mentions (a remark's mentioned people). */
  | { kind: 'mention'; name: string };

export type ReadOptions = {
  /** Display names whose `@Name` is drawn as a mention; any other `@` text stays text. */
  mentions?: readonly string[];
};

const openableSchemes: ReadonlySet<string> = new Set(['http:', 'https:', 'mailto:']);

/**
 * The address a link may open: absolute http:, https: and mailto: URLs only, as the URL parser
 * normalises them (scheme and host lower-cased, spaces and quotes escaped). Anything the parser
 * refuses or that has another scheme, a relative path included, is null.
 */
export function openableHref(address: string): string | null {
  let url: URL;
  try {
    url = new URL(address);
  } catch {
    return null;
  }
  return openableSchemes.has(url.protocol) ? url.href : null;
}

export type Block =
  | { kind: 'heading'; level: 1 | 2 | 3; children: Inline[] }
  | { kind: 'paragraph'; children: Inline[] }
  | { kind: 'list'; ordered: boolean; start: number; items: Inline[][] }
  | { kind: 'code'; text: string }
  | { kind: 'rule' };

type ListBlock = Extract<Block, { kind: 'list' }>;

const reader = new MarkdownIt('commonmark', {
  html: false,
  // Every line re-checks each open quote and list, so the parser caps how deep they nest to stay
  // linear; content below the cap is dropped. Its CommonMark preset's 20 (two levels per list)
  // would already lose the text of a tenth nested list; 100 (its default preset's value) keeps
  // 49 nested lists or 99 nested quotes.
  maxNesting: 100,
});

/** Reads notes into blocks. Quotes are flattened into the blocks they hold; nested lists follow their item. */
export function parseMarkdown(source: string, options: ReadOptions = {}): Block[] {
  const blocks = toBlocks(reader.parse(source, {}));
  const names = mentionNames(options.mentions);
  if (names.length === 0) return blocks;
  return blocks.map((block) => {
    switch (block.kind) {
      case 'heading':
      case 'paragraph':
        return { ...block, children: markMentions(block.children, names) };
      case 'list':
        return { ...block, items: block.items.map((item) => markMentions(item, names)) };
      default:
        return block;
    }
  });
}

/** The inline spans of a one-line snippet (no block syntax is read). */
export function parseInline(text: string, options: ReadOptions = {}): Inline[] {
  return markMentions(toInline(reader.parseInline(text, {})[0]?.children ?? []), mentionNames(options.mentions));
}

/** The plain text of inline spans (for accessibility labels and tests). */
export function inlineText(spans: readonly Inline[]): string {
  return spans
    .map((span) => {
      switch (span.kind) {
        case 'text':
        case 'code':
          return span.text;
        case 'mention':
          return `@${span.name}`;
        default:
          return inlineText(span.children);
      }
    })
    .join('');
}

/** Longest first, so `@Ana Lima` is one mention even when `Ana` is a name too. */
function mentionNames(names: readonly string[] | undefined): string[] {
  return [...new Set((names ?? []).filter((name) => name.trim() !== ''))].sort((a, b) => b.length - a.length);
}

const wordCharacter = /[\p{L}\p{N}_]/u;

/**
 * Splits text spans at each `@Name` of `names` that stands alone (no letter, digit or `_` just
 * before the `@` or just after the name, so an e-mail address or a longer name is not one). Names
 * are compared as plain strings, never as patterns, so any character in a name is literal. Code
 * spans are left as written.
 */
function markMentions(spans: Inline[], names: readonly string[]): Inline[] {
  if (names.length === 0) return spans;
  const out: Inline[] = [];
  for (const span of spans) {
    switch (span.kind) {
      case 'text':
        splitMentions(span.text, names, out);
        break;
      case 'em':
      case 'strong':
      case 'link':
        out.push({ ...span, children: markMentions(span.children, names) });
        break;
      default:
        out.push(span);
    }
  }
  return out;
}

function splitMentions(text: string, names: readonly string[], out: Inline[]): void {
  let from = 0;
  for (let at = text.indexOf('@'); at !== -1; at = text.indexOf('@', at + 1)) {
    if (at > 0 && wordCharacter.test(text[at - 1]!)) continue;
    const name = names.find((candidate) => {
      if (!text.startsWith(candidate, at + 1)) return false;
      const after = text[at + 1 + candidate.length];
      return after === undefined || !wordCharacter.test(after);
    });
    if (name === undefined) continue;
    appendText(out, text.slice(from, at));
    out.push({ kind: 'mention', name });
    from = at + 1 + name.length;
    at = from - 1;
  }
  appendText(out, text.slice(from));
}

type ListFrame = { ordered: boolean; next: number; block: ListBlock | null };
type ItemFrame = { list: ListFrame; number: number; spans: Inline[] | null; blocksAtOpen: number };
type Container = { kind: 'quote' } | { kind: 'list'; frame: ListFrame } | { kind: 'item'; frame: ItemFrame };

/**
 * Walks the flat token stream once with an explicit stack (no recursion, so depth costs nothing).
 * Our blocks are flat, so a list item holds only its own paragraphs' text: anything else inside it
 * (a nested list, code) is emitted after it, and the list resumes as a new list block numbered on.
 */
function toBlocks(tokens: readonly Token[]): Block[] {
  const blocks: Block[] = [];
  const containers: Container[] = [];

  const placeInItem = (item: ItemFrame, spans: Inline[]) => {
    const list = item.list;
    if (item.spans === null) {
      if (!list.block || blocks[blocks.length - 1] !== list.block) {
        list.block = { kind: 'list', ordered: list.ordered, start: item.number, items: [] };
        blocks.push(list.block);
      }
      item.spans = spans;
      list.block.items.push(spans);
      return;
    }
    const stillLast = blocks[blocks.length - 1] === list.block && list.block?.items[list.block.items.length - 1] === item.spans;
    if (stillLast) {
      // A loose item's second paragraph continues its text, as the old reader joined lines.
      appendText(item.spans, ' ');
      for (const span of spans) appendSpan(item.spans, span);
    } else {
      blocks.push({ kind: 'paragraph', children: spans });
    }
  };

  for (let i = 0; i < tokens.length; i++) {
    const token = tokens[i]!;
    const top = containers[containers.length - 1];
    switch (token.type) {
      case 'blockquote_open':
        containers.push({ kind: 'quote' });
        break;
      case 'bullet_list_open':
      case 'ordered_list_open': {
        const ordered = token.type === 'ordered_list_open';
        const start = ordered ? Number(token.attrGet('start') ?? 1) : 1;
        containers.push({ kind: 'list', frame: { ordered, next: start, block: null } });
        break;
      }
      case 'list_item_open':
        if (top?.kind === 'list') {
          const item = { list: top.frame, number: top.frame.next++, spans: null, blocksAtOpen: blocks.length };
          containers.push({ kind: 'item', frame: item });
        }
        break;
      case 'list_item_close':
        if (top?.kind === 'item') {
          // An empty item ("-" alone) is still a bullet; an item that only held a nested list is not.
          if (top.frame.spans === null && blocks.length === top.frame.blocksAtOpen) placeInItem(top.frame, []);
          containers.pop();
        }
        break;
      case 'blockquote_close':
      case 'bullet_list_close':
      case 'ordered_list_close':
        containers.pop();
        break;
      case 'heading_open': {
        const level = Math.min(3, Number(token.tag.slice(1)) || 1) as 1 | 2 | 3;
        blocks.push({ kind: 'heading', level, children: toInline(tokens[i + 1]?.children ?? []) });
        i += 2;
        break;
      }
      case 'paragraph_open': {
        const spans = toInline(tokens[i + 1]?.children ?? []);
        if (top?.kind === 'item') placeInItem(top.frame, spans);
        else blocks.push({ kind: 'paragraph', children: spans });
        i += 2;
        break;
      }
      case 'fence':
      case 'code_block':
        // The parser keeps the newline that ends the last code line; the view adds its own.
        blocks.push({ kind: 'code', text: token.content.replace(/\n$/, '') });
        break;
      case 'hr':
        blocks.push({ kind: 'rule' });
        break;
      case 'html_block':
        // Not produced while `html` is off; kept as its characters should that ever change.
        blocks.push({ kind: 'paragraph', children: [{ kind: 'text', text: token.content.replace(/\n$/, '') }] });
        break;
    }
  }
  return blocks;
}

type Mark =
  | { kind: 'em' | 'strong' | 'flat'; children: Inline[] }
  /** `openable`: the link span whose children these are; null when the link stays text. */
  | { kind: 'link'; children: Inline[]; href: string; autolink: boolean; openable: Extract<Inline, { kind: 'link' }> | null };

/**
 * Emphasis is paired after the parser's nesting guard has run, so 20,000 `*` around a word still
 * nest thousands deep; the view draws one `Text` per level, so spans stop nesting here. Deeper
 * than this looks no different (bold italic is bold italic).
 */
const MAX_SPAN_DEPTH = 8;

/** Inline tokens are flat too (open/close pairs), so the tree is built with a stack of open marks. */
function toInline(tokens: readonly Token[]): Inline[] {
  const root: Inline[] = [];
  const marks: Mark[] = [];
  let styled = 0;
  const current = () => marks[marks.length - 1]?.children ?? root;

  for (const token of tokens) {
    switch (token.type) {
      case 'em_open':
      case 'strong_open': {
        const kind: 'em' | 'strong' = token.type === 'em_open' ? 'em' : 'strong';
        if (styled >= MAX_SPAN_DEPTH) {
          // Below the cap the text keeps the style it already has: the mark adds no span.
          marks.push({ kind: 'flat', children: current() });
          break;
        }
        const span = { kind, children: [] as Inline[] };
        current().push(span);
        marks.push({ kind, children: span.children });
        styled++;
        break;
      }
      case 'link_open': {
        const href = String(token.attrGet('href') ?? '');
        const autolink = token.markup === 'autolink';
        const safe = openableHref(href);
        if (safe === null) {
          // Drawn as its text: the children go straight into the enclosing span.
          marks.push({ kind: 'link', children: current(), href, autolink, openable: null });
          break;
        }
        const span = { kind: 'link' as const, href: safe, children: [] as Inline[] };
        current().push(span);
        marks.push({ kind: 'link', children: span.children, href, autolink, openable: span });
        break;
      }
      case 'em_close':
      case 'strong_close':
        if (marks.pop()?.kind !== 'flat') styled--;
        break;
      case 'link_close': {
        const link = marks.pop();
        if (link?.kind !== 'link') break;
        if (link.openable) {
          // `[](https://…)` still needs something to press.
          if (link.openable.children.length === 0) appendText(link.openable.children, link.openable.href);
          break;
        }
        // The address is shown as text so it can be read and copied; an autolink already shows it.
        if (!link.autolink && link.href) appendText(current(), ` (${link.href})`);
        break;
      }
      case 'code_inline':
        current().push({ kind: 'code', text: token.content });
        break;
      case 'softbreak':
        appendText(current(), ' ');
        break;
      case 'hardbreak':
        appendText(current(), '\n');
        break;
      case 'image':
        // Its alt text, which the parser keeps as the image's children.
        appendText(current(), (token.children ?? []).map((child) => child.content).join(''));
        break;
      default:
        // text, and html_inline should `html` ever be turned on: the characters as written.
        if (token.content) appendText(current(), token.content);
    }
  }
  return root;
}

function appendSpan(spans: Inline[], span: Inline): void {
  if (span.kind === 'text') appendText(spans, span.text);
  else spans.push(span);
}

/** Adjacent text is merged so a paragraph split across lines reads as one string. */
function appendText(spans: Inline[], text: string): void {
  if (!text) return;
  const last = spans[spans.length - 1];
  if (last?.kind === 'text') spans[spans.length - 1] = { kind: 'text', text: last.text + text };
  else spans.push({ kind: 'text', text });
}
