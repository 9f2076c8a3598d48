/** Web (and default): hand the document to the browser as a download. */
export async function saveSvgFile(svg: string, fileName: string): Promise<boolean> {
  const url = URL.createObjectURL(new Blob([svg], { type: 'image/svg+xml' }));
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
