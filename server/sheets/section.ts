import type { CompareSheetContext, SheetContext } from './context';
import type { SheetWriter } from './writer';

/**
 * One part of a design sheet. `draw` starts with `writer.sectionHeading(title)` — every section
 * prints its heading, even when it has nothing to list ("None."), so a reader (and the tests) can
 * tell an empty section from a missing one — then draws from `sheet` alone. The one exception is
 * a section only some designs have (`appliesTo`): left out, heading and all, where it is false.
 */
export type SheetSection = {
  /** Stable id, for tests and logs. */
  id: string;
  /** The heading printed on the sheet. */
  title: string;
  /** A section only some designs need (the requirements); printed for every design when absent. */
  appliesTo?(sheet: SheetContext): boolean;
  draw(writer: SheetWriter, sheet: SheetContext): void;
};

export type CompareSheetSection = {
  id: string;
  title: string;
  draw(writer: SheetWriter, sheet: CompareSheetContext): void;
};
