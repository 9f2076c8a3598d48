import * as DocumentPicker from 'expo-document-picker';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Platform, StyleSheet, Text, View } from 'react-native';
import { XyPlot } from '@/features/selectors';
import { Button, RadioGroup, TextField, colors, fonts, radius, space, type, useLayout } from '@/features/ui';
import {
  describeCurveFileError,
  parseCurveFile,
  type CurveCorrections,
  type CurveFileResult,
  type ValueScale,
  type WavelengthUnit,
} from '@/shared/curve-file';
import {
  CURVE_KINDS,
  CURVE_KIND_WORDS,
  FRACTION_KINDS,
  MAX_CURVE_FILE_BYTES,
  type CurveKind,
  type DesignCurve,
  type Medium,
  type MirrorTarget,
  type Polarisation,
} from '@/shared/curves';
import type { Design } from '@/shared/design';
import { formatNumber } from '@/shared/format';
import { ApiError } from '@/features/api';
import { baseName, designCurveFrom, designCurveWithRole, sha256Hex, type CurveRole } from '../curve-attach';
import { curveLine } from '../light-budget-words';
import { fetchTeamCurve, useRemoveTeamCurve, useTeamCurvesQuery, useUploadTeamCurve } from '../queries';

type Picked = { name: string; bytes: Uint8Array };

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
const KIND_OPTIONS = CURVE_KINDS.map((kind) => ({ value: kind, label: capital(CURVE_KIND_WORDS[kind].replace(/ \(.*\)$/, '')) }));
const UNIT_OPTIONS = [
  { value: 'nm' as const, label: 'nm' },
  { value: 'um' as const, label: 'µm' },
];
const SCALE_OPTIONS = [
  { value: 'fraction' as const, label: 'Fraction (0–1)' },
  { value: 'percent' as const, label: 'Percent' },
];
const MEDIUM_OPTIONS = [
  { value: 'air' as const, label: 'Air' },
  { value: 'vacuum' as const, label: 'Vacuum' },
  { value: 'unstated' as const, label: 'Not stated' },
];
const POLARISATION_OPTIONS = [
  { value: 'unpolarised' as const, label: 'Unpolarised' },
  { value: 'te' as const, label: 'TE' },
  { value: 'tm' as const, label: 'TM' },
];
const MIRROR_OPTIONS = [
  { value: 'both' as const, label: 'Both mirrors' },
  { value: 'collimator' as const, label: 'Collimator' },
  { value: 'camera' as const, label: 'Camera' },
];

const MIB = 1024 * 1024;

/** Reads a picked or dropped file's bytes, refusing past the upload limit before reading it all. */
async function readPicked(asset: { name: string; size?: number | null; uri: string; file?: File }): Promise<Picked | string> {
  if (asset.size != null && asset.size > MAX_CURVE_FILE_BYTES) {
    return `is ${formatNumber(asset.size / MIB, 3)} MB: files are limited to ${MAX_CURVE_FILE_BYTES / MIB} MB`;
  }
  const buffer = asset.file ? await asset.file.arrayBuffer() : await (await fetch(asset.uri)).arrayBuffer();
  if (buffer.byteLength > MAX_CURVE_FILE_BYTES) return `is larger than ${MAX_CURVE_FILE_BYTES / MIB} MB`;
  return { name: asset.name, bytes: new Uint8Array(buffer) };
}

/** A drop target on the web (wide screens): the page's own drag and drop, since React Native has none. */
function useDropZone(onFile: (file: File) => void) {
  const ref = useRef<View>(null);
  const [over, setOver] = useState(false);
  useEffect(() => {
    if (Platform.OS !== 'web') return;
    const node = ref.current as unknown as HTMLElement | null;
    if (!node?.addEventListener) return;
    const enter = (e: DragEvent) => {
      e.preventDefault();
      setOver(true);
    };
    const leave = () => setOver(false);
    const drop = (e: DragEvent) => {
      e.preventDefault();
      setOver(false);
      const file = e.dataTransfer?.files?.[0];
      if (file) onFile(file);
    };
    node.addEventListener('dragover', enter);
    node.addEventListener('dragleave', leave);
    node.addEventListener('drop', drop);
    return () => {
      node.removeEventListener('dragover', enter);
      node.removeEventListener('dragleave', leave);
      node.removeEventListener('drop', drop);
    };
  }, [onFile]);
  return { ref, over };
}

