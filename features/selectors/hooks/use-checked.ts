import { useEffect, useMemo, useState } from 'react';
import { loadUnitParser, unitParserReady } from '@/features/solver';
import type { FormCheck } from '../form-check';

/**
 * A calculator's checked input and the last one that passed: while a field is refused the last
 * results stay on screen (dimmed by the caller). Text with units waits for the unit parser, then
 * is read again.
 */
export function useChecked<T, I>(text: T, check: (text: T) => FormCheck<I>): { current: FormCheck<I>; lastGood: I | null } {
  const [parserReady, setParserReady] = useState(unitParserReady);
  // Once the parser has loaded the same text reads differently: its readiness is part of the key.
  const current = useMemo(() => (parserReady ? check(text) : check(text)), [text, check, parserReady]);
  const pending = !current.ok && current.pending;
  useEffect(() => {
    if (!pending || parserReady) return;
    let live = true;
    void loadUnitParser().then(() => {
      if (live) setParserReady(true);
    });
    return () => {
      live = false;
    };
  }, [pending, parserReady]);
  // Kept from an earlier render (React's "storing information from previous renders").
  const [kept, setKept] = useState<I | null>(null);
  if (current.ok && current.input !== kept) setKept(current.input);
  return { current, lastGood: current.ok ? current.input : kept };
}
