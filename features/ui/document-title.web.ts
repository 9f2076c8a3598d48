import { useEffect } from 'react';
import { documentTitle } from './document-title-text';

/**
 * Sets the browser tab's title while the calling screen is shown. Expo Router leaves
 * `document.title` alone (its own title tracking is off), so each screen names itself.
 */
export function useDocumentTitle(place: string): void {
  useEffect(() => {
    document.title = documentTitle(place);
  }, [place]);
}
