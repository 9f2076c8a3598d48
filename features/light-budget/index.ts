export { LightBudgetCard, type LightBudgetCardProps } from './components/light-budget-card';
