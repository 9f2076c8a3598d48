/** Native: a touch keyboard has no arrow keys; the − and + buttons step the value. */
export function stepKeyProps(_onStep: (direction: 1 | -1, times: number) => boolean): Record<string, never> {
  return {};
}
