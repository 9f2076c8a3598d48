/**
 * The trace's screens for the workbench (React). Kept apart from index.ts, the pure barrel the
 * server imports, so the API never loads React or a Web Worker.
 */
export { ImageQualityCard, type ImageQualityCardProps } from './components/image-quality-card';
export { useTrace, type TraceState } from './hooks/use-trace';
export { SpotDiagram } from './components/spot-diagram';
