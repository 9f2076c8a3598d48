import type { Design } from '../../../shared/design';
import { formatInteger, formatNumber, formatPercent, formatQuantity } from '../../../shared/format';
import {
  FACTOR_WORDS,
  OVERFILL_BELOW,
  UNDERFILL_BELOW,
  evaluateDesign,
  type FillState,
  type InputFill,
  type LightBudget,
} from '../../../features/solver/index';
import { basisText } from '../../../features/light-budget/light-budget-words';
import { colors } from '../../../features/ui/theme';
import type { SheetContext } from '../context';
import { drawLinePlot, linePlotHeight, type PdfPlot } from '../plot-pdf';
import type { SheetSection } from '../section';
import { sheetColors, textSize, type TableColumn, type TableRow } from '../writer';

/**
 * The design sheet's light budget: how light gets in (the input, the slit's étendue against the
 * instrument's acceptance, how the input fills the grating at the range centre) and what each
 * element passes of it (the solver's throughput factors, their basis, and their product at the
 * start, centre and end of the range, with the lowest over the sweep). Every design gets it: the
 * scalar blaze estimate is always there, so the section never has nothing to say. A factor's
 * basis is worded as the workbench's light budget card words it (features/light-budget).
 */

const percent = (fraction: number | null | undefined) => formatPercent(fraction, { maximumFractionDigits: 1 });

/** The input in words, with the values it was given; "Not given: taken as matched" without one. */
export function inputText(input: Design['input']): string {
  if (!input) return 'Not given: taken as matched to the instrument (input coupling not counted)';
  switch (input.kind) {
    case 'fibre':
      return `Fibre: numerical aperture ${formatNumber(input.numericalAperture, 12)}, core diameter ${formatQuantity(input.coreDiameterUm, 'µm', 12)}`;
    case 'lens':
      return `Lens at f/${formatNumber(input.fNumber, 12)}`;
    case 'free-space':
      return input.fNumber === undefined
        ? 'Free space, cone not given: taken as matched to the instrument'
        : `Free space at f/${formatNumber(input.fNumber, 12)}`;
  }
}

const FILL_STATE_WORDS: Readonly<Record<FillState, string>> = {
  matched: 'Matched: the grating takes the input cone and the cone lights most of its width.',
  overfilled: `Over-filled: less than ${percent(OVERFILL_BELOW)} of the input cone lands on the grating; the rest is stray light inside the instrument.`,
  underfilled: `Under-filled: the input cone lights less than ${percent(UNDERFILL_BELOW)} of the grating width, so fewer grooves work and the diffraction limit on R drops.`,
  'assumed-matched': 'Taken as matched: no input cone is given, so the whole grating is taken as lit and none of the cone as lost.',
};

/** The fill at the range centre as key–value rows; the core's share only for a fibre, the only input it applies to. */
export function fillRows(fill: InputFill, input: Design['input']): [string, string][] {
  return [
    ['Input cone', fill.inputFNumber === null ? 'not given' : `f/${formatNumber(fill.inputFNumber, 3)}`],
    ['Share of the cone on the grating', percent(fill.pupilFraction)],
    ...(input?.kind === 'fibre' ? [['Fibre core through the slit', percent(fill.slitFraction)] as [string, string]] : []),
    ['Share of the grating width lit', percent(fill.litWidthFraction)],
    ['Grooves lit', formatInteger(Math.round(fill.litGrooves))],
    ['Resolving power they allow (|m| N)', formatInteger(Math.round(fill.litResolvingPower))],
  ];
}

/** Start, centre and end of the range: the three places the table reads each factor at. */
export function budgetPlaces(params: Design): { label: string; wavelengthNm: number }[] {
  const { startNm, endNm } = params.range;
  return [
    { label: 'start', wavelengthNm: startNm },
    { label: 'centre', wavelengthNm: (startNm + endNm) / 2 },
    { label: 'end', wavelengthNm: endNm },
  ];
}

/** The light budget evaluated exactly at the three places (not the nearest sweep point). */
export function budgetAtPlaces(params: Design): LightBudget {
  return evaluateDesign(params, { wavelengthsNm: budgetPlaces(params).map((p) => p.wavelengthNm) }).lightBudget;
}

const numeric = { align: 'right' as const };
const capitalised = (text: string) => `${text.charAt(0).toUpperCase()}${text.slice(1)}`;

export function factorColumns(params: Design): TableColumn[] {
  const places = budgetPlaces(params);
  return [
    { header: 'Factor', width: 0.24 },
    { header: 'Basis', width: 0.34 },
    ...places.map((p) => ({ header: `${p.label[0]!.toUpperCase()}${p.label.slice(1)}, ${formatQuantity(p.wavelengthNm, 'nm', 6)}`, width: 0.14, ...numeric })),
  ];
}

