import { formatDay } from '@/shared/format';

/** The notebook header's (and the list row's) note on a design made from an imported file. */
export function importedOriginText(importedAt: string, timeZone?: string): string {
  return `Imported from a file on ${formatDay(importedAt, timeZone)}`;
}

/** The list's chip for a baseline, and its name for screen readers (which row it belongs to). */
export function baselineChip(title: string, version: number): { label: string; accessibleName: string } {
  const label = `Baseline: v${version}`;
  // The visible words start the name (WCAG 2.2 SC 2.5.3, label in name).
  return { label, accessibleName: `${label} of ${title}` };
}

/**
 * What the design list says after archiving or restoring from a row. Only an archive can be
 * undone: the archived row has left the list, so the notice is the one place to bring it back.
 */
export type ArchiveNotice =
  | { kind: 'archived'; id: string; title: string }
  | { kind: 'restored'; id: string; title: string }
  | { kind: 'failed'; title: string; reason: string };

export function archiveNoticeText(notice: ArchiveNotice): string {
  switch (notice.kind) {
    case 'archived':
      return `Archived “${notice.title}”`;
    case 'restored':
      return `Restored “${notice.title}”`;
    case 'failed':
      return `“${notice.title}” was not changed: ${notice.reason}`;
  }
}
