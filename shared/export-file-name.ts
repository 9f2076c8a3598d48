/** What every exported notebook file's name ends with. */
const NOTEBOOK_FILE_SUFFIX = '.blazebook.json';

const MAX_BASE_CHARS = 60;

/**
 * The file name a notebook exports under: its title in plain letters, never a path. Accents are
 * split off (NFKD) and dropped with every other character outside letters, digits, `_`, `-` and
 * spaces; spaces become dashes; at most 60 characters; "notebook" when nothing is left.
 */
export function exportFileName(title: string): string {
  return `${plainFileBase(title, 'notebook')}${NOTEBOOK_FILE_SUFFIX}`;
}

/** A title in plain letters for any file name (the rule above); `fallback` when nothing is left. */
export function plainFileBase(title: string, fallback: string): string {
  const base = title
    .normalize('NFKD')
    .replace(/[^\w -]+/g, '')
    .trim()
    .replace(/\s+/g, '-')
    .toLowerCase()
    .slice(0, MAX_BASE_CHARS);
  return base || fallback;
}
