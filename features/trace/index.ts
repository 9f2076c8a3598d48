/**
 * The exact 3-D sequential ray trace of a design (see trace-design.ts). Pure: no React, no
 * platform code, relative imports only (the server's API, sheet and script use it as the
 * workbench's Web Worker does).
 */
export type * from './types';
export { traceDesign, tracedBandpasses } from './trace-design';
export { summarizeTrace } from './summary';
export { traceWarnings, type TraceWarning } from './warnings';
