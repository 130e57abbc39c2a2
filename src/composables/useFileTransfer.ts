/**
 * Moving files between the browser and the user's disk without a library: save text the
 * server produced as a download, and read a chosen file as text for an import.
 */

/** Saves a blob as a download under the given name. */
export function saveBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  // Revoke well after the click has been handled, or some browsers cancel the download.
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/** Offers text as a file download under the given name. */
export function downloadText(text: string, fileName: string, mime = 'application/json'): void {
  saveBlob(new Blob([text], { type: mime }), fileName);
}

/** Reads a chosen file as UTF-8 text. */
export function readFileText(file: File): Promise<string> {
  return file.text();
}

/** A JSON file's content, or a plain message saying why it is not JSON (so nothing is sent). */
export function parseJsonFile(text: string): { ok: true; value: unknown } | { ok: false; message: string } {
  try {
    return { ok: true, value: JSON.parse(text) };
  } catch {
    // The parser's own words (positions, tokens) mean nothing to someone choosing a file.
    return {
      ok: false,
      message: 'This is not a Waymark board file: it could not be read. Export one from a board (More → Export board file) and import that.',
    };
  }
}
