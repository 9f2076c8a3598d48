import type { LayoutKind } from '@/shared/design';
import { parseField } from './form-model';
import { fieldByPath, type FieldSpec } from './fields';

/**
 * The deviation angle a mount starts with when the user switches to it and has typed none for it
 * yet. Littrow must be 0 (the light returns along its own path). Two-mirror mounts of a few
 * hundred millimetres commonly run with a full deviation of about 20–30° (common practice, from
 * memory; our own demo designs use 24–28°): 24° keeps the mirrors clear of each other and the
 * grating's working angles moderate.
 */
export const DEFAULT_DEVIATION_DEG: Readonly<Record<LayoutKind, number>> = {
  littrow: 0,
  'czerny-turner': 24,
  'ebert-fastie': 24,
};

/** The last deviation typed for each mount, as typed ("30", "0.5 rad"). */
export type DeviationMemory = Readonly<Partial<Record<LayoutKind, string>>>;

const deviationField = fieldByPath.get('layout.deviationAngleDeg') as FieldSpec;

/**
 * Whether `text` is a deviation worth coming back to on `kind`: it reads, and on a two-mirror
 * mount it is not 0 — that is the degenerate case the switch exists to avoid (collimator and
 * camera on top of each other).
 */
function worthKeeping(kind: LayoutKind, text: string): boolean {
  if (kind === 'littrow') return false;
  const parsed = parseField(deviationField, text);
  return parsed.ok && parsed.value !== undefined && parsed.value > 0 && parsed.value < 180;
}

/** The memory with the deviation now shown for `kind` kept, when it is worth keeping. */
export function rememberDeviation(memory: DeviationMemory, kind: LayoutKind, text: string): DeviationMemory {
  return worthKeeping(kind, text) ? { ...memory, [kind]: text.trim() } : memory;
}

/**
 * Switching the mount from `from` (its deviation field reading `fromText`) to `to`: the deviation
 * the new mount starts with — the last one typed for it, else its default — and the memory with
 * the one being left behind kept.
 */
export function switchDeviation(
  memory: DeviationMemory,
  from: LayoutKind,
  fromText: string,
  to: LayoutKind,
): { memory: DeviationMemory; deviationText: string } {
  const kept = rememberDeviation(memory, from, fromText);
  if (to === 'littrow') return { memory: kept, deviationText: '0' };
  return { memory: kept, deviationText: kept[to] ?? String(DEFAULT_DEVIATION_DEG[to]) };
}
