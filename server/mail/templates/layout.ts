/** Escapes text for HTML bodies: names and company names come from users. */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c] as string);
}

/**
 * The HTML frame every FadeLedger message shares: a plain, narrow column that reads well in any
 * client, one teal button for the one thing to do, and the link spelled out below it.
 */
export type FrameContent = {
  heading: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  footnote?: string;
  /** The name at the top and in the signature: FadeLedger for our own mails, the company's for its customers. */
  brand?: string;
};

export function htmlFrame(opts: FrameContent): string {
  const p = (t: string) => `<p style="margin:0 0 14px;font-size:15px;line-height:1.5;color:#292524">${escapeHtml(t)}</p>`;
  const button = opts.action
    ? `<p style="margin:22px 0"><a href="${escapeHtml(opts.action.url)}" style="display:inline-block;background:#1b5955;color:#ffffff;text-decoration:none;padding:10px 18px;border-radius:4px;font-weight:600;font-size:15px">${escapeHtml(opts.action.label)}</a></p>
<p style="margin:0 0 14px;font-size:13px;line-height:1.5;color:#57534e">Or paste this address into your browser:<br><span style="word-break:break-all">${escapeHtml(opts.action.url)}</span></p>`
    : '';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(opts.heading)}</title></head>
<body style="margin:0;padding:0;background:#fafaf9;font-family:-apple-system,'Segoe UI',Helvetica,Arial,sans-serif">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0"><tr><td align="center" style="padding:28px 12px">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" style="max-width:560px;background:#ffffff;border:1px solid #e7e5e4;border-radius:6px">
<tr><td style="padding:22px 26px 6px;font-weight:700;font-size:16px;color:#1b5955">${escapeHtml(opts.brand ?? 'FadeLedger')}</td></tr>
<tr><td style="padding:6px 26px 20px">
<h1 style="margin:0 0 16px;font-size:20px;line-height:1.3;color:#1c1917">${escapeHtml(opts.heading)}</h1>
${opts.paragraphs.map(p).join('\n')}
${button}
${opts.footnote ? `<p style="margin:18px 0 0;font-size:12px;line-height:1.5;color:#78716c">${escapeHtml(opts.footnote)}</p>` : ''}
</td></tr></table></td></tr></table></body></html>`;
}

export function textFrame(opts: FrameContent): string {
  const parts = [opts.heading, '', ...opts.paragraphs.flatMap((p) => [p, ''])];
  if (opts.action) parts.push(`${opts.action.label}:`, opts.action.url, '');
  if (opts.footnote) parts.push(opts.footnote, '');
  parts.push('-- ', opts.brand ?? 'FadeLedger');
  return parts.join('\n');
}
