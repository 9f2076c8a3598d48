export { SheetButton } from './components/sheet-button';
export { fetchSheet, sheetFallbackName, sheetLabel, type SheetFile, type SheetTarget } from './sheet-target';
