/**
 * The few answers proxy.ts gives itself, before any page renders: a short HTML page for people,
 * a JSON error (the API's `{ error: { code, message } }` shape) for /api. No script, no inline
 * style: they pass the strictest CSP as they are.
 */

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

export function plainPage(title: string, lines: string[], opts: { refreshSeconds?: number } = {}): string {
  return [
    '<!doctype html><html lang="en"><head><meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    '<meta name="robots" content="noindex">',
    opts.refreshSeconds ? `<meta http-equiv="refresh" content="${opts.refreshSeconds}">` : '',
    `<title>${escape(title)} · FadeLedger</title></head>`,
    '<body><main>',
    `<h1>${escape(title)}</h1>`,
    ...lines.map((l) => `<p>${escape(l)}</p>`),
    '<p><a href="/">FadeLedger home</a></p>',
    '</main></body></html>',
  ].join('');
}

export const UNAVAILABLE_TITLE = 'FadeLedger is briefly unavailable';

/** The friendly page while the database cannot be reached; it reloads itself. */
export function unavailablePage(retryAfterSeconds: number): string {
  return plainPage(
    UNAVAILABLE_TITLE,
    [
      'Our database is not answering right now, so we cannot show this page. Nothing you saved is lost.',
      `This page tries again by itself in ${retryAfterSeconds} seconds.`,
    ],
    { refreshSeconds: retryAfterSeconds },
  );
}
