export { WorkbenchScreen } from './components/workbench-screen';
export { designToForm, formToDesign, type FormValues } from './form-model';
export { presets, type Preset } from './presets';
export { rangeTableCsv } from './csv';
