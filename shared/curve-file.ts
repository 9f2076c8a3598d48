import Papa from 'papaparse';
import type { z } from 'zod';
import { checkCurvePoints, FRACTION_KINDS, MAX_CURVE_POINTS, type CurveKind, type Medium } from './curves';

/**
 * Reading an uploaded curve file (CSV, TSV or semicolon-separated; wavelength, value) into a
 * curve's points, with the units it detected and why. Pure and free of Node APIs: the server
 * parses with it before storing, and the client with the same code for its preview, so the two
 * cannot disagree. Splitting cells is papaparse's job; this module decides what the cells mean.
 */

export const WAVELENGTH_UNITS = ['nm', 'um'] as const;
export type WavelengthUnit = (typeof WAVELENGTH_UNITS)[number];
export const VALUE_SCALES = ['fraction', 'percent'] as const;
export type ValueScale = (typeof VALUE_SCALES)[number];

/** What the uploader says the file means, over what was detected. */
export type CurveCorrections = { wavelengthUnit?: WavelengthUnit; valueScale?: ValueScale; medium?: Medium };

/** Where a unit came from: the header row, a `#` comment, the values themselves, or nowhere. */
export type DetectedFrom = 'header' | 'comment' | 'values' | 'not-stated';
export type Detection<T> = { value: T; from: DetectedFrom; reason: string };

/** A unit as applied: what was detected, or the uploader's correction over it. */
export type Applied<T> = { value: T; corrected: boolean };

export type CurveFileError = {
  /** The file's line, counting from 1 (comments and blank lines count); null for the whole file. */
  row: number | null;
  /** 1-based column; null when the error is about a whole row or the whole file. */
  column: number | null;
  /** The column's header text, or what the column holds when the file has no header. */
  columnName?: string;
  message: string;
};

export type ColumnUse = { column: number; name: string | null };

export type CurveFileParsed = {
  ok: true;
  kind: CurveKind;
  /** Converted to nm, strictly increasing. */
  wavelengthsNm: number[];
  /** Fractions (0…1) for the fraction kinds; relative values as given for the others (line lists default to 1). */
  values: number[];
  /** line-list only: the third column's text per point ('' where empty); null for other kinds or without one. */
  labels: string[] | null;
  /** What the file itself says, and why. `valueScale` is null for kinds whose values are not fractions of the light. */
  detected: { wavelengthUnit: Detection<WavelengthUnit>; valueScale: Detection<ValueScale> | null; medium: Detection<Medium> };
  /** What was used: the detection, or the uploader's correction. */
  applied: { wavelengthUnit: Applied<WavelengthUnit>; valueScale: Applied<ValueScale> | null; medium: Applied<Medium> };
  delimiter: ',' | '\t' | ';';
  /** Decimal commas were read (only in semicolon-separated files, where they are the custom). */
  decimalComma: boolean;
  /** The header row's line and cells, when the file has one. */
  header: { row: number; cells: string[] } | null;
  columns: { wavelength: ColumnUse; value: ColumnUse | null; label: ColumnUse | null; ignored: ColumnUse[] };
  /** Data rows read, with their lines: the first PREVIEW_ROWS as the file has them. */
  firstRows: { row: number; cells: string[] }[];
  pointCount: number;
};
export type CurveFileFailed = { ok: false; errors: CurveFileError[] };
export type CurveFileResult = CurveFileParsed | CurveFileFailed;

/** Rows the preview shows as the file has them. */
export const PREVIEW_ROWS = 20;
/** Errors reported at most: a file wrong on every line says so in the first few. */
export const MAX_REPORTED_ERRORS = 20;
/** Below this every wavelength is taken as µm (common practice: nm files of optical curves start above 100). */
export const MICRON_BELOW = 30;
/** A fraction kind with any value above this is taken as percent (a measured fraction does not reach 1.5). */
export const PERCENT_ABOVE = 1.5;
export const MAX_LABEL_LENGTH = 80;

const notText = 'is not a text file (save it as CSV or TSV in UTF-8)';