/** One row per factor, then the product; an unknown value reads "—", a factor not counted "not counted". */
export function factorRows(budget: LightBudget): TableRow[] {
  const rows: TableRow[] = budget.factors.map((factor) => ({
    cells: [
      capitalised(FACTOR_WORDS[factor.id]),
      basisText(factor),
      ...factor.values.map((v) => (factor.basis === 'not-counted' ? '—' : percent(v))),
    ],
  }));
  rows.push({ cells: ['Product', 'counted factors only', ...budget.throughput.map((v) => percent(v))], bold: true });
  return rows;
}

/** "Lowest: 3.1 % at 300 nm, over the 101 swept wavelengths." or why none is known. */
export function lowestText(light: LightBudget, sweptCount: number): string {
  if (!light.lowest) return 'Lowest: not known anywhere in the range (a counted factor has no value).';
  return `Lowest: ${percent(light.lowest.value)} at ${formatQuantity(light.lowest.wavelengthNm, 'nm', 6)}, over the ${formatInteger(sweptCount)} swept wavelengths.`;
}

/** Each measured curve that leaves part of the range without data, named with its spans. */
export function gapLines(light: LightBudget): string[] {
  return light.factors
    .filter((f) => f.basis === 'measured' && f.gapsNm.length > 0)
    .map((f) => {
      const spans = f.gapsNm.map((g) => (g.fromNm === g.toNm ? formatQuantity(g.fromNm, 'nm') : `${formatNumber(g.fromNm)}–${formatQuantity(g.toNm, 'nm')}`));
      return `${FACTOR_WORDS[f.id]} (${f.curveNames.map((name) => `“${name}”`).join(', ')}) has no data at ${spans.join(', ')}: the product is left unknown there, never extrapolated.`;
    });
}

/** The product across the sweep, with the grating's factor on the same axis. */
export function throughputPlot(evaluation: SheetContext['evaluation']): PdfPlot {
  const light = evaluation.lightBudget;
  const grating = light.factors.find((f) => f.id === 'grating');
  const xs = evaluation.points.map((p) => p.wavelengthNm);
  const fraction = { unit: '', domain: [0, 1] as [number, number], tickFormat: '.0%' };
  return {
    title: 'Relative throughput',
    wavelengthsNm: xs,
    series: { label: 'Product', axisTitle: 'product of the counted factors', values: light.throughput, color: colors.primary, ...fraction },
    ...(grating && grating.basis !== 'not-counted'
      ? {
          secondSeries: {
            label: 'Grating',
            axisTitle: 'grating efficiency',
            values: grating.values,
            color: colors.ok,
            dash: [4, 2] as [number, number],
            axis: 'shared' as const,
            ...fraction,
          },
        }
      : {}),
    emptyMessage: 'No factor is known here',
    caption: 'Solid: the product of the counted factors. Dashed: the grating’s factor alone. Every factor’s value is in the table above.',
  };
}

export const lightBudgetSection: SheetSection = {
  id: 'light-budget',
  title: 'Light budget',
  draw(writer, sheet) {
    const { params, evaluation } = sheet;
    const light = evaluation.lightBudget;
    const size = textSize.small;
    writer.sectionHeading(this.title, 120);
    writer.keyValues([
      ['Light input', inputText(params.input)],
      ['Entrance slit area', `${formatNumber(params.slits.entranceWidthUm, 12)} µm × ${formatNumber(params.slits.heightMm, 12)} mm = ${formatQuantity(light.slitAreaMm2, 'mm²')}`],
      [
        'Acceptance of the grating',
        light.acceptanceSolidAngleSr === null
          ? 'not known: the range centre is out of reach'
          : `${formatQuantity(light.acceptanceSolidAngleSr, 'sr')} (about f/${formatNumber(light.acceptanceFNumber, 3)})`,
      ],
      ['Étendue G = A · Ω', light.etendueMm2Sr === null ? 'not known' : formatQuantity(light.etendueMm2Sr, 'mm²·sr')],
    ]);

    writer.subheading('Fill at the range centre');
    if (light.fill) {
      writer.paragraph(FILL_STATE_WORDS[light.fill.state], { font: 'semibold', color: light.fill.state === 'matched' || light.fill.state === 'assumed-matched' ? sheetColors.ok : sheetColors.warning });
      writer.keyValues(fillRows(light.fill, params.input));
    } else {
      writer.paragraph('Not known: the mount cannot reach the range centre.', { color: sheetColors.muted });
    }

    writer.subheading('Throughput');
    const atPlaces = budgetAtPlaces(params);
    writer.table(factorColumns(params), factorRows(atPlaces), { size });
    writer.paragraph(lowestText(light, evaluation.points.length), { font: 'semibold' });
    for (const line of gapLines(light)) writer.paragraph(line, { color: sheetColors.warning });
    writer.paragraph(
      'Relative throughput: the product of what each counted element passes, read from measured curves with straight lines ' +
        'between their points and never past their ends; a factor with nothing to go on is not counted and left out of the product.',
      { size, color: sheetColors.muted },
    );
    const plot = throughputPlot(evaluation);
    const height = linePlotHeight(writer, plot, writer.contentWidth);
    const box = writer.box(height);
    drawLinePlot(writer, plot, { x: box.x, y: box.y, width: box.width });
  },
};
