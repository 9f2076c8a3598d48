/**
 * Requirements: what a design must do, checked with the ordinary solver. Pure (no React), so the
 * workbench, the plots, the history, compare, the design sheet and the candidate search share it.
 */

export * from './types';
export * from './check';
export * from './traced-bandpass';
export * from './footprint';
export * from './design-change';
export * from './solve-for';
export * from './sensitivity';
export * from './tolerance';