function Detected({ result }: { result: Extract<CurveFileResult, { ok: true }> }) {
  const unitWord = result.applied.wavelengthUnit.value === 'um' ? 'µm' : 'nm';
  const scale = result.applied.valueScale;
  const lines = [
    `Wavelengths: ${result.applied.wavelengthUnit.corrected ? `${unitWord} (your correction)` : result.detected.wavelengthUnit.reason}`,
    scale && result.detected.valueScale
      ? `Values: ${scale.corrected ? `${scale.value} (your correction)` : result.detected.valueScale.reason}`
      : null,
    `Medium: ${result.applied.medium.corrected ? `${result.applied.medium.value} (your correction)` : result.detected.medium.reason}`,
    `${result.pointCount} points, ${formatNumber(result.wavelengthsNm[0] ?? 0)}–${formatNumber(result.wavelengthsNm[result.pointCount - 1] ?? 0)} nm`,
  ].filter((x): x is string => x !== null);
  return (
    <View role="list" style={styles.detected} testID="curve-upload-detected">
      {lines.map((line) => (
        <Text key={line} role="listitem" style={styles.small}>
          {line}
        </Text>
      ))}
    </View>
  );
}

function PreviewTable({ result }: { result: Extract<CurveFileResult, { ok: true }> }) {
  const rows = result.firstRows.slice(0, 8);
  return (
    <View style={styles.table} testID="curve-upload-preview-table" accessibilityLabel="The file's first rows">
      {result.header ? (
        <View style={[styles.tr, styles.th]}>
          <Text style={[styles.cell, styles.rowNo]}>Line</Text>
          {result.header.cells.slice(0, 3).map((c, i) => (
            <Text key={i} style={[styles.cell, styles.headCell]} numberOfLines={1}>
              {c}
            </Text>
          ))}
        </View>
      ) : null}
      {rows.map((row) => (
        <View key={row.row} style={styles.tr}>
          <Text style={[styles.cell, styles.rowNo]}>{row.row}</Text>
          {row.cells.slice(0, 3).map((c, i) => (
            <Text key={i} style={styles.cell} numberOfLines={1}>
              {c}
            </Text>
          ))}
        </View>
      ))}
      {result.pointCount > rows.length ? <Text style={styles.note}>…and {result.pointCount - rows.length} more rows.</Text> : null}
    </View>
  );
}

/**
 * Choose a CSV or TSV (wavelength, value), see what was detected with a way to correct it, and a
 * preview table and plot, before attaching the curve to the design. Parsed on the device with the
 * same parser the API uses, so what is refused here is refused there, row and column named.
 */
/** The team whose curve library the panel reads and (for owners) keeps uploads in. */
export type CurveLibrary = { teamId: string; canManage: boolean };

/** Why a call failed, in the server's words (naming the field and the row where it says them). */
function failureText(error: unknown): string {
  if (error instanceof ApiError) {
    const fields = Object.entries(error.fields).map(([field, message]) => `${field}: ${message}`);
    return fields.length > 0 ? `${error.message} ${fields.join('; ')}` : error.message;
  }
  return 'The server could not be reached: the curve was not saved.';
}

