/**
 * The Content-Disposition value for handing a kept upload back to its company: always an
 * attachment (never rendered inline), an ASCII `filename` any browser accepts, and an RFC 6266 /
 * RFC 5987 `filename*` carrying the original name's non-ASCII letters. Path parts, quotes,
 * control characters and header-breaking characters never pass through.
 *
 * @example
 *   attachmentDisposition('../../etc/Régions "2026".csv', 7)
 *   // → `attachment; filename="R_gions_2026_.csv"; filename*=UTF-8''R%C3%A9gions%202026.csv`
 */
export function attachmentDisposition(originalFilename: string, uploadId: number): string {
  const base = baseName(originalFilename);
  const ascii = asciiName(base) || `upload-${uploadId}.csv`;
  const tidy = base.replace(/["\\]/g, '').replace(/\s+/g, ' ').replace(/^[.\s]+/, '').trim().slice(0, 120);
  const unicode = /[^._\s-]/.test(tidy) ? withExtension(tidy) : ascii;
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeRfc5987(unicode)}`;
}

/** The last path part, without control characters (C0, DEL, C1) or bidi overrides. */
function baseName(name: string): string {
  const last = name.split(/[\\/]/).pop() ?? '';
  return last.replace(/[\u0000-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/g, '').trim();
}

/** Letters, digits, dot, dash and underscore only; no leading dots (hidden files); at most 100 characters. */
function asciiName(base: string): string {
  const cleaned = base
    .replace(/[^A-Za-z0-9._-]+/g, '_')
    .replace(/_+/g, '_')
    .replace(/^[._]+/, '')
    .slice(0, 100);
  if (!cleaned || /^[._-]*$/.test(cleaned)) return '';
  return withExtension(cleaned);
}

function withExtension(name: string): string {
  return /\.[\p{L}\p{N}]{1,5}$/u.test(name) ? name : `${name}.csv`;
}

function encodeRfc5987(value: string): string {
  return encodeURIComponent(value).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
}
