/**
 * The trade study's figures as table rows of short cells, one per selector. Pure (no React): the
 * workbench card and the design sheet print the same words.
 */

import type { SelectorStudy, TradeSelectorId, TradeStudy } from '../solver/trade-study';
import { formatNumber, withUnit } from '../../shared/format';

export type TradeFigureId = 'bandpass' | 'resolving-power' | 'peak-transmission' | 'tuning' | 'overlaps' | 'size';

export interface TradeFigureRow {
  id: TradeFigureId;
  label: string;
  cells: Record<TradeSelectorId, string>;
}

/** "0.2662–0.2777 nm", or one value when the span is flat to the shown precision; "—" when none. */
export function spanText(span: readonly [number, number] | null, unit: string, significant: number): string {
  if (span === null) return '—';
  const [lo, hi] = span.map((v) => formatNumber(v, significant)) as [string, string];
  return withUnit(lo === hi ? lo : `${lo}–${hi}`, unit);
}

function cells(study: TradeStudy, cell: (s: SelectorStudy) => string): Record<TradeSelectorId, string> {
  return Object.fromEntries(study.selectors.map((s) => [s.id, cell(s)])) as Record<TradeSelectorId, string>;
}

/** Bandpass (4 figures) and R (3), as the read-out card shows the grating's. */
export function tradeFigureRows(study: TradeStudy): TradeFigureRow[] {
  return [
    { id: 'bandpass', label: 'Bandpass across the range', cells: cells(study, (s) => spanText(s.bandpassSpanNm, 'nm', 4)) },
    { id: 'resolving-power', label: 'Resolving power', cells: cells(study, (s) => spanText(s.resolvingPowerSpan, '', 3)) },
    { id: 'peak-transmission', label: 'Peak transmission (estimate)', cells: cells(study, (s) => s.brief.peak) },
    { id: 'tuning', label: 'Tuning across the range', cells: cells(study, (s) => s.brief.tuning) },
    { id: 'overlaps', label: 'Overlapping orders', cells: cells(study, (s) => s.brief.overlaps) },
    { id: 'size', label: 'Size', cells: cells(study, (s) => s.brief.size) },
  ];
}
