/**
 * Checks proxy.ts runs before Next.js parses a request, for requests Next itself would answer
 * with a 500 (its own handling: a dynamic segment that does not percent-decode throws a
 * DecodeError inside the route module; a server action whose Origin is foreign, whose body is
 * over serverActions.bodySizeLimit, or whose body React cannot decode throws inside the action
 * handler, which answers every such error 500). Pure functions over a Request.
 */
import { readBodyCapped } from './capped-body';

/** serverActions.bodySizeLimit in next.config.mjs: keep the two equal. */
export const ACTION_BODY_LIMIT_BYTES = 4 * 1024 * 1024;

export type Refusal = { status: 400 | 403 | 413; code: string; message: string };

/** A path segment that is not valid percent-encoded UTF-8 (`/share/%FF`, `/studies/%E0%A4%A`). */
export function badPercentEncoding(pathname: string): boolean {
  for (const segment of pathname.split('/')) {
    if (!segment.includes('%')) continue;
    try {
      decodeURIComponent(segment);
    } catch {
      return true;
    }
  }
  return false;
}

/**
 * A write from a page on another site. Browsers always send Origin on a cross-site POST, so
 * a present Origin must name one of our hosts; 'null' (sandboxed frames, privacy redirects) is
 * foreign too. No Origin at all is a script, not a browser carrying someone's cookie.
 */
export function foreignOrigin(origin: string | null, ourHosts: string[]): boolean {
  if (origin === null) return false;
  let host: string;
  try {
    host = new URL(origin).host;
  } catch {
    return true;
  }
  return !ourHosts.includes(host);
}

/** Looks like a server action: the fetch form (Next-Action header) or a no-JS form post (multipart). */
export function looksLikeAction(req: Request): boolean {
  if (req.headers.has('next-action')) return true;
  return (req.headers.get('content-type') ?? '').toLowerCase().startsWith('multipart/form-data');
}

/**
 * Reads an action body (at most the limit, streamed) and checks what React's decoder needs before
 * it runs: a multipart body that parses, or a text body that is JSON; for the fetch form, a root
 * argument list that is a JSON array whose references point at parts that exist. Anything else is
 * a malformed request (400), and a body over the limit is 413, announced or chunked.
 */
export async function checkActionBody(req: Request): Promise<Refusal | null> {
  const body = await readBodyCapped(req, ACTION_BODY_LIMIT_BYTES);
  if (!body.ok) return { status: 413, code: 'too_large', message: 'The request is larger than 4 MB.' };
  const type = (req.headers.get('content-type') ?? '').toLowerCase();
  const isFetchAction = req.headers.has('next-action');
  const malformed: Refusal = { status: 400, code: 'malformed', message: 'The request could not be read.' };

  if (isFetchAction && !/^[0-9a-f]{2,128}$/i.test(req.headers.get('next-action') ?? '')) return malformed;

  if (type.startsWith('multipart/form-data')) {
    let form: FormData;
    try {
      form = await new Response(body.bytes as BodyInit, { headers: { 'content-type': req.headers.get('content-type') ?? '' } }).formData();
    } catch {
      return malformed;
    }
    if (!isFetchAction) return null; // a no-JS form post: Next checks its $ACTION fields itself
    const root = form.get('0');
    if (typeof root !== 'string') return malformed;
    return replyIsWellFormed(root, new Set(form.keys())) ? null : malformed;
  }
  if (!isFetchAction) return null; // not an action after all: Next renders the page
  return replyIsWellFormed(body.text, null) ? null : malformed;
}

// React's reply encoding: a string starting with "$" is a reference or a special value. These
// stand alone; every other "$x…" names another part of the body by its hex id.
const SELF_CONTAINED = new Set(['$', 'D', 'n', 'I', '-', 'N', 'u', 'T', 'H', 'K']);

/**
 * The root of a fetch action's body is the argument list: a JSON array. References to other parts
 * (maps, sets, outlined objects, promises, blobs…) must name parts that were sent; a text body has
 * no other parts. `$K<id>` (a FormData argument) gathers fields named `<id>_…` and needs none.
 */
function replyIsWellFormed(rootJson: string, parts: Set<string> | null): boolean {
  let root: unknown;
  try {
    root = JSON.parse(rootJson);
  } catch {
    return false;
  }
  // Next refuses more than 1 000 arguments, React arrays beyond a million slots and BigInts
  // beyond 300 digits, each by throwing (a 500): refuse them here instead.
  if (!Array.isArray(root) || root.length > 1000) return false;
  const stack: unknown[] = [root];
  let seen = 0;
  let slots = 0;
  while (stack.length) {
    const v = stack.pop();
    if (++seen > 100_000) return false;
    if (Array.isArray(v) && (slots += v.length) > 1_000_000) return false;
    if (typeof v === 'string') {
      if (v[0] !== '$' || v.length < 2) continue;
      const tag = v[1];
      if (tag === 'n' && !/^-?\d{1,300}$/.test(v.slice(2))) return false;
      if (tag === '$' && (slots += v.length) > 1_000_000) return false;
      if (SELF_CONTAINED.has(tag)) continue;
      const id = /^[0-9a-f]/i.test(tag) ? v.slice(1) : v.slice(2);
      const hex = id.split(':')[0];
      if (!/^[0-9a-f]+$/i.test(hex)) return false;
      if (!parts || !parts.has(String(parseInt(hex, 16)))) return false;
    } else if (v && typeof v === 'object') {
      stack.push(...Object.values(v));
    }
  }
  return true;
}
