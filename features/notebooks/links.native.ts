/** Native has no page origin; links are shown as paths on the server the app talks to. */
export function absoluteUrl(path: string): string {
  return path;
}
