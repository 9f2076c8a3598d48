import { formatStoredValue } from '@/shared/design-values';
import { formatDay } from '@/shared/format';
import type { Carry, Thread } from '@/shared/reviews';

/** A stored field value as the editor shows it (shared with the design sheet). */
export const formatPinnedValue = formatStoredValue;

/**
 * How a thread of an earlier version reads here: "Still applies (from v2)", "Field changed since
 * v2 (was 100 µm, now 60 µm)", "Design changed since v2 (3 fields)"; null for this version's own.
 */
export function carryLine(thread: Pick<Thread, 'pin'> & { carry: Carry }): string | null {
  const { carry, pin } = thread;
  switch (carry.state) {
    case 'here':
      return null;
    case 'still-applies':
      return `Still applies (from v${carry.since})`;
    case 'field-changed': {
      const path = pin.kind === 'field' ? pin.path : '';
      return `Field changed since v${carry.since} (was ${formatPinnedValue(path, carry.was)}, now ${formatPinnedValue(path, carry.now)})`;
    }
    case 'design-changed':
      return `Design changed since v${carry.since} (${carry.paths.length} ${carry.paths.length === 1 ? 'field' : 'fields'})`;
  }
}

/** "Resolved by Tobiah Rennick on 2 Dec 2026". */
export function resolvedLine(thread: Pick<Thread, 'resolvedBy' | 'resolvedAt'>): string {
  const who = thread.resolvedBy?.displayName ?? 'a former member';
  return thread.resolvedAt ? `Resolved by ${who} on ${formatDay(thread.resolvedAt)}` : `Resolved by ${who}`;
}
