// Shared frame for the fake's hosted pages: plain, our own look, clearly marked as test mode.
const ZERO_DECIMAL = new Set(['bif', 'clp', 'djf', 'gnf', 'jpy', 'kmf', 'krw', 'mga', 'pyg', 'rwf', 'ugx', 'vnd', 'vuv', 'xaf', 'xof', 'xpf']);

export function escapeHtml(value: unknown): string {
  return String(value)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

/** Minor units to a display amount, e.g. 4900 eur → "EUR 49.00". */
export function money(amount: number, currency: string): string {
  const zero = ZERO_DECIMAL.has(currency.toLowerCase());
  const value = zero ? String(amount) : (amount / 100).toFixed(2);
  return `${currency.toUpperCase()} ${value}`;
}

export function day(unixSeconds: number): string {
  return new Date(unixSeconds * 1000).toISOString().slice(0, 10);
}

export function intervalLabel(interval: string, count: number): string {
  return count === 1 ? `/ ${interval}` : `every ${count} ${interval}s`;
}

const STYLE = `
  :root { color-scheme: light; --ink:#1d2733; --muted:#5b6675; --line:#d5dbe3; --accent:#0f6b5c; --bad:#a3261b; }
  * { box-sizing: border-box; }
  body { margin:0; font: 16px/1.5 system-ui, sans-serif; color:var(--ink); background:#f3f5f8; }
  .test-band { background:#fff4cc; border-bottom:1px solid #e6d48a; padding:.4rem 1rem; font-size:.85rem; text-align:center; }
  main { max-width: 40rem; margin: 2rem auto; padding: 0 1rem; }
  .card { background:#fff; border:1px solid var(--line); border-radius:6px; padding:1.25rem 1.5rem; margin-bottom:1rem; }
  h1 { font-size:1.4rem; margin:0 0 1rem; }
  h2 { font-size:1.1rem; margin:0 0 .5rem; }
  table { width:100%; border-collapse:collapse; }
  td, th { padding:.35rem 0; border-bottom:1px solid var(--line); text-align:left; vertical-align:top; }
  td.num, th.num { text-align:right; font-variant-numeric: tabular-nums; }
  .muted { color:var(--muted); font-size:.9rem; }
  .notice { border-left:4px solid var(--accent); background:#e8f4f1; padding:.6rem .9rem; margin-bottom:1rem; }
  .error { border-left:4px solid var(--bad); background:#fbeceb; padding:.6rem .9rem; margin-bottom:1rem; }
  form { margin:.75rem 0 0; }
  label { display:block; font-size:.9rem; margin-bottom:.25rem; }
  input, select { font:inherit; padding:.45rem .55rem; border:1px solid var(--line); border-radius:4px; width:100%; }
  button { font:inherit; padding:.55rem 1rem; border-radius:4px; border:1px solid var(--accent); background:var(--accent); color:#fff; cursor:pointer; width:100%; }
  button.secondary { background:#fff; color:var(--ink); border-color:var(--line); }
  button.danger { background:#fff; color:var(--bad); border-color:var(--bad); }
  .row { display:flex; gap:.75rem; align-items:flex-end; }
  .row > * { flex:1; }
  a { color:var(--accent); }
`;

export function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<div class="test-band" role="note">Test mode — local payments fake. No real card is charged.</div>
<main>
${body}
</main>
</body>
</html>`;
}
