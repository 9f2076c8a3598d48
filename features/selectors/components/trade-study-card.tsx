import { Link } from 'expo-router';
import { memo, useCallback, useDeferredValue, useMemo, useState } from 'react';
import { StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import { designFootprintMm } from '@/features/requirements';
import {
  DEFAULT_TRADE_STUDY_OPTIONS,
  PRISM_MATERIALS,
  TRADE_VERDICT_WORDS,
  resolveTradeStudyOptions,
  tradeStudy,
  tradeStudyOptionIssues,
  type SelectorStudy,
  type TradeStudy,
  type TradeVerdict,
  type TradeVerdictStatus,
} from '@/features/solver';
import { Card, DisclosureButton, RadioGroup, TextField, colors, fonts, minTouch, radius, space, type } from '@/features/ui';
import type { Design } from '@/shared/design';
import { formatNumber, formatQuantity } from '@/shared/format';
import { PRISM_MATERIAL_IDS, type PrismMaterialId } from '@/shared/selectors';
import { TradeStudyPlot } from '../trade-study-plot';
import { tradeFigureRows } from '../trade-study-table';

export type TradeStudyCardProps = {
  design: Design;
  collapsedAtFirst: boolean;
};

/**
 * Below this card width the figures are one card per selector; from it up, a table (tablet and the
 * wide layout's results column are both about 400 px inside the card; a phone about 320).
 */
const TABLE_MIN_WIDTH = 380;
/** The verdicts carry a sentence per selector: a table only where each column has room for one. */
const VERDICT_TABLE_MIN_WIDTH = 640;

/** The prism settings as typed: text, so a half-typed value survives until it reads. */
type PrismText = { material: PrismMaterialId; apexDeg: string; baseMm: string };

const MATERIAL_OPTIONS = PRISM_MATERIAL_IDS.map((id) => ({ value: id, label: PRISM_MATERIALS[id].label }));

/** A typed number, or the reason it is not one. Blank is `blank` (the default applies). */
function readNumber(text: string): number | 'blank' | 'not-a-number' {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return 'blank';
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : 'not-a-number';
}

/** The overrides the typed prism settings make, and each field's error in words. */
function prismOverrides(text: PrismText): {
  prism: { material: PrismMaterialId; apexDeg: number; baseMm: number | null };
  errors: { apexDeg: string | null; baseMm: string | null };
} {
  const apex = readNumber(text.apexDeg);
  const base = readNumber(text.baseMm);
  const errors = {
    apexDeg: apex === 'not-a-number' ? 'Apex angle: must be a number of degrees' : null,
    baseMm: base === 'not-a-number' ? 'Base: must be a number of mm, or blank for the grating’s width' : null,
  };
  const prism = {
    material: text.material,
    apexDeg: typeof apex === 'number' ? apex : DEFAULT_TRADE_STUDY_OPTIONS.prism.apexDeg,
    baseMm: typeof base === 'number' ? base : null,
  };
  const issues = tradeStudyOptionIssues(resolveTradeStudyOptions({ prism }));
  if (issues['prism.apexDeg']) {
    errors.apexDeg = `Apex angle: ${issues['prism.apexDeg']}`;
    prism.apexDeg = DEFAULT_TRADE_STUDY_OPTIONS.prism.apexDeg;
  }
  if (issues['prism.baseMm']) {
    errors.baseMm = `Base: ${issues['prism.baseMm']}`;
    prism.baseMm = null;
  }
  return { prism, errors };
}

const STATUS_STYLE: Record<TradeVerdictStatus, object> = {
  pass: { borderWidth: 1.5, borderColor: colors.ok },
  fail: { borderWidth: 1.5, borderColor: colors.danger, backgroundColor: colors.danger },
  'not-checked': { borderWidth: 1.5, borderStyle: 'dashed', borderColor: colors.inkMuted },
};

/** The verdict as a word in a shape (outline pass, solid fail, dashed not checked), as the requirements card shows it. */
function VerdictMark({ status }: { status: TradeVerdictStatus }) {
  return (
    <View style={[styles.mark, STATUS_STYLE[status]]}>
      <Text style={[styles.markText, status === 'fail' ? styles.markTextFail : null]}>{TRADE_VERDICT_WORDS[status]}</Text>
    </View>
  );
}

function VerdictCell({ verdict, testID }: { verdict: TradeVerdict; testID: string }) {
  return (
    <View style={styles.verdict} testID={testID} data-status={verdict.status}>
      <VerdictMark status={verdict.status} />
      <Text style={styles.small}>{verdict.message}</Text>
    </View>
  );
}

function FiguresTable({ study, width }: { study: TradeStudy; width: number }) {
  const rows = tradeFigureRows(study);
  const first = Math.round(width * 0.22);
  const rest = Math.floor((width - first) / study.selectors.length);
  return (
    <View role="table" aria-label="The four selectors side by side" testID="trade-study-table">
      <View role="row" style={[styles.tableRow, styles.headRow]}>
        <Text role="columnheader" style={[styles.head, { width: first }]}>
          Figure
        </Text>
        {study.selectors.map((s) => (
          <Text key={s.id} role="columnheader" style={[styles.head, { width: rest }]}>
            {s.label}
          </Text>
        ))}
      </View>
      {rows.map((row) => (
        <View key={row.id} role="row" style={styles.tableRow} testID={`trade-study-row-${row.id}`}>
          <Text role="rowheader" style={[styles.rowHead, { width: first }]}>
            {row.label}
          </Text>
          {study.selectors.map((s) => (
            <Text key={s.id} role="cell" style={[styles.cell, { width: rest }]}>
              {row.cells[s.id]}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

function FigureCards({ study }: { study: TradeStudy }) {
  const rows = tradeFigureRows(study);
  return (
    <View role="list" aria-label="The four selectors side by side" style={styles.cards} testID="trade-study-cards">
      {study.selectors.map((s) => (
        <View key={s.id} role="listitem" style={styles.selectorCard} testID={`trade-study-card-${s.id}`}>
          <Text role="heading" aria-level={3} style={styles.selectorTitle}>
            {s.label}
          </Text>
          {rows.map((row) => (
            <View key={row.id} style={styles.pair}>
              <Text style={styles.pairLabel}>{row.label}</Text>
              <Text style={styles.pairValue}>{row.cells[s.id]}</Text>
            </View>
          ))}
        </View>
      ))}
    </View>
  );
}

function Verdicts({ study, width }: { study: TradeStudy; width: number }) {
  const table = width >= VERDICT_TABLE_MIN_WIDTH;
  if (study.verdicts.length === 0) {
    return (
      <Text style={styles.note} testID="trade-study-no-requirements">
        {study.verdictNote}
      </Text>
    );
  }
  const first = Math.round(width * 0.2);
  const rest = Math.floor((width - first) / study.selectors.length);
  return (
    <>
      {table ? (
        <View role="table" aria-label="Verdict per requirement" testID="trade-study-verdicts">
          <View role="row" style={[styles.tableRow, styles.headRow]}>
            <Text role="columnheader" style={[styles.head, { width: first }]}>
              Requirement
            </Text>
            {study.selectors.map((s) => (
              <Text key={s.id} role="columnheader" style={[styles.head, { width: rest }]}>
                {s.label}
              </Text>
            ))}
          </View>
          {study.verdicts.map((row) => (
            <View key={row.id} role="row" style={styles.tableRow}>
              <Text role="rowheader" style={[styles.rowHead, { width: first }]}>
                {row.title} <Text style={styles.muted}>{row.limitText}</Text>
              </Text>
              {study.selectors.map((s) => (
                <View key={s.id} role="cell" style={[styles.verdictCell, { width: rest }]}>
                  <VerdictCell verdict={row.verdicts[s.id]} testID={`trade-verdict-${row.id}-${s.id}`} />
                </View>
              ))}
            </View>
          ))}
        </View>
      ) : (
        <View role="list" aria-label="Verdict per requirement" style={styles.cards} testID="trade-study-verdicts">
          {study.verdicts.map((row) => (
            <View key={row.id} role="listitem" style={styles.selectorCard}>
              <Text role="heading" aria-level={3} style={styles.selectorTitle}>
                {row.title} <Text style={styles.muted}>{row.limitText}</Text>
              </Text>
              {study.selectors.map((s) => (
                <View key={s.id} style={styles.verdictPair}>
                  <Text style={styles.verdictLabel}>{s.label}</Text>
                  <View style={styles.verdictBody}>
                    <VerdictCell verdict={row.verdicts[s.id]} testID={`trade-verdict-${row.id}-${s.id}`} />
                  </View>
                </View>
              ))}
            </View>
          ))}
        </View>
      )}
      <Text style={styles.note}>{study.verdictNote}</Text>
    </>
  );
}

/** Where each selector's figures come from, in words. */
function Basis({ selectors }: { selectors: readonly SelectorStudy[] }) {
  return (
    <View role="list" aria-label="How each selector was modelled" style={styles.basis}>
      {selectors.map((s) => (
        <View key={s.id} role="listitem" style={styles.basisItem}>
          <Text style={styles.small}>
            <Text style={styles.strong}>{s.label}. </Text>
            {s.setup} {s.tunability} {s.overlappingOrders}
          </Text>
          <Text style={styles.note}>Peak transmission: {s.peakTransmissionBasis}</Text>
          <Text style={styles.note}>Size: {s.size}</Text>
          {s.notes.map((note) => (
            <Text key={note} style={styles.note}>
              {note}
            </Text>
          ))}
        </View>
      ))}
    </View>
  );
}

const pickBandpass = (s: SelectorStudy) => s.bandpassNm;
const pickPower = (s: SelectorStudy) => s.resolvingPower;

/** The study, worked out only while the card is open: one solver sweep and three selector sweeps. */
function Body({ design }: { design: Design }) {
  const [width, setWidth] = useState(0);
  const onLayout = useCallback((event: LayoutChangeEvent) => {
    const next = Math.round(event.nativeEvent.layout.width);
    setWidth((current) => (Math.abs(current - next) >= 1 ? next : current));
  }, []);
  const [text, setText] = useState<PrismText>({
    material: DEFAULT_TRADE_STUDY_OPTIONS.prism.material as PrismMaterialId,
    apexDeg: String(DEFAULT_TRADE_STUDY_OPTIONS.prism.apexDeg),
    baseMm: '',
  });
  const { prism, errors } = useMemo(() => prismOverrides(text), [text]);
  // The outline comes from the sketch's geometry: drawn only when a footprint is asked for.
  const footprint = useMemo(
    () => (design.requirements?.maxFootprintMm ? designFootprintMm(design) : null),
    [design],
  );
  const study = useMemo(() => tradeStudy(design, { prism, gratingFootprintMm: footprint }), [design, prism, footprint]);
  const table = width >= TABLE_MIN_WIDTH;
  const plotWidth = Math.max(240, width);
  return (
    <View onLayout={onLayout} style={styles.body} testID="trade-study-body">
      <Text style={styles.lead}>
        This design’s grating beside a prism, an interference filter and coloured glass over{' '}
        {`${formatNumber(design.range.startNm)}–${formatQuantity(design.range.endNm, 'nm')}`}. Transmissions are
        estimates; each says what it counts.
      </Text>
      <View style={styles.settings} testID="trade-study-prism-settings">
        <Text role="heading" aria-level={3} style={styles.subheading}>
          The prism
        </Text>
        <RadioGroup
          label="Prism material"
          showLabel
          size="compact"
          options={MATERIAL_OPTIONS}
          value={text.material}
          onChange={(material) => setText((t) => ({ ...t, material }))}
          testID="trade-prism-material"
        />
        <View style={styles.fields}>
          <View style={styles.field}>
            <TextField
              label="Apex angle"
              unit="°"
              numeric
              inputMode="decimal"
              value={text.apexDeg}
              onChangeText={(apexDeg) => setText((t) => ({ ...t, apexDeg }))}
              error={errors.apexDeg}
              testID="trade-prism-apex"
            />
          </View>
          <View style={styles.field}>
            <TextField
              label="Base"
              unit="mm"
              numeric
              inputMode="decimal"
              value={text.baseMm}
              placeholder={String(design.grating.ruledWidthMm)}
              hint={text.baseMm.trim() === '' ? 'Blank: the grating’s ruled width' : null}
              onChangeText={(baseMm) => setText((t) => ({ ...t, baseMm }))}
              error={errors.baseMm}
              testID="trade-prism-base"
            />
          </View>
        </View>
      </View>
      {width > 0 ? (
        <>
          <TradeStudyPlot
            testID="trade-plot-resolving-power"
            title="Resolving power"
            noun="resolving power"
            unit=""
            axisTitle="R = λ/Δλ"
            width={plotWidth}
            wavelengthsNm={study.wavelengthsNm}
            selectors={study.selectors}
            pick={pickPower}
            caption="Grating and prism: slit bandpass and diffraction limit in quadrature (common practice). Filters: λ / FWHM."
          />
          <TradeStudyPlot
            testID="trade-plot-bandpass"
            title="Bandpass"
            noun="bandpass"
            unit="nm"
            axisTitle="FWHM, nm"
            width={plotWidth}
            wavelengthsNm={study.wavelengthsNm}
            selectors={study.selectors}
            pick={pickBandpass}
            caption="The prism’s bandpass grows toward the red: its dispersion, |dn/dλ|, falls steeply with wavelength."
          />
          {table ? <FiguresTable study={study} width={width} /> : <FigureCards study={study} />}
          <Text role="heading" aria-level={3} style={styles.subheading}>
            Against the requirements
          </Text>
          <Verdicts study={study} width={width} />
          <Text role="heading" aria-level={3} style={styles.subheading}>
            How each was modelled
          </Text>
          <Basis selectors={study.selectors} />
          <View role="list" aria-label="Defaults used" style={styles.basis}>
            {study.assumptions.map((line) => (
              <Text key={line} role="listitem" style={styles.note}>
                {line}
              </Text>
            ))}
          </View>
        </>
      ) : null}
    </View>
  );
}

/** The grating against the simpler selectors, for this design's range and requirements. */
export const TradeStudyCard = memo(function TradeStudyCard({ design, collapsedAtFirst }: TradeStudyCardProps) {
  const [open, setOpen] = useState(!collapsedAtFirst);
  // A solver sweep and three selector sweeps per design: they may trail the typing by a frame.
  const deferred = useDeferredValue(design);
  return (
    <Card title="Other wavelength selectors" testID="trade-study-card">
      <View style={styles.actions}>
        <DisclosureButton open={open} onToggle={() => setOpen((o) => !o)} what="the trade study" testID="trade-study-toggle" />
      </View>
      {open ? <Body design={deferred} /> : null}
      <Link href="/selectors" style={styles.link} testID="trade-study-calculators-link">
        Open the selector calculators
      </Link>
    </Card>
  );
});

const styles = StyleSheet.create({
  body: { gap: space.md },
  lead: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted },
  subheading: { ...type.small, fontFamily: fonts.semibold, color: colors.ink, marginTop: space.xs },
  settings: { gap: space.sm },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  field: { flexGrow: 1, flexBasis: 140 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  tableRow: { flexDirection: 'row', borderTopWidth: 1, borderTopColor: colors.line, paddingVertical: space.xs },
  headRow: { borderTopWidth: 0 },
  head: { ...type.caption, fontFamily: fonts.semibold, color: colors.inkMuted, paddingRight: space.xs },
  rowHead: { ...type.caption, fontFamily: fonts.semibold, color: colors.ink, paddingRight: space.xs },
  // Inter with tabular figures: the mono face's wider glyphs broke short cells mid-number at tablet width.
  cell: { ...type.caption, fontFamily: fonts.regular, fontVariant: ['tabular-nums'], color: colors.ink, paddingRight: space.xs },
  verdictCell: { paddingRight: space.xs },
  verdict: { gap: space.xxs, alignItems: 'flex-start' },
  mark: { minWidth: 64, alignItems: 'center', borderRadius: radius.sm, paddingHorizontal: space.xs, paddingVertical: space.xxs },
  markText: { ...type.caption, fontFamily: fonts.semibold, color: colors.ink },
  markTextFail: { color: colors.onPrimary },
  cards: { gap: space.sm },
  selectorCard: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.sm, gap: space.xs },
  selectorTitle: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  pair: { gap: space.xxs },
  pairLabel: { ...type.caption, fontFamily: fonts.regular, color: colors.inkMuted },
  verdictPair: { flexDirection: 'row', gap: space.sm, alignItems: 'flex-start' },
  verdictLabel: { ...type.caption, fontFamily: fonts.semibold, color: colors.ink, width: 96 },
  verdictBody: { flex: 1, minWidth: 0 },
  pairValue: { ...type.small, fontFamily: fonts.mono, color: colors.ink },
  small: { ...type.caption, fontFamily: fonts.regular, color: colors.ink },
  strong: { fontFamily: fonts.semibold },
  muted: { fontFamily: fonts.regular, color: colors.inkMuted },
  note: { ...type.caption, fontFamily: fonts.regular, color: colors.inkMuted },
  basis: { gap: space.xs },
  basisItem: { gap: space.xxs, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.xs },
  link: {
    ...type.small,
    fontFamily: fonts.semibold,
    color: colors.primary,
    textDecorationLine: 'underline',
    minHeight: minTouch,
    paddingVertical: space.sm,
  },
});
