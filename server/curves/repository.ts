import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { teamCurves } from '../../db/schema';
import type { CurveCorrections, ValueScale, WavelengthUnit } from '../../shared/curve-file';
import type { CurveKind, Medium } from '../../shared/curves';

export type NewTeamCurve = {
  id: string;
  teamId: string;
  kind: CurveKind;
  name: string;
  fileName: string;
  fileBytes: Uint8Array;
  checksum: string;
  wavelengthUnit: WavelengthUnit;
  valueScale: ValueScale | null;
  medium: Medium;
  corrections: CurveCorrections;
  wavelengthsNm: number[];
  values: number[];
  labels: string[] | null;
  uploadedBy: string;
  uploadedByName: string;
  createdAt: Date;
};

/** The columns a list shows: no bytes and no points, only their count and span. */
const summaryColumns = {
  id: teamCurves.id,
  teamId: teamCurves.teamId,
  kind: teamCurves.kind,
  name: teamCurves.name,
  fileName: teamCurves.fileName,
  fileSizeBytes: sql<number>`octet_length(${teamCurves.fileBytes})`.mapWith(Number),
  checksum: teamCurves.checksum,
  wavelengthUnit: teamCurves.wavelengthUnit,
  valueScale: teamCurves.valueScale,
  medium: teamCurves.medium,
  corrections: teamCurves.corrections,
  pointCount: sql<number>`cardinality(${teamCurves.wavelengthsNm})`.mapWith(Number),
  startNm: sql<number>`${teamCurves.wavelengthsNm}[1]`.mapWith(Number),
  endNm: sql<number>`${teamCurves.wavelengthsNm}[cardinality(${teamCurves.wavelengthsNm})]`.mapWith(Number),
  uploadedBy: teamCurves.uploadedBy,
  uploadedByName: teamCurves.uploadedByName,
  createdAt: teamCurves.createdAt,
};

const detailColumns = { ...summaryColumns, wavelengthsNm: teamCurves.wavelengthsNm, values: teamCurves.values, labels: teamCurves.labels };

/** The team's curve library; the only code that reads or writes `team_curves`. */
export function createCurvesRepository(db: Database) {
  return {
    async list(teamId: string) {
      return db.select(summaryColumns).from(teamCurves).where(eq(teamCurves.teamId, teamId)).orderBy(desc(teamCurves.createdAt), desc(teamCurves.id));
    },

    async get(teamId: string, curveId: string) {
      const [row] = await db
        .select(detailColumns)
        .from(teamCurves)
        .where(and(eq(teamCurves.teamId, teamId), eq(teamCurves.id, curveId)));
      return row ?? null;
    },

    /** The curve stored from the same file read the same way, if any. */
    async findSame(key: { teamId: string; checksum: string; kind: CurveKind; wavelengthUnit: WavelengthUnit; valueScale: ValueScale | null; medium: Medium }) {
      const [row] = await db
        .select({ id: teamCurves.id })
        .from(teamCurves)
        .where(
          and(
            eq(teamCurves.teamId, key.teamId),
            eq(teamCurves.checksum, key.checksum),
            eq(teamCurves.kind, key.kind),
            eq(teamCurves.wavelengthUnit, key.wavelengthUnit),
            key.valueScale === null ? isNull(teamCurves.valueScale) : eq(teamCurves.valueScale, key.valueScale),
            eq(teamCurves.medium, key.medium),
          ),
        );
      return row?.id ?? null;
    },

    /** Stores the curve, or nothing when the same file read the same way got there first: true when stored. */
    async insert(curve: NewTeamCurve): Promise<boolean> {
      const stored = await db.insert(teamCurves).values(curve).onConflictDoNothing().returning({ id: teamCurves.id });
      return stored.length > 0;
    },

    async remove(teamId: string, curveId: string): Promise<boolean> {
      const removed = await db
        .delete(teamCurves)
        .where(and(eq(teamCurves.teamId, teamId), eq(teamCurves.id, curveId)))
        .returning({ id: teamCurves.id });
      return removed.length > 0;
    },
  };
}

export type CurvesRepository = ReturnType<typeof createCurvesRepository>;
