/**
 * Turning a parsed upload into the curve a design carries: its role fields, its name and the
 * SHA-256 of the file's bytes (how the team library recognises a re-upload). Pure apart from the
 * platform's digest.
 */

import type { CurveFileParsed } from '../../shared/curve-file';
import {
  MAX_CURVE_NAME,
  designCurveSchema,
  type DesignCurve,
  type MirrorTarget,
  type Polarisation,
} from '../../shared/curves';
import { fieldErrors, type FieldErrors } from '../../shared/validation';

export interface CurveRole {
  /** grating-efficiency: the order measured (the design's when blank). */
  order?: number;
  polarisation?: Polarisation;
  mirror?: MirrorTarget;
  /** filter-transmission: which filter, from 1; every filter position when absent. */
  filterNumber?: number;
}

/** "grating-1200.csv" → "grating-1200": the name a curve gets unless the designer types one. */
export function baseName(fileName: string): string {
  const name = fileName.replace(/^.*[\\/]/, '').replace(/\.(csv|tsv|txt|dat)$/i, '').trim();
  return (name === '' ? 'Measured curve' : name).slice(0, MAX_CURVE_NAME);
}

/** Hex SHA-256 of the bytes, by the platform's Web Crypto (the browser and Node both have it). */
export async function sha256Hex(bytes: Uint8Array): Promise<string> {
  const subtle = globalThis.crypto?.subtle;
  if (!subtle) throw new Error('This platform has no Web Crypto digest to fingerprint the file.');
  const digest = await subtle.digest('SHA-256', bytes as unknown as ArrayBuffer);
  return Array.from(new Uint8Array(digest), (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * The design curve for a parsed file, checked by the shared schema (so a curve the API would
 * refuse is refused here, on the field that shows it). Line lists keep only their wavelengths and
 * intensities: labels stay in the library.
 */
export function designCurveFrom(
  parsed: CurveFileParsed,
  name: string,
  checksum: string,
  role: CurveRole,
): { ok: true; curve: DesignCurve } | { ok: false; fields: FieldErrors } {
  return designCurveWithRole(
    {
      kind: parsed.kind,
      name: name.trim(),
      checksum,
      medium: parsed.applied.medium.value,
      wavelengthsNm: parsed.wavelengthsNm,
      values: parsed.values,
    },
    role,
  );
}

/** A library curve's points (or a parsed file's) with the role fields its kind takes, checked by the schema. */
export function designCurveWithRole(
  base: Pick<DesignCurve, 'kind' | 'name' | 'checksum' | 'medium' | 'wavelengthsNm' | 'values'>,
  role: CurveRole,
): { ok: true; curve: DesignCurve } | { ok: false; fields: FieldErrors } {
  const candidate: Record<string, unknown> = { ...base };
  if (base.kind === 'grating-efficiency') {
    if (role.order !== undefined) candidate.order = role.order;
    if (role.polarisation !== undefined && role.polarisation !== 'unpolarised') candidate.polarisation = role.polarisation;
  }
  if (base.kind === 'mirror-reflectance' && role.mirror !== undefined && role.mirror !== 'both') candidate.mirror = role.mirror;
  if (base.kind === 'filter-transmission' && role.filterNumber !== undefined) candidate.filterNumber = role.filterNumber;
  const checked = designCurveSchema.safeParse(candidate);
  return checked.success ? { ok: true, curve: checked.data } : { ok: false, fields: fieldErrors(checked.error) };
}
