/**
 * How much one solve may ask for, shared by the request schema (HTTP and CLI) and the solver's
 * own sweep, so the three never disagree. Constants only: the solver imports this without
 * pulling in zod.
 *
 * 1,000 wavelengths is five times what the workbench plots (200 points; the range table uses
 * 11, a notebook comparison 121) and finer than a plot can show; with at most 20 overlapping
 * orders listed per wavelength (`MAX_LISTED_OVERLAPS`) it keeps
 * the largest answer under 2.5 MB of JSON.
 */
export const MAX_SOLVE_WAVELENGTHS = 1000;

/** A sweep needs both ends of the range. */
export const MIN_SOLVE_POINTS = 2;

/**
 * Overlapping orders listed per wavelength: the ones nearest the working order. `overlapCount`
 * gives the full number and `overlapsTruncated` says when the list was cut.
 */
export const MAX_LISTED_OVERLAPS = 20;
