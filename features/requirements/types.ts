/**
 * What checking a design against its requirements answers. Pure data: the workbench card, the
 * plots' shading, the warnings, the history row, compare, the design sheet and the candidate
 * search all read these shapes.
 */

import type { RequirementId } from '../../shared/requirements';

export type RequirementStatus = 'pass' | 'fail' | 'unknown';

/** One requirement against one design. */
export interface RequirementCheck {
  id: RequirementId;
  status: RequirementStatus;
  /** The limit in words: "bandpass ≤ 0.5 nm". */
  limitText: string;
  /** The worst value found (the largest bandpass, the smallest efficiency…); null when unknown. */
  worst: number | null;
  /** The limit as a number (footprint: the tighter of width and depth is reported); null for yes/no requirements. */
  limit: number | null;
  /** Where the worst value is, nm; null for design-wide requirements (focal length, footprint…). */
  worstWavelengthNm: number | null;
  /**
   * Signed fraction of the limit: positive is headroom, negative is how far it misses
   * ("24 % over" is −0.24). Null for yes/no requirements and when unknown.
   */
  margin: number | null;
  /** One line in plain words: "bandpass 0.62 nm at 900 nm, 24 % over" or why it is unknown. */
  message: string;
  /** Wavelength spans [from, to] (nm, inclusive) where a per-wavelength requirement fails. */
  failingSpansNm: readonly (readonly [number, number])[];
  /** The design field a "fix" link opens (`slits.exitWidthUm`); null when none fits. */
  fixPath: string | null;
}

export interface RequirementsReport {
  checks: RequirementCheck[];
  passed: number;
  failed: number;
  unknown: number;
}
