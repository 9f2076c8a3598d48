/** Web (and default): hand the text to the browser as a file download. */
export async function saveTextFile(
  text: string,
  fileName: string,
  mimeType = 'application/json',
): Promise<boolean> {
  downloadBlob(new Blob([text], { type: mimeType }), fileName);
  return true;
}

/** Web: the browser saves `blob` as a download named `fileName`. */
export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.rel = 'noopener';
    document.body.appendChild(link);
    link.click();
    link.remove();
  } finally {
    // Revoke after the click has been handled; revoking at once cancels the download in some browsers.
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }
}
