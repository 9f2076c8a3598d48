/**
 * The candidate search: stock lists, the columnar evaluation, the score and the answer in words.
 * Pure (no React); the HTTP route, the command line and the workbench's Web Worker share it.
 */

export * from './space';
export * from './columnar';
export * from './score';
export * from './engine';
export * from './explain';
