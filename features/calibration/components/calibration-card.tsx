import { Card } from '@/features/ui';
import type { Design } from '@/shared/design';

export type CalibrationCardProps = {
  design: Design;
  /** Phones open it on demand: the line lists are long. */
  collapsedAtFirst: boolean;
};

/** The lamp lines a design will see (being built: see calibration-lines.ts in the solver). */
export function CalibrationCard({ design: _design, collapsedAtFirst: _collapsed }: CalibrationCardProps) {
  return <Card title="Calibration lamp lines" testID="calibration-card">{null}</Card>;
}