/** The team's curves, each with Use: the points are copied into the design with this panel's role choices. */
function LibraryList({
  library,
  roleFor,
  onUse,
}: {
  library: CurveLibrary;
  roleFor: (kind: CurveKind) => CurveRole;
  onUse: (curve: DesignCurve) => void;
}) {
  const list = useTeamCurvesQuery(library.teamId);
  const remove = useRemoveTeamCurve(library.teamId);
  const [problem, setProblem] = useState<string | null>(null);
  const use = async (curveId: string) => {
    setProblem(null);
    try {
      const { curve } = await fetchTeamCurve(library.teamId, curveId);
      const made = designCurveWithRole(curve.designCurve, roleFor(curve.kind));
      if (made.ok) onUse(made.curve);
      else setProblem(Object.entries(made.fields).map(([f, m]) => `${f}: ${m}`).join('; '));
    } catch (error) {
      setProblem(failureText(error));
    }
  };
  if (list.isPending) return <Text style={styles.note}>Reading the team’s curve library…</Text>;
  if (list.isError) return <Text style={styles.error}>{failureText(list.error)}</Text>;
  return (
    <View style={styles.library} testID="curve-library">
      <Text style={styles.subheading} role="heading" aria-level={4}>
        From the team’s library
      </Text>
      {list.data.length === 0 ? <Text style={styles.note}>No curves in the team’s library yet.</Text> : null}
      {list.data.length > 0 && library.canManage ? (
        <Text style={styles.note}>Removing a curve from the library leaves the designs that use it unchanged.</Text>
      ) : null}
      <View role="list" style={styles.libraryList}>
        {list.data.slice(0, 30).map((entry, index) => (
          <View key={entry.id} role="listitem" style={styles.libraryItem} testID={`curve-library-${index}`}>
            <View style={styles.libraryText}>
              <Text style={styles.small}>{entry.name}</Text>
              <Text style={styles.note}>
                {curveLine({ kind: entry.kind, name: entry.name, checksum: entry.checksum, medium: entry.medium, wavelengthsNm: [entry.startNm, entry.endNm], values: [0, 0] }).replace(/2 points/, `${entry.pointCount} points`)}
                {` · ${entry.uploadedByName}`}
              </Text>
            </View>
            <Button kind="quiet" label="Use" accessibilityLabel={`Use the library curve ${entry.name}`} onPress={() => void use(entry.id)} testID={`curve-library-use-${index}`} />
            {library.canManage ? (
              <Button
                kind="quiet"
                label="Remove"
                accessibilityLabel={`Remove ${entry.name} from the team’s library (designs keep their copies)`}
                onPress={() => remove.mutate(entry.id, { onError: (error) => setProblem(failureText(error)) })}
                testID={`curve-library-remove-${index}`}
              />
            ) : null}
          </View>
        ))}
      </View>
      {problem ? (
        <Text style={styles.error} role="alert">
          {problem}
        </Text>
      ) : null}
    </View>
  );
}

