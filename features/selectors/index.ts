export { SelectorsScreen } from './components/selectors-screen';
export { TradeStudyCard, type TradeStudyCardProps } from './components/trade-study-card';
export { XyPlot, type XyPlotProps } from './components/xy-plot';
export type { XySeries } from './xy-plot-summary';
