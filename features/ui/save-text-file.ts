/** Web (and default): hand the text to the browser as a file download. */
export async function saveTextFile(
  text: string,
  fileName: string,
  mimeType = 'application/json',
): Promise<boolean> {
  const url = URL.createObjectURL(new Blob([text], { type: mimeType }));
  try {
    const link = document.createElement('a');
    link.href = url;
    link.download = fileName;
    link.rel = 'noopener';
    document.body.appendChild(link);
    link.click();
    link.remove();
    return true;
  } finally {
    // Revoke after the click has been handled; revoking at once cancels the download in some browsers.
    setTimeout(() => URL.revokeObjectURL(url), 1000);
  }
}
