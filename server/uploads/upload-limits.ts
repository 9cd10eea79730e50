/** Largest CSV we accept: a dish catalogue or a climate file is a few KiB; 256 KiB leaves room and keeps a row-by-row report fast. */
export const MAX_UPLOAD_BYTES = 256 * 1024;
/** Data rows per file: far above any real catalogue or curve, low enough to keep a preview readable. */
export const MAX_UPLOAD_ROWS = 2000;
/** Row-level problems listed in a report; the rest are counted. */
export const MAX_REPORTED_PROBLEMS = 100;

function kib(bytes: number): string {
  return `${Math.ceil(bytes / 1024)} KiB`;
}

/**
 * Check an uploaded file's size and that it is UTF-8 text before parsing; returns the text or a
 * message a person can act on.
 */
export function readUploadText(bytes: Uint8Array, filename: string): { ok: true; text: string } | { ok: false; error: string } {
  if (bytes.byteLength === 0) return { ok: false, error: `"${filename}" is empty.` };
  if (bytes.byteLength > MAX_UPLOAD_BYTES) {
    return { ok: false, error: `"${filename}" is ${kib(bytes.byteLength)}; uploads are limited to ${kib(MAX_UPLOAD_BYTES)}. Split the file or remove unused columns.` };
  }
  if (bytes.includes(0)) return { ok: false, error: `"${filename}" is not a text CSV file (it contains binary data). Save it from your spreadsheet as CSV.` };
  try {
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(bytes) };
  } catch {
    return { ok: false, error: `"${filename}" is not UTF-8 text. Save it from your spreadsheet as "CSV UTF-8".` };
  }
}

export { kib as formatKib };
