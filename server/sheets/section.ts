import type { CompareSheetContext, SheetContext } from './context';
import type { SheetWriter } from './writer';

/**
 * One part of a design sheet. `draw` starts with `writer.sectionHeading(title)` — every section
 * prints its heading, even when it has nothing to list ("None."), so a reader (and the tests) can
 * tell an empty section from a missing one — then draws from `sheet` alone.
 */
export type SheetSection = {
  /** Stable id, for tests and logs. */
  id: string;
  /** The heading printed on the sheet. */
  title: string;
  draw(writer: SheetWriter, sheet: SheetContext): void;
};

export type CompareSheetSection = {
  id: string;
  title: string;
  draw(writer: SheetWriter, sheet: CompareSheetContext): void;
};
