// Save a file from the browser: a Blob (or text) under a file name, through a temporary link.

/** Offer `data` as a download named `fileName`. */
export function downloadBlob(data: Blob, fileName: string): void {
  const url = URL.createObjectURL(data);
  const a = document.createElement('a');
  a.href = url;
  a.download = fileName;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // the click starts the download synchronously in every current browser; free the URL after it
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

export function downloadText(text: string, fileName: string, mime: string): void {
  downloadBlob(new Blob([text], { type: `${mime};charset=utf-8` }), fileName);
}

export function downloadDataUrl(dataUrl: string, fileName: string): void {
  const a = document.createElement('a');
  a.href = dataUrl;
  a.download = fileName;
  document.body.appendChild(a);
  a.click();
  a.remove();
}

/** A file-name stem from a sheet title: "12 V battery monitor tap" → "12-v-battery-monitor-tap". */
export function fileStem(title: string | undefined, fallback = 'tapline-sheet'): string {
  const s = (title ?? '')
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^\w\s-]/g, '')
    .trim()
    .replace(/[\s_]+/g, '-')
    .replace(/-+/g, '-')
    .slice(0, 60);
  return s || fallback;
}
