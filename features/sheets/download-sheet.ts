/**
 * Web (and default): the browser saves the sheet as a download under its file name. Answers what
 * to tell the person afterwards.
 */
export async function downloadSheet(blob: Blob, fileName: string): Promise<string | null> {
  const url = URL.createObjectURL(blob);
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.rel = 'noopener';
    document.body.appendChild(link);
    link.click();
    link.remove();
    return `Downloaded ${fileName}.`;
  } finally {
    // Revoke after the click has been handled; revoking at once cancels the download in some browsers.
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }
}

/** Why this device cannot take a sheet, or null when it can (a browser always can). */
export async function sheetDownloadUnavailable(): Promise<string | null> {
  return null;
}
