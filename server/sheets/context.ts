import type { Design } from '../../shared/design';
import type { CompareResponse, Provenance, Version } from '../../shared/notebooks/index';
import type { VersionReview } from '../../shared/reviews';
import type { Paper } from '../../shared/sheets';
import { evaluateDesign, evaluatePoint, prepareDesign, type Evaluation, type WavelengthPoint } from '../../features/solver/index';

/**
 * Everything a sheet's sections read, gathered once per request: the version, where it sits in
 * its design, its review, and the solver's results. Sections are functions of this and nothing
 * else (no database, no clock), so a test can build one from plain values.
 */
export type SheetContext = {
  paper: Paper;
  /** `team`: a member asked; `link`: a share link's holder (review threads' text stays with the team). */
  audience: 'team' | 'link';
  design: {
    id: string;
    title: string;
    /** Null for a share link's holder. */
    teamName: string | null;
    clonedFrom: Provenance | null;
    importedAt: string | null;
    /** True when this version is the design's baseline; null when not known (share links). */
    isBaseline: boolean | null;
  };
  version: Version;
  /** The version's parameters (stored fields re-parsed in the schema's order). */
  params: Design;
  /** The default sweep, as the workbench plots it and counts its warnings. */
  evaluation: Evaluation;
  /** The performance table's rows: start, centre, end, then the wavelengths the request picked. */
  performance: { label: string; point: WavelengthPoint }[];
  review: VersionReview | null;
  generatedAt: Date;
  /** Where the version lives in the app (absolute), printed in the footer. */
  link: string;
};

/** Start, centre and end of the range, then `picked` (already sorted, deduplicated). */
export function performanceRows(params: Design, picked: readonly number[] = []): SheetContext['performance'] {
  const plan = prepareDesign(params);
  const { startNm, endNm } = params.range;
  const rows = [
    { label: 'Range start', wavelengthNm: startNm },
    { label: 'Centre', wavelengthNm: (startNm + endNm) / 2 },
    { label: 'Range end', wavelengthNm: endNm },
    ...picked.map((wavelengthNm) => ({ label: 'Picked', wavelengthNm })),
  ];
  return rows.map(({ label, wavelengthNm }) => ({ label, point: evaluatePoint(plan, wavelengthNm) }));
}

export type SheetInput = Omit<SheetContext, 'evaluation' | 'performance'> & { picked?: readonly number[] };

/** Runs the solver for a sheet: the sweep and the table's rows. */
export function sheetContext({ picked, ...input }: SheetInput): SheetContext {
  return { ...input, evaluation: evaluateDesign(input.params), performance: performanceRows(input.params, picked) };
}

/** Both sides of a compare sheet. */
export type CompareSheetContext = {
  paper: Paper;
  design: SheetContext['design'];
  a: { version: Version; params: Design; evaluation: Evaluation };
  b: { version: Version; params: Design; evaluation: Evaluation };
  /** What changed, as the compare screen lists it (server/notebooks/compare.ts). */
  changes: CompareResponse['changes'];
  figures: CompareResponse['figures'];
  generatedAt: Date;
  link: string;
};
