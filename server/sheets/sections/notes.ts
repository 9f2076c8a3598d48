import { drawMarkdown } from '../markdown-pdf';
import type { SheetSection } from '../section';

/** The version's notes, Markdown drawn as the app reads it (see markdown-pdf.ts). */
export const notesSection: SheetSection = {
  id: 'notes',
  title: 'Version notes',
  draw(writer, sheet) {
    writer.sectionHeading(this.title);
    drawMarkdown(writer, sheet.version.notes, { emptyText: 'No notes on this version.' });
  },
};
