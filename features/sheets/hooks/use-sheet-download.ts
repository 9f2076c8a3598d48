import { useMutation } from '@tanstack/react-query';
import type { Paper } from '@/shared/sheets';
import { downloadSheet, sheetDownloadUnavailable } from '../download-sheet';
import { fetchSheet, type SheetTarget } from '../sheet-target';

/**
 * Fetches the target's sheet and saves it (web: a download; native: the share sheet). `data` is
 * what to tell the person afterwards (null: nothing), `error` the server's message.
 */
export function useSheetDownloadMutation(target: SheetTarget) {
  return useMutation({
    mutationFn: async (paper: Paper): Promise<string | null> => {
      // Asked first, so a device that cannot take the file does not wait for one.
      const unavailable = await sheetDownloadUnavailable();
      if (unavailable) throw new Error(unavailable);
      const file = await fetchSheet(target, paper);
      return downloadSheet(file.blob, file.fileName);
    },
  });
}
