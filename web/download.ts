// Hands a text file to the browser as a download (CSV, JSON): no server involved.

/** Offers `text` as a file named `fileName` of the given media type. */
export function downloadText(fileName: string, text: string, type = 'text/csv'): void {
  const blob = new Blob([text], { type: `${type};charset=utf-8` });
  const link = document.createElement('a');
  link.href = URL.createObjectURL(blob);
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  setTimeout(() => URL.revokeObjectURL(link.href), 10_000);
}

/** A file-name stem from free text: letters and digits joined by hyphens, lower case. */
export function fileStem(text: string, fallback: string): string {
  return text.replace(/[^\p{L}\p{N}]+/gu, '-').replace(/^-|-$/g, '').toLowerCase() || fallback;
}
