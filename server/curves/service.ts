import { createHash } from 'node:crypto';
import type { User } from '../../shared/auth';
import { describeCurveFileError, parseCurveFile, type CurveCorrections, type CurveFileError, type CurveFileParsed } from '../../shared/curve-file';
import { CURVE_KIND_WORDS, MAX_CURVE_NAME, type CurveKind } from '../../shared/curves';
import { unstorableReason } from '../../shared/storable-text';
import type { CurvePreview, TeamCurve, TeamCurveSummary } from '../../shared/team-curves';
import type { Clock } from '../clock';
import { badRequest, HttpError, notFound } from '../http/errors';
import type { TeamAccess } from '../teams/index';
import type { CurvesRepository } from './repository';
import { newRecordId } from '../auth/index';

/** What the router hands over from a multipart form: the file as a File and the checked fields. */
export type CurveForm = { file: File; kind: CurveKind; name?: string } & CurveCorrections;

const curveNotFound = () => notFound('No such curve.');
/** At most `max` UTF-16 units, never ending on half of a pair (which could not be stored as sent). */
const clip = (text: string, max: number) => text.slice(0, max).replace(/[\uD800-\uDBFF]$/, '');
const MAX_FILE_NAME = 255;

/** A refused file: every problem (row, column, why) in `fields.file` and, one by one, in `details.fileErrors`. */
function refusedFile(errors: CurveFileError[]): HttpError {
  const lines = errors.map(describeCurveFileError);
  return new HttpError(400, 'invalid_request', `The curve file was refused: ${lines.join('; ')}.`, { file: lines.join('; ') }, { fileErrors: errors });
}

async function readForm(form: CurveForm) {
  const bytes = new Uint8Array(await form.file.arrayBuffer());
  const corrections: CurveCorrections = {};
  if (form.wavelengthUnit) corrections.wavelengthUnit = form.wavelengthUnit;
  if (form.valueScale) corrections.valueScale = form.valueScale;
  if (form.medium) corrections.medium = form.medium;
  const parsed = parseCurveFile(bytes, form.kind, corrections);
  if (!parsed.ok) throw refusedFile(parsed.errors);
  const fileNameReason = unstorableReason(form.file.name);
  if (fileNameReason) throw badRequest('The file name cannot be stored.', { file: `has a name that ${fileNameReason}` });
  return { bytes, parsed, corrections, checksum: createHash('sha256').update(bytes).digest('hex'), fileName: clip(form.file.name, MAX_FILE_NAME) };
}

function previewOf(parsed: CurveFileParsed, checksum: string, fileName: string): CurvePreview {
  const { ok: _ok, ...rest } = parsed;
  return { ...rest, checksum, fileName };
}

type Row = NonNullable<Awaited<ReturnType<CurvesRepository['get']>>>;
type SummaryRow = Awaited<ReturnType<CurvesRepository['list']>>[number];

function summaryOf(row: SummaryRow): TeamCurveSummary {
  return {
    ...row,
    kind: row.kind as CurveKind,
    corrections: row.corrections as CurveCorrections,
    createdAt: row.createdAt.toISOString(),
  };
}

function curveOf(row: Row): TeamCurve {
  const { wavelengthsNm, values, labels, ...summary } = row;
  const kind = row.kind as CurveKind;
  return {
    ...summaryOf(summary),
    designCurve: { kind, name: row.name, checksum: row.checksum, medium: row.medium, wavelengthsNm, values },
    labels: labels ?? null,
  };
}

/**
 * The rules of the team's curve library: anyone signed in may preview a file (nothing is kept),
 * owners add and remove curves, every member reads them. The same file read the same way (same
 * checksum, kind and applied units) is recognised instead of stored twice.
 */
export function createCurvesService(deps: { repository: CurvesRepository; access: TeamAccess; clock: Clock }) {
  const { repository, access } = deps;
  return {
    async preview(form: CurveForm): Promise<{ preview: CurvePreview }> {
      const { parsed, checksum, fileName } = await readForm(form);
      return { preview: previewOf(parsed, checksum, fileName) };
    },

    async upload(teamId: string, user: User, form: CurveForm): Promise<{ curve: TeamCurve; recognised: boolean }> {
      await access.require(teamId, user.id, 'curves.manage');
      const { bytes, parsed, corrections, checksum, fileName } = await readForm(form);
      const key = {
        teamId,
        checksum,
        kind: form.kind,
        wavelengthUnit: parsed.applied.wavelengthUnit.value,
        valueScale: parsed.applied.valueScale?.value ?? null,
        medium: parsed.applied.medium.value,
      };
      const existing = await repository.findSame(key);
      if (existing) return { curve: curveOf((await repository.get(teamId, existing))!), recognised: true };
      const id = newRecordId();
      const name = form.name ?? (clip(fileName.trim(), MAX_CURVE_NAME).trim() || CURVE_KIND_WORDS[form.kind]);
      const stored = await repository.insert({
        ...key,
        id,
        name,
        fileName,
        fileBytes: bytes,
        corrections,
        wavelengthsNm: parsed.wavelengthsNm,
        values: parsed.values,
        labels: parsed.labels,
        uploadedBy: user.id,
        uploadedByName: user.displayName,
        createdAt: deps.clock.now(),
      });
      // Two uploads of one file at once: the second finds the first's row.
      const storedId = stored ? id : await repository.findSame(key);
      return { curve: curveOf((await repository.get(teamId, storedId!))!), recognised: !stored };
    },

    async list(teamId: string, user: User): Promise<{ curves: TeamCurveSummary[] }> {
      await access.require(teamId, user.id, 'curves.read');
      return { curves: (await repository.list(teamId)).map(summaryOf) };
    },

    async get(teamId: string, curveId: string, user: User): Promise<{ curve: TeamCurve }> {
      await access.require(teamId, user.id, 'curves.read');
      const row = await repository.get(teamId, curveId);
      if (!row) throw curveNotFound();
      return { curve: curveOf(row) };
    },

    async remove(teamId: string, curveId: string, user: User): Promise<void> {
      await access.require(teamId, user.id, 'curves.manage');
      if (!(await repository.remove(teamId, curveId))) throw curveNotFound();
    },
  };
}

export type CurvesService = ReturnType<typeof createCurvesService>;
