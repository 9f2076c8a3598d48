import { useEffect, useEffectEvent, useState } from 'react';

const SETTLE_MS = 250;

/**
 * The search box's text: typed freely, and handed to `onSettled` (trimmed, empty as undefined)
 * once typing pauses, so the list is not asked again on every key. A different `q` from outside
 * (a link) replaces the text; the echo of our own write does not, so typing on is never lost.
 */
export function useSearchText(
  q: string | undefined,
  onSettled: (q: string | undefined) => void,
): [string, (text: string) => void] {
  const [text, setText] = useState(q ?? '');
  const [seen, setSeen] = useState(q);
  const [written, setWritten] = useState(q);
  if (q !== seen) {
    setSeen(q);
    if (q !== written) setText(q ?? '');
  }
  const settle = useEffectEvent((typed: string) => {
    const next = typed.trim() || undefined;
    if (next === q) return;
    setWritten(next);
    onSettled(next);
  });
  useEffect(() => {
    const timer = setTimeout(() => settle(text), SETTLE_MS);
    return () => clearTimeout(timer);
  }, [text]);
  return [text, setText];
}
