import { describe, expect, it } from 'vitest';
import {
  archiveNoticeText,
  baselineChip,
  importedOriginText,
  type ArchiveNotice,
} from '../../../features/notebooks/notices';

describe('what the notebook says about where a design came from', () => {
  it('names the day of the import in the reader’s time zone', () => {
    // 23:30 UTC on 14 March is already 15 March in Berlin (UTC+1 in March, tz database).
    expect(importedOriginText('2026-03-14T23:30:00.000Z', 'UTC')).toBe('Imported from a file on 14 Mar 2026');
    expect(importedOriginText('2026-03-14T23:30:00.000Z', 'Europe/Berlin')).toBe(
      'Imported from a file on 15 Mar 2026',
    );
  });
});

describe('the baseline chip in the design list', () => {
  it('shows the version and names the design for a screen reader, the visible words first', () => {
    const chip = baselineChip('Teaching scanner', 3);
    expect(chip.label).toBe('Baseline: v3');
    expect(chip.accessibleName).toBe('Baseline: v3 of Teaching scanner');
    expect(chip.accessibleName.startsWith(chip.label)).toBe(true);
  });
});

describe('the notice after archiving from the list', () => {
  it.each([
    [{ kind: 'archived', id: 'd1', title: 'Old scanner' }, 'Archived “Old scanner”'],
    [{ kind: 'restored', id: 'd1', title: 'Old scanner' }, 'Restored “Old scanner”'],
    [
      { kind: 'failed', title: 'Old scanner', reason: 'Only owners can change designs.' },
      '“Old scanner” was not changed: Only owners can change designs.',
    ],
  ] satisfies [ArchiveNotice, string][])('%o reads %s', (notice, text) => {
    expect(archiveNoticeText(notice)).toBe(text);
  });
});
