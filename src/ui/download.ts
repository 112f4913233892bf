// Saving a file the app made (a CSV table, a machines file) without any server: a Blob URL
// clicked through a temporary link, released straight after.

/** Offers `text` to the user as a file named `filename`. Returns false where the browser cannot. */
export function downloadText(
  filename: string,
  text: string,
  mime = 'text/plain;charset=utf-8',
): boolean {
  if (typeof document === 'undefined' || typeof URL.createObjectURL !== 'function') return false;
  const url = URL.createObjectURL(new Blob([text], { type: mime }));
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 0);
  return true;
}

/** A file-name-safe stem from a title and a date: "lighting-check-pellet-line-2026-12-02". */
export function fileStem(title: string, date = new Date()): string {
  const stem = title
    .toLowerCase()
    .normalize('NFKD')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 60);
  return `${stem || 'trueturn'}-${date.toISOString().slice(0, 10)}`;
}
