export { cautionClosingLine, cautionsFor, deepUvBelowNm, mercuryCalibrationLinesNm, mercuryLinesInRange } from './cautions';
export type { Caution, CautionId } from './cautions';
export { CautionsCard } from './components/cautions-card';