/**
 * The file's text, or why it is not text: NUL bytes (binary files, and UTF-16 text) or bytes that
 * are not UTF-8. A byte-order mark is dropped.
 */
export function decodeCurveFile(input: string | Uint8Array): { ok: true; text: string } | CurveFileFailed {
  let text: string;
  if (typeof input === 'string') {
    text = input;
  } else {
    try {
      text = new TextDecoder('utf-8', { fatal: true }).decode(input);
    } catch {
      return { ok: false, errors: [{ row: null, column: null, message: notText }] };
    }
  }
  if (text.includes('\u0000')) return { ok: false, errors: [{ row: null, column: null, message: notText }] };
  return { ok: true, text: text.startsWith('\uFEFF') ? text.slice(1) : text };
}

/** "row 7, column 2 (Efficiency (%)): 'abc' is not a number", the form every message takes. */
export function describeCurveFileError(error: CurveFileError): string {
  const where = [
    error.row !== null ? `row ${error.row}` : null,
    error.column !== null ? `column ${error.column}${error.columnName ? ` (${error.columnName})` : ''}` : null,
  ].filter(Boolean);
  return where.length > 0 ? `${where.join(', ')}: ${error.message}` : error.message;
}

const numberPattern = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

function readNumber(cell: string, decimalComma: boolean): number | null {
  let text = cell.trim();
  if (decimalComma && /^[^,]*,[^,]*$/.test(text) && !text.includes('.')) text = text.replace(',', '.');
  if (!numberPattern.test(text)) return null;
  return Number(text);
}

const quote = (cell: string) => `'${cell.length > 40 ? `${cell.slice(0, 40)}…` : cell}'`;

/** Scaling a decimal by 1000 or 1/100 in binary leaves tails (0.55 × 1000 = 550.0000000000001); 15 digits is what the file could hold. */
const tidy = (x: number) => Number(x.toPrecision(15));

const micron = /µm|μm|\bum\b|micron|micromet/i;
const nanometre = /\bnm\b|nanomet/i;
const angstrom = /Å|\bangstrom|\bang\b/i;
const percent = /%|percent|\bpct\b/i;
const fractionWord = /fraction|\b0\s*(?:-|–|to|…|\.\.)\s*1\b/i;
const vacuum = /\bvac(?:uum)?\b/i;
const air = /\bair\b/i;

function detectMedium(header: string[] | null, comments: string[]): Detection<Medium> {
  const look = (texts: string[], from: DetectedFrom): Detection<Medium> | null => {
    const vac = texts.find((t) => vacuum.test(t));
    const inAir = texts.find((t) => air.test(t));
    if (vac && inAir) return { value: 'unstated', from, reason: `unstated: the ${from} names both vacuum and air` };
    if (vac) return { value: 'vacuum', from, reason: `vacuum, from the ${from} '${vac.trim().slice(0, 60)}'` };
    if (inAir) return { value: 'air', from, reason: `air, from the ${from} '${inAir.trim().slice(0, 60)}'` };
    return null;
  };
  return (
    (header && look(header, 'header')) ??
    look(comments, 'comment') ?? { value: 'unstated', from: 'not-stated', reason: 'unstated: neither the header nor a comment says vacuum or air' }
  );
}

type DataRow = { row: number; cells: string[] };

/**
 * Reads a curve file. `input` is its text, or its bytes (refused unless UTF-8 text). Comment lines
 * start with `#`; blank lines are skipped; the first other line is a header when its first cell is
 * not a number. Columns: wavelength then value; a line list has the wavelength, an optional
 * relative intensity (default 1) and an optional label. Units come from the header (and, for the
 * medium, comments), else from the values: all wavelengths below 30 → µm, a fraction kind with a
 * value above 1.5 → percent (common practice). `corrections` override what was detected.
 * Every refusal names the line (`row`, from 1) and column.
 */
