import type { Evaluation } from '@/features/solver';
import type { RequirementsReport } from '@/features/requirements';
import type { Design } from '@/shared/design';

export type TradeStudyCardProps = {
  design: Design;
  evaluation: Evaluation;
  report: RequirementsReport;
  collapsedAtFirst: boolean;
};

/** Placeholder while the trade study is built (issue 16). */
export function TradeStudyCard(_props: TradeStudyCardProps) {
  return null;
}
