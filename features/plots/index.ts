export { AxisText, type AxisTextProps } from './components/axis-text';
export { LinePlot, PLOT_HEIGHT, type LinePlotProps, type PlotSeries } from './components/line-plot';
export {
  EFFICIENCY_MODEL_CAPTION,
  FAILING_LABEL,
  PerformancePlots,
  RESOLVING_POWER_CAPTION,
  TWO_COLUMN_MIN_WIDTH,
  type PerformancePlotsProps,
  type PlotProps,
} from './components/performance-plots';
export { OVERLAP_SHADE_LABEL } from './captions';
export { requirementShading, PLOT_REQUIREMENTS, type RequirementShade, type ShadedPlot } from './requirement-shading';
export {
  countRuns,
  flaggedIntervals,
  hatchPath,
  linePath,
  nearestIndex,
  valueExtent,
  type Interval,
} from './plot-paths';
export { performanceSeries, type PerformanceSeries } from './series';
export { MIN_SIDE_PX, TICK_GAP_PX, TICK_PX, TITLE_BAND_PX, axisMarginPx, labelWidthPx, sharesAxis, valueScale, valueTicks } from './axes';
export { scalarBlazeCaution, type ScalarBlazeCaution } from './captions';
export { filterChangeMarks, marksSummary, overlapSummary, type PlotMark } from './filter-marks';
