import type { Evaluation } from '@/features/solver';
import type { Design } from '@/shared/design';
import type { OrderSortingFilter } from '@/shared/filters';

export type OrderSortingCardProps = {
  design: Design;
  evaluation: Evaluation;
  /** Replaces the design's filters (undefined: none); `text` says what changed, for the undo note. */
  onApplyFilters: (filters: OrderSortingFilter[] | undefined, text: string) => void;
  readOnly: boolean;
  dimmed: boolean;
};

/** Placeholder while the filter plan is built (issue 16). */
export function OrderSortingCard(_props: OrderSortingCardProps) {
  return null;
}
