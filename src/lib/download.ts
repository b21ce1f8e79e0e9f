/** Saving a file the page made (a plot as PNG or SVG) through a temporary link. */

/** A file name from free text: letters, digits, dots and dashes only. */
export function safeFileName(text: string): string {
  const cleaned = text
    .normalize('NFKD')
    .replace(/[^\w.-]+/g, '-')
    .replace(/-+/g, '-')
    .replace(/^-|-$/g, '');
  return cleaned === '' ? 'plot' : cleaned;
}

/** Starts the browser's download of `href` (a data: or blob: URL) as `fileName`. */
export function downloadHref(href: string, fileName: string, doc: Document = document): void {
  const a = doc.createElement('a');
  a.href = href;
  a.download = fileName;
  a.rel = 'noopener';
  doc.body.appendChild(a);
  a.click();
  a.remove();
}

/** Downloads text (an SVG document) as a file. */
export function downloadText(text: string, mime: string, fileName: string): void {
  const url = URL.createObjectURL(new Blob([text], { type: mime }));
  downloadHref(url, fileName);
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