export function CurveUploadPanel({
  design,
  library = null,
  onAttach,
  onCancel,
}: {
  design: Design;
  /** In a team's notebook: its library to reuse curves from, and where an owner's upload is kept. */
  library?: CurveLibrary | null;
  onAttach: (curve: DesignCurve) => void;
  onCancel: () => void;
}) {
  const layout = useLayout();
  const [kind, setKind] = useState<CurveKind>('grating-efficiency');
  const [picked, setPicked] = useState<Picked | null>(null);
  const [pickError, setPickError] = useState<string | null>(null);
  const [corrections, setCorrections] = useState<CurveCorrections>({});
  const [name, setName] = useState('');
  const [polarisation, setPolarisation] = useState<Polarisation>('unpolarised');
  const [mirror, setMirror] = useState<MirrorTarget>('both');
  const [filterNumber, setFilterNumber] = useState<string>('all');
  const [attachErrors, setAttachErrors] = useState<string[]>([]);
  const [width, setWidth] = useState(300);
  const [libraryNote, setLibraryNote] = useState<string | null>(null);
  const upload = useUploadTeamCurve(library?.teamId ?? '');

  const take = async (asset: { name: string; size?: number | null; uri: string; file?: File }) => {
    setAttachErrors([]);
    const read = await readPicked(asset);
    if (typeof read === 'string') {
      setPicked(null);
      setPickError(`The file ${asset.name} ${read}.`);
      return;
    }
    setPickError(null);
    setPicked(read);
    setCorrections({});
    setName(baseName(read.name));
  };
  const choose = async () => {
    const picked = await DocumentPicker.getDocumentAsync({
      type: ['text/csv', 'text/tab-separated-values', 'text/plain', '.csv', '.tsv', '.txt'],
      copyToCacheDirectory: false,
      multiple: false,
    });
    const asset = picked.canceled ? null : picked.assets[0];
    if (asset) await take({ name: asset.name, size: asset.size ?? null, uri: asset.uri, ...(asset.file ? { file: asset.file } : {}) });
  };
  const { ref: dropRef, over: dropOver } = useDropZone((file) => void take({ name: file.name, size: file.size, uri: '', file }));

  const result = useMemo(() => (picked ? parseCurveFile(picked.bytes, kind, corrections) : null), [picked, kind, corrections]);
  const filters = design.filters ?? [];

  const roleFor = (k: CurveKind): CurveRole => ({
    ...(k === 'grating-efficiency' ? { order: design.grating.order, polarisation } : {}),
    ...(k === 'mirror-reflectance' ? { mirror } : {}),
    ...(k === 'filter-transmission' && filterNumber !== 'all' ? { filterNumber: Number(filterNumber) } : {}),
  });
  const role = roleFor(kind);
  const attach = async () => {
    if (!picked || !result?.ok) return;
    setAttachErrors([]);
    let checksum = await sha256Hex(picked.bytes);
    // In a team's notebook an owner's upload is kept in the library first: the design then carries
    // exactly what the library stored (a re-upload is recognised and reused).
    if (library?.canManage) {
      try {
        const answer = await upload.mutateAsync({
          file: new File([picked.bytes as unknown as BlobPart], picked.name, { type: 'text/csv' }),
          kind,
          name: name.trim(),
          corrections,
        });
        checksum = answer.curve.checksum;
        setLibraryNote(answer.recognised ? 'This file was already in the team’s library: its stored curve is used.' : 'Kept in the team’s library for the next design.');
      } catch (error) {
        setAttachErrors([failureText(error)]);
        return;
      }
    }
    const made = designCurveFrom(result, name, checksum, role);
    if (made.ok) onAttach(made.curve);
    else setAttachErrors(Object.entries(made.fields).map(([field, message]) => `${field}: ${message}`));
  };

  const fraction = FRACTION_KINDS.includes(kind);
  return (
    <View
      style={styles.panel}
      testID="curve-upload-panel"
      onLayout={(e) => setWidth(Math.max(240, Math.round(e.nativeEvent.layout.width) - 2 * space.sm))}
    >
      <Text style={styles.subheading} role="heading" aria-level={3}>
        Add a measured curve
      </Text>
      {library ? <LibraryList library={library} roleFor={roleFor} onUse={onAttach} /> : null}
      <RadioGroup label="What the file holds" showLabel options={KIND_OPTIONS} value={kind} onChange={setKind} look="chips" size="compact" testID="curve-upload-kind" />
      <View
        ref={dropRef}
        style={[styles.drop, layout === 'phone' ? styles.dropPhone : null, dropOver ? styles.dropOver : null]}
        testID="curve-upload-drop"
      >
        <Button kind="secondary" label={picked ? 'Choose another file' : 'Choose a CSV or TSV file'} onPress={() => void choose()} testID="curve-upload-choose" />
        <Text style={styles.note}>
          {layout === 'phone' ? 'Wavelength and value per row, up to 2 MB.' : 'Or drop the file here. Wavelength and value per row, up to 2 MB.'}
        </Text>
      </View>
      {pickError ? (
        <Text style={styles.error} role="alert" testID="curve-upload-error">
          {pickError}
        </Text>
      ) : null}
      {picked && result && !result.ok ? (
        <View role="alert" testID="curve-upload-errors" style={styles.errors}>
          <Text style={styles.error}>The file {picked.name} cannot be read:</Text>
          {result.errors.map((error, i) => (
            <Text key={i} style={styles.error}>
              {describeCurveFileError(error)}
            </Text>
          ))}
        </View>
      ) : null}
      {picked && result?.ok ? (
        <>
          <Detected result={result} />
          <RadioGroup<WavelengthUnit>
            label="Wavelength unit"
            showLabel
            options={UNIT_OPTIONS}
            value={result.applied.wavelengthUnit.value}
            onChange={(value) => setCorrections((c) => ({ ...c, wavelengthUnit: value }))}
            look="segmented"
            size="compact"
            testID="curve-upload-unit"
          />
          {fraction && result.applied.valueScale ? (
            <RadioGroup<ValueScale>
              label="Values are"
              showLabel
              options={SCALE_OPTIONS}
              value={result.applied.valueScale.value}
              onChange={(value) => setCorrections((c) => ({ ...c, valueScale: value }))}
              look="segmented"
              size="compact"
              testID="curve-upload-scale"
            />
          ) : null}
          <RadioGroup<Medium>
            label="Wavelengths measured in"
            showLabel
            options={MEDIUM_OPTIONS}
            value={result.applied.medium.value}
            onChange={(value) => setCorrections((c) => ({ ...c, medium: value }))}
            look="segmented"
            size="compact"
            testID="curve-upload-medium"
          />
          {kind === 'grating-efficiency' ? (
            <RadioGroup label="Polarisation" showLabel options={POLARISATION_OPTIONS} value={polarisation} onChange={setPolarisation} look="segmented" size="compact" testID="curve-upload-polarisation" />
          ) : null}
          {kind === 'mirror-reflectance' ? (
            <RadioGroup label="Which mirror" showLabel options={MIRROR_OPTIONS} value={mirror} onChange={setMirror} look="segmented" size="compact" testID="curve-upload-mirror" />
          ) : null}
          {kind === 'filter-transmission' ? (
            <RadioGroup
              label="Which filter"
              showLabel
              options={[{ value: 'all', label: 'Always in the beam' }, ...filters.map((_, i) => ({ value: String(i + 1), label: `Filter ${i + 1}` }))]}
              value={filterNumber}
              onChange={setFilterNumber}
              look="chips"
              size="compact"
              testID="curve-upload-filter"
            />
          ) : null}
          <PreviewTable result={result} />
          <XyPlot
            testID="curve-upload-plot"
            title={`Preview: ${CURVE_KIND_WORDS[kind]}`}
            width={width}
            xs={result.wavelengthsNm}
            xName="wavelength"
            xTitle="Wavelength (nm)"
            xUnit="nm"
            series={[{ label: CURVE_KIND_WORDS[kind], unit: '', values: result.values, color: colors.primary }]}
            yTitle={fraction ? 'Fraction' : 'Relative value'}
            {...(fraction ? { yTickFormat: '.0%', yDomain: [0, 1] as [number, number] } : {})}
          />
          <TextField label="Name" value={name} onChangeText={setName} testID="curve-upload-name" maxLength={120} />
          {attachErrors.length > 0 ? (
            <View role="alert" testID="curve-upload-attach-errors">
              {attachErrors.map((message) => (
                <Text key={message} style={styles.error}>
                  {message}
                </Text>
              ))}
            </View>
          ) : null}
        </>
      ) : null}
      {libraryNote ? <Text style={styles.note}>{libraryNote}</Text> : null}
      <View style={styles.actions}>
        <Button label="Attach to the design" onPress={() => void attach()} disabled={!result?.ok || upload.isPending} testID="curve-upload-attach" />
        <Button kind="quiet" label="Cancel" onPress={onCancel} testID="curve-upload-cancel" />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.sm, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.sm },
  subheading: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  drop: { gap: space.xs, borderWidth: 1, borderStyle: 'dashed', borderColor: colors.inkFaint, borderRadius: radius.md, padding: space.md, alignItems: 'flex-start' },
  dropPhone: { padding: space.sm },
  dropOver: { backgroundColor: colors.surfaceSunken, borderColor: colors.primary },
  note: { ...type.caption, fontFamily: fonts.regular, color: colors.inkMuted },
  small: { ...type.small, fontFamily: fonts.regular, color: colors.ink },
  error: { ...type.small, fontFamily: fonts.regular, color: colors.danger },
  errors: { gap: space.xxs },
  detected: { gap: space.xxs, backgroundColor: colors.surfaceSunken, borderRadius: radius.sm, padding: space.xs },
  table: { gap: 0 },
  tr: { flexDirection: 'row', borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: 2 },
  th: { borderTopWidth: 0 },
  cell: { ...type.caption, fontFamily: fonts.regular, fontVariant: ['tabular-nums'], color: colors.ink, flex: 1, minWidth: 0 },
  headCell: { fontFamily: fonts.semibold },
  rowNo: { flex: 0, width: 44, color: colors.inkMuted },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  library: { gap: space.xs },
  libraryList: { gap: space.xxs },
  libraryItem: { flexDirection: 'row', alignItems: 'center', gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.xxs },
  libraryText: { flex: 1, minWidth: 0 },
});
