export { LightBudgetCard, type LightBudgetCardProps } from './components/light-budget-card';
export type { CurveLibrary } from './components/curve-upload-panel';
