import type { WavelengthPoint } from '@/features/solver';
import { formatMachineNumber } from '@/shared/format';
import { overlapsText } from './overlaps';

/** Column names carry units, like the design's fields, so a spreadsheet needs no legend. */
export const rangeTableColumns = [
  'wavelength_nm',
  'grating_rotation_deg',
  'reciprocal_dispersion_nm_per_mm',
  'bandpass_nm',
  'resolving_power',
  'blaze_efficiency',
  'overlapping_orders',
] as const;

/** Machine-readable on purpose: a spreadsheet must read "-5" and "12345", not "−5" or "12 345". */
function cell(value: number | null, digits = 6): string {
  return value === null ? '' : formatMachineNumber(value, digits);
}

/**
 * The range table as CSV (RFC 4180: comma-separated, quoted where a field holds a comma or
 * semicolon-separated list). Unreachable wavelengths keep their row with empty figures.
 */
export function rangeTableCsv(points: readonly WavelengthPoint[]): string {
  const rows = points.map((p) => {
    const overlaps = overlapsText(p, (o) => `m=${o.order} ${cell(o.wavelengthNm, 5)} nm`, '; ');
    return [
      cell(p.wavelengthNm),
      cell(p.gratingRotationDeg),
      cell(p.reciprocalDispersionNmPerMm),
      cell(p.bandpassNm),
      cell(p.resolvingPower === null ? null : Math.round(p.resolvingPower), 12),
      cell(p.blazeEfficiency, 4),
      overlaps === '' ? '' : `"${overlaps}"`,
    ].join(',');
  });
  return [rangeTableColumns.join(','), ...rows].join('\r\n') + '\r\n';
}
