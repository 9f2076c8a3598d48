/**
 * The links of a message as in-app paths. The outbox is for following them in this browser, and
 * the host in the mail may be `localhost` while this tab uses another name for the same server.
 */
export function appLinks(text: string): { label: string; path: string }[] {
  const found = text.match(/https?:\/\/[^\s<>"]+/g) ?? [];
  return found.flatMap((href) => {
    try {
      const url = new URL(href);
      return [{ label: href, path: `${url.pathname}${url.search}` }];
    } catch {
      return [];
    }
  });
}
