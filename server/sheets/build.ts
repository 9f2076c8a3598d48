import { formatWhen } from '../../shared/format';
import type { CompareSheetContext, SheetContext } from './context';
import { compareSheetSections, sheetSections } from './registry';
import type { CompareSheetSection, SheetSection } from './section';
import { SheetWriter } from './writer';

/** The generation time, printed on every page beside the way back to the version. */
function generatedNote(generatedAt: Date): string {
  return `Generated ${formatWhen(generatedAt, 'UTC')} UTC`;
}

/**
 * One version's design sheet, whole, in memory. A section that throws fails the build before a
 * byte is sent, so the route answers the JSON error shape and never half a PDF.
 */
export async function buildSheet(sheet: SheetContext, sections: readonly SheetSection[] = sheetSections): Promise<Buffer> {
  const writer = new SheetWriter(sheet.paper, {
    title: `${sheet.design.title} v${sheet.version.number} — design sheet`,
    subject: 'Grating monochromator design sheet',
    author: sheet.version.author?.displayName,
    createdAt: sheet.generatedAt,
  });
  for (const section of sections) if (section.appliesTo?.(sheet) ?? true) section.draw(writer, sheet);
  writer.footers(generatedNote(sheet.generatedAt), sheet.link);
  return writer.finish();
}

/** Versions a and b side by side, for the review meeting. */
export async function buildCompareSheet(
  sheet: CompareSheetContext,
  sections: readonly CompareSheetSection[] = compareSheetSections,
): Promise<Buffer> {
  const writer = new SheetWriter(sheet.paper, {
    title: `${sheet.design.title} v${sheet.a.version.number} vs v${sheet.b.version.number} — compare sheet`,
    subject: 'Grating monochromator compare sheet',
    createdAt: sheet.generatedAt,
  });
  for (const section of sections) section.draw(writer, sheet);
  writer.footers(generatedNote(sheet.generatedAt), sheet.link);
  return writer.finish();
}
