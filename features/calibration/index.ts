export { CalibrationCard, type CalibrationCardProps } from './components/calibration-card';
