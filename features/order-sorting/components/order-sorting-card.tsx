import { memo, type ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import type { Evaluation } from '@/features/solver';
import { Button, Card, colors, fonts, radius, space, type } from '@/features/ui';
import type { Design } from '@/shared/design';
import { MAX_DESIGN_FILTERS, type OrderSortingFilter } from '@/shared/filters';
import { formatNumber, formatQuantity } from '@/shared/format';
import {
  cutsInText,
  filterFacts,
  filterLine,
  inBeamText,
  noFilterNeededText,
  overlapPossible,
  sameFilters,
  unblockedSpanNm,
  unblockedWords,
} from '../filter-plan';

export type OrderSortingCardProps = {
  design: Design;
  evaluation: Evaluation;
  /** Replaces the design's filters (undefined: none); `text` says what changed, for the undo note. */
  onApplyFilters: (filters: OrderSortingFilter[] | undefined, text: string) => void;
  readOnly: boolean;
  dimmed: boolean;
  /**
   * The editor's typed rows: how many there are, and each row's fields (the workbench binds them
   * to its form, so refused text stays with its message). Without it the card lists the design's
   * filters as text.
   */
  rows?: { count: number; fields: (index: number) => ReactNode } | null;
  /** Adds a typed row (the next filter of the proposed plan, or a blank one). */
  onAddFilter?: () => void;
  /** Removes a typed row; the workbench offers the undo. */
  onRemoveFilter?: (index: number) => void;
  /** After a plan was used or a filter removed: put the filters back. */
  undo?: { text: string; onUndo: () => void } | null;
};

/** The overlap count as a word in a shape, as the requirements card marks pass and fail: readable in grey. */
function CountMark({ count }: { count: number }) {
  return (
    <View style={[styles.mark, count > 0 ? styles.markOpen : styles.markDone]} testID="order-sorting-count" data-count={String(count)}>
      <Text style={[styles.markText, count > 0 ? styles.markTextOpen : null]}>{unblockedWords(count)}</Text>
    </View>
  );
}

function FilterItem({
  index,
  filter,
  range,
  fields,
  onRemove,
}: {
  index: number;
  filter: OrderSortingFilter | undefined;
  range: Design['range'];
  fields: ReactNode;
  onRemove: (() => void) | null;
}) {
  const facts = filter ? filterFacts(filter, range) : null;
  const cuts = facts ? cutsInText(facts) : null;
  const name = `Filter ${index + 1}`;
  return (
    <View style={styles.item} role="listitem" aria-label={name} testID={`order-sorting-filter-${index}`}>
      <View style={styles.itemHead}>
        <Text style={styles.itemTitle} role="heading" aria-level={3}>
          {name}
          {filter ? ` · cut-on ${formatQuantity(filter.cutOnNm, 'nm', 6)}` : ''}
        </Text>
        {onRemove ? (
          <Button kind="quiet" label="Remove" accessibilityLabel={`Remove ${name.toLowerCase()}`} onPress={onRemove} testID={`order-sorting-remove-${index}`} />
        ) : null}
      </View>
      {filter && facts ? (
        <Text style={styles.line} testID={`order-sorting-in-beam-${index}`}>
          {inBeamText(facts, range)}
          {fields ? '' : ` · ${filterLine(filter)}`}
        </Text>
      ) : (
        <Text style={styles.muted}>Not read yet: fix the fields below to see where it is in the beam.</Text>
      )}
      {cuts ? (
        <Text style={styles.caution} testID={`order-sorting-cuts-in-${index}`}>
          ⚠ {cuts}
        </Text>
      ) : null}
      {fields}
    </View>
  );
}

/**
 * The order-sorting filter plan beside the warnings: the design's long-pass filters, where each
 * is in the beam and whether it cuts into the working wavelength; how many overlaps they leave
 * unblocked; and the solver's proposed plan, used in one press with an undo.
 */
export const OrderSortingCard = memo(function OrderSortingCard({
  design,
  evaluation,
  onApplyFilters,
  readOnly,
  dimmed,
  rows = null,
  onAddFilter,
  onRemoveFilter,
  undo = null,
}: OrderSortingCardProps) {
  const { orderSorting } = evaluation;
  const filters = design.filters ?? [];
  const count = rows ? rows.count : filters.length;
  const possible = overlapPossible(evaluation);
  const plan = orderSorting.proposedFilters;
  const usesPlan = plan.length > 0 && sameFilters(filters, plan);
  const span = unblockedSpanNm(evaluation);
  const undoRow = undo ? (
    <View style={styles.undo}>
      <Text style={styles.line}>{undo.text}</Text>
      <Button kind="secondary" label="Undo" onPress={undo.onUndo} testID="order-sorting-undo" />
    </View>
  ) : null;

  if (!possible && count === 0) {
    return (
      <Card title="Order-sorting filters" testID="order-sorting-card">
        <Text style={styles.line} testID="order-sorting-none-needed">
          {noFilterNeededText(design)}
        </Text>
        {undoRow}
      </Card>
    );
  }

  return (
    <Card title="Order-sorting filters" testID="order-sorting-card">
      <View style={[styles.stack, dimmed ? styles.dimmed : null]}>
        <View style={styles.summary}>
          <CountMark count={orderSorting.unblockedOverlaps} />
          <Text style={styles.line} testID="order-sorting-summary">
            {orderSorting.unblockedOverlaps > 0 && span
              ? `Other orders reach the exit slit unblocked between ${formatNumber(span.fromNm)} and ${formatQuantity(span.toNm, 'nm')} ` +
                `(wavelength × order pairs over the ${formatNumber(evaluation.points.length)} plotted wavelengths).`
              : possible && count > 0
                ? 'The filters block every overlapping order across the range.'
                : 'No order overlaps inside the range.'}
          </Text>
        </View>
        {!possible ? (
          <Text style={styles.line} testID="order-sorting-none-needed">
            {noFilterNeededText(design)}
          </Text>
        ) : null}
        {count > 0 ? (
          <View role="list" style={styles.list} aria-label="The design's filters">
            {Array.from({ length: count }, (_, index) => (
              <FilterItem
                key={index}
                index={index}
                filter={filters[index]}
                range={design.range}
                fields={rows && !readOnly ? rows.fields(index) : null}
                onRemove={!readOnly && onRemoveFilter ? () => onRemoveFilter(index) : null}
              />
            ))}
          </View>
        ) : (
          <Text style={styles.muted}>The design has no filters yet.</Text>
        )}
        {!readOnly && onAddFilter && count < MAX_DESIGN_FILTERS ? (
          <View style={styles.actions}>
            <Button kind="secondary" label="Add a filter" onPress={onAddFilter} testID="order-sorting-add" />
          </View>
        ) : null}
      </View>
      {plan.length > 0 && !usesPlan ? (
        <View style={styles.plan} testID="order-sorting-plan">
          <Text style={styles.planTitle}>
            Proposed plan: {plan.length} long-pass filter{plan.length === 1 ? '' : 's'}, {unblockedWords(orderSorting.proposedUnblockedOverlaps)}
          </Text>
          <View role="list" style={styles.list}>
            {plan.map((filter, index) => (
              <Text key={index} role="listitem" style={styles.line}>
                {index + 1}. {filterLine(filter)}
              </Text>
            ))}
          </View>
          <Text style={styles.muted}>
            Each cut-on lies above the shortest wavelength the next order could bring in, and each filter goes in before
            its overlap starts (common practice).
          </Text>
          {!readOnly ? (
            <View style={styles.actions}>
              <Button
                label="Use this plan"
                accessibilityLabel={`Use this plan: ${plan.length} long-pass filter${plan.length === 1 ? '' : 's'}`}
                onPress={() => onApplyFilters(plan, `Used the proposed plan (${plan.length} filter${plan.length === 1 ? '' : 's'}).`)}
                testID="order-sorting-use-plan"
              />
            </View>
          ) : null}
        </View>
      ) : usesPlan ? (
        <Text style={styles.muted} testID="order-sorting-uses-plan">
          These are the proposed plan&apos;s filters.
        </Text>
      ) : null}
      {undoRow}
    </Card>
  );
});

const styles = StyleSheet.create({
  stack: { gap: space.md },
  dimmed: { opacity: 0.45 },
  summary: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm, flexWrap: 'wrap' },
  line: { ...type.small, fontFamily: fonts.regular, color: colors.ink, flexShrink: 1 },
  muted: { ...type.small, fontFamily: fonts.regular, color: colors.inkMuted },
  caution: { ...type.small, fontFamily: fonts.semibold, color: colors.warning },
  list: { gap: space.sm },
  item: { gap: space.xs, borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, padding: space.sm },
  itemHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm, flexWrap: 'wrap' },
  itemTitle: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  mark: { borderRadius: radius.sm, paddingHorizontal: space.xs, paddingVertical: space.xxs },
  markOpen: { borderWidth: 1.5, borderColor: colors.danger, backgroundColor: colors.danger },
  markDone: { borderWidth: 1.5, borderColor: colors.ok },
  markText: { ...type.caption, fontFamily: fonts.semibold, color: colors.ink },
  markTextOpen: { color: colors.onPrimary },
  plan: { gap: space.sm, borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md },
  planTitle: { ...type.small, fontFamily: fonts.semibold, color: colors.ink },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  undo: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
});
