import { calibrationLinesSection } from './sections/calibration-lines';
import { cautionsSection } from './sections/cautions';
import { compareFiguresSection } from './sections/compare-figures';
import { compareParametersSection } from './sections/compare-parameters';
import { compareSketchSection } from './sections/compare-sketch';
import { compareTitleSection } from './sections/compare-title';
import { imageQualitySection } from './sections/image-quality';
import { compareSpotsSection } from './sections/image-quality-compare';
import { lightBudgetSection } from './sections/light-budget';
import { notesSection } from './sections/notes';
import { orderSortingSection } from './sections/order-sorting';
import { parametersSection } from './sections/parameters';
import { performanceSection } from './sections/performance';
import { plotsSection } from './sections/plots';
import { requirementsSection } from './sections/requirements';
import { reviewSection } from './sections/review';
import { sketchSection } from './sections/sketch';
import { titleSection } from './sections/title';
import { tradeStudySection } from './sections/trade-study';
import { warningsSection } from './sections/warnings';
import type { CompareSheetSection, SheetSection } from './section';

/**
 * The design sheet, in print order. A later feature adds its part of the sheet by writing one
 * file in `sections/` (a `SheetSection`) and listing it here; the tests then check that its
 * heading appears in the PDF and that it stays inside the margins.
 */
export const sheetSections: readonly SheetSection[] = [
  titleSection,
  sketchSection,
  parametersSection,
  performanceSection,
  plotsSection,
  orderSortingSection,
  requirementsSection,
  tradeStudySection,
  warningsSection,
  lightBudgetSection,
  calibrationLinesSection,
  imageQualitySection,
  notesSection,
  reviewSection,
  cautionsSection,
];

/** The compare sheet, in print order. */
export const compareSheetSections: readonly CompareSheetSection[] = [
  compareTitleSection,
  compareFiguresSection,
  compareParametersSection,
  compareSketchSection,
  compareSpotsSection,
];
