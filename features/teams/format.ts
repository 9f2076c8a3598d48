/** "14 Mar 2026": day first and the month in letters, so no reader mistakes 3/4 for 4/3. */
export function formatDay(iso: string): string {
  return new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric' });
}