export function parseCurveFile(input: string | Uint8Array, kind: CurveKind, corrections: CurveCorrections = {}): CurveFileResult {
  const decoded = decodeCurveFile(input);
  if (!decoded.ok) return decoded;
  const lines = decoded.text.split(/\r\n|\n|\r/);
  const comments: string[] = [];
  const contentLines: { row: number; text: string }[] = [];
  lines.forEach((text, i) => {
    const trimmed = text.trim();
    if (trimmed === '') return;
    if (trimmed.startsWith('#')) comments.push(trimmed.slice(1));
    else contentLines.push({ row: i + 1, text });
  });
  if (contentLines.length === 0) return { ok: false, errors: [{ row: null, column: null, message: 'is empty: it holds no rows of data' }] };

  const sample = contentLines.slice(0, 50).map((l) => l.text).join('\n');
  const guessed = Papa.parse<string[]>(sample, { delimitersToGuess: [';', '\t', ','], preview: 50 }).meta.delimiter;
  const delimiter = (guessed === ';' || guessed === '\t' ? guessed : ',') as CurveFileParsed['delimiter'];
  const decimalComma = delimiter === ';';

  const errors: CurveFileError[] = [];
  const fail = (error: CurveFileError) => {
    if (errors.length < MAX_REPORTED_ERRORS) errors.push(error);
  };

  // A header and one point past the limit are all that is ever read: a 2 MB file of short lines
  // is refused by its count, not split.
  const read = contentLines.slice(0, MAX_CURVE_POINTS + 2);
  // One parse of every line; each row keeps its file line as long as no quoted cell spans lines.
  // When one does, the lines are parsed one by one to name each line that fails.
  const whole = Papa.parse<string[]>(read.map((l) => l.text).join('\n'), { delimiter, newline: '\n' });
  let split = whole.data;
  if (split.length !== read.length || whole.errors.some((e) => e.type === 'Quotes')) {
    split = [];
    for (const line of read) {
      const one = Papa.parse<string[]>(line.text, { delimiter });
      if (one.errors.some((e) => e.type === 'Quotes')) fail({ row: line.row, column: null, message: 'has a quoted cell that is not closed on its line' });
      split.push(one.data[0] ?? []);
    }
    if (errors.length > 0) return { ok: false, errors };
  }
  const rows: DataRow[] = read.map((line, i) => {
    const cells = (split[i] ?? []).map((c) => c.trim());
    while (cells.length > 1 && cells[cells.length - 1] === '') cells.pop();
    return { row: line.row, cells };
  });

  const first = rows[0]!;
  const hasHeader = readNumber(first.cells[0] ?? '', decimalComma) === null;
  const header = hasHeader ? first : null;
  const data = hasHeader ? rows.slice(1) : rows;

  const isLineList = kind === 'line-list';
  const isFraction = FRACTION_KINDS.includes(kind);
  const widest = Math.max(...data.map((r) => r.cells.length), header?.cells.length ?? 0);
  const valueWord = isLineList ? 'relative intensity' : 'value';
  const nameOf = (column: number, role: string) => header?.cells[column - 1] || role;
  const columnAt = (column: number): ColumnUse => ({ column, name: header?.cells[column - 1] || null });

  const wavelengthColumn = columnAt(1);
  const valueColumn = isLineList ? (widest >= 2 ? columnAt(2) : null) : columnAt(2);
  const labelColumn = isLineList && widest >= 3 ? columnAt(3) : null;
  const usedColumns = isLineList ? 3 : 2;
  const ignored: ColumnUse[] = [];
  for (let c = usedColumns + 1; c <= widest; c++) ignored.push(columnAt(c));

  if (data.length === 0) {
    return { ok: false, errors: [{ row: header?.row ?? null, column: null, message: 'has a header but no rows of data (a curve needs at least 2 points)' }] };
  }
  const pointsInFile = contentLines.length - (hasHeader ? 1 : 0);
  if (pointsInFile > MAX_CURVE_POINTS) {
    const over = data[MAX_CURVE_POINTS]!;
    return { ok: false, errors: [{ row: over.row, column: null, message: `is point ${MAX_CURVE_POINTS + 1}: a curve keeps at most ${MAX_CURVE_POINTS} points (the file has ${pointsInFile})` }] };
  }

  // Pass 1: every cell a number (or a label).
  const rawWavelengths: number[] = [];
  const rawValues: number[] = [];
  const labels: string[] = [];
  const cellError = (row: number, column: number, role: string, message: string) => fail({ row, column, columnName: nameOf(column, role), message });
  for (const { row, cells } of data) {
    const wavelengthCell = cells[0] ?? '';
    const w = readNumber(wavelengthCell, decimalComma);
    if (wavelengthCell === '') cellError(row, 1, 'wavelength', 'is empty: every row needs a wavelength');
    else if (w === null) cellError(row, 1, 'wavelength', `${quote(wavelengthCell)} is not a number`);
    else if (!Number.isFinite(w)) cellError(row, 1, 'wavelength', `${quote(wavelengthCell)} is too large`);
    let v: number | null = 1;
    const valueCell = cells[1];
    // A line list's intensity may be left out (1); every other kind needs its value.
    if (!isLineList || (valueCell !== undefined && valueCell !== '')) {
      const text = valueCell ?? '';
      v = readNumber(text, decimalComma);
      if (text === '') cellError(row, 2, valueWord, `is empty: every row needs a ${valueWord}`);
      else if (v === null) cellError(row, 2, valueWord, `${quote(text)} is not a number`);
      else if (!Number.isFinite(v)) cellError(row, 2, valueWord, `${quote(text)} is too large`);
    }
    if (labelColumn) {
      const label = cells.slice(2).join(delimiter === '\t' ? ' ' : delimiter).trim();
      if (label.length > MAX_LABEL_LENGTH) cellError(row, 3, 'label', `is longer than ${MAX_LABEL_LENGTH} characters`);
      labels.push(label);
    }
    rawWavelengths.push(w ?? NaN);
    rawValues.push(v ?? NaN);
  }
  if (errors.length > 0) return { ok: false, errors };
  if (data.length < 2) return { ok: false, errors: [{ row: data[0]!.row, column: null, message: 'is the only point: a curve needs at least 2' }] };

  // Units: the header's word first, then what the values can only mean.
  const wavelengthHeader = header?.cells[0] ?? null;
  let wavelengthUnit: Detection<WavelengthUnit>;
  if (wavelengthHeader && micron.test(wavelengthHeader)) {
    wavelengthUnit = { value: 'um', from: 'header', reason: `µm, from the header '${wavelengthHeader}'` };
  } else if (wavelengthHeader && nanometre.test(wavelengthHeader)) {
    wavelengthUnit = { value: 'nm', from: 'header', reason: `nm, from the header '${wavelengthHeader}'` };
  } else if (Math.max(...rawWavelengths) < MICRON_BELOW) {
    wavelengthUnit = { value: 'um', from: 'values', reason: `µm, because every wavelength is below ${MICRON_BELOW} (nm files start far higher)` };
  } else {
    wavelengthUnit = { value: 'nm', from: 'values', reason: `nm, because the wavelengths reach ${MICRON_BELOW} or more` };
  }
  if (wavelengthHeader && angstrom.test(wavelengthHeader) && corrections.wavelengthUnit === undefined) {
    return { ok: false, errors: [{ row: header!.row, column: 1, columnName: wavelengthHeader, message: 'gives wavelengths in ångström, which are not read: convert them to nm or µm' }] };
  }

  let valueScale: Detection<ValueScale> | null = null;
  if (isFraction) {
    const valueHeader = header?.cells[1] ?? null;
    const largest = Math.max(...rawValues);
    if (valueHeader && percent.test(valueHeader)) valueScale = { value: 'percent', from: 'header', reason: `percent, from the header '${valueHeader}'` };
    else if (valueHeader && fractionWord.test(valueHeader)) valueScale = { value: 'fraction', from: 'header', reason: `fraction, from the header '${valueHeader}'` };
    else if (largest > PERCENT_ABOVE) valueScale = { value: 'percent', from: 'values', reason: `percent, because a value reaches ${largest} (a fraction stays below ${PERCENT_ABOVE})` };
    else valueScale = { value: 'fraction', from: 'values', reason: `fraction, because no value is above ${PERCENT_ABOVE}` };
  }
  const medium = detectMedium(header?.cells ?? null, comments);

  const applied: CurveFileParsed['applied'] = {
    wavelengthUnit: { value: corrections.wavelengthUnit ?? wavelengthUnit.value, corrected: corrections.wavelengthUnit !== undefined && corrections.wavelengthUnit !== wavelengthUnit.value },
    valueScale: valueScale && {
      value: corrections.valueScale ?? valueScale.value,
      corrected: corrections.valueScale !== undefined && corrections.valueScale !== valueScale.value,
    },
    medium: { value: corrections.medium ?? medium.value, corrected: corrections.medium !== undefined && corrections.medium !== medium.value },
  };
  const inPercent = applied.valueScale?.value === 'percent';

  // Pass 2: the points as a curve, in the file's own numbers.
  const valueName = nameOf(2, valueWord);
  for (let i = 0; i < data.length; i++) {
    const { row } = data[i]!;
    const w = rawWavelengths[i]!;
    const v = rawValues[i]!;
    if (!(w > 0)) cellError(row, 1, 'wavelength', `${w} must be greater than 0`);
    else if (i > 0 && w === rawWavelengths[i - 1]) cellError(row, 1, 'wavelength', `${w} repeats the wavelength of row ${data[i - 1]!.row}`);
    else if (i > 0 && w < rawWavelengths[i - 1]!) {
      cellError(row, 1, 'wavelength', `${w} is not greater than ${rawWavelengths[i - 1]} on row ${data[i - 1]!.row}: wavelengths must increase`);
    }
    if (v < 0) fail({ row, column: 2, columnName: valueName, message: `${v} is negative` });
    else if (isFraction && inPercent && v > 100) fail({ row, column: 2, columnName: valueName, message: `${v} is above 100 %` });
    else if (isFraction && !inPercent && v > 1) {
      fail({ row, column: 2, columnName: valueName, message: `${v} is above 1 as a fraction (if the file is in percent, correct the value scale)` });
    }
  }
  if (errors.length > 0) return { ok: false, errors };

  const toNm = applied.wavelengthUnit.value === 'um' ? 1000 : 1;
  const wavelengthsNm = rawWavelengths.map((w) => tidy(w * toNm));
  const values = rawValues.map((v) => (inPercent ? tidy(v / 100) : v));

  // The same checks a design's copy will meet, so a parsed curve always saves.
  const issues: { path: PropertyKey[]; message: string }[] = [];
  checkCurvePoints(kind, wavelengthsNm, values, { addIssue: (issue: { path?: PropertyKey[]; message?: string }) => issues.push({ path: issue.path ?? [], message: issue.message ?? '' }) } as unknown as z.RefinementCtx);
  if (issues.length > 0) {
    return {
      ok: false,
      errors: issues.map(({ path, message }) => {
        const index = typeof path[1] === 'number' ? path[1] : 0;
        const column = path[0] === 'wavelengthsNm' ? 1 : 2;
        return { row: data[index]?.row ?? null, column, columnName: nameOf(column, column === 1 ? 'wavelength' : valueWord), message: `after conversion ${message}` };
      }),
    };
  }

  return {
    ok: true,
    kind,
    wavelengthsNm,
    values,
    labels: labelColumn ? labels : null,
    detected: { wavelengthUnit, valueScale, medium },
    applied,
    delimiter,
    decimalComma,
    header: header ? { row: header.row, cells: header.cells } : null,
    columns: { wavelength: wavelengthColumn, value: valueColumn, label: labelColumn, ignored },
    firstRows: data.slice(0, PREVIEW_ROWS).map(({ row, cells }) => ({ row, cells })),
    pointCount: data.length,
  };
}
