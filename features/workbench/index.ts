export { Workbench, type WorkbenchProps } from './components/workbench';
export { WorkbenchScreen } from './components/workbench-screen';
export { draftFromDesign, draftSchema, loadDraft, saveDraft, type Draft } from './draft';
export { designToForm, formToDesign, type FormResult, type FormValues } from './form-model';
export { presets, type Preset } from './presets';
export { rangeTableCsv } from './csv';
export { FieldMarksProvider, resultTarget, type FieldMarks } from './field-marks';
