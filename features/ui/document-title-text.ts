/** The name every tab title ends with, so a tab reads "where you are · Blazebook". */
export const productName = 'Blazebook';

/** "Workbench" → "Workbench · Blazebook": the browser tab, history and bookmarks say where you are. */
export function documentTitle(place: string): string {
  const trimmed = place.trim();
  return trimmed ? `${trimmed} · ${productName}` : productName;
}
