// The app's own scheme eggline://app/… serving the built renderer from dist/renderer, instead of file://.
import { promises as fs } from 'node:fs';
import { extname, join, resolve, sep } from 'node:path';
import { APP_HOST, APP_SCHEME } from './ipc';
import { CONTENT_SECURITY_POLICY } from './security';

/** The only file types served, by extension. */
export const MIME_TYPES: Readonly<Record<string, string>> = Object.freeze({
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
});

/** Where a request maps to, or why it is refused (HTTP status). */
export type ResolvedRequest = { readonly ok: true; readonly filePath: string; readonly mime: string } | { readonly ok: false; readonly status: 400 | 403 | 404 };

/** Map an eggline://app/… URL to a file under `rootDir`; refuses other hosts, `..`, odd characters and unknown types. */
export function resolveAppRequest(url: string, rootDir: string): ResolvedRequest {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return { ok: false, status: 400 };
  }
  if (parsed.protocol !== `${APP_SCHEME}:` || parsed.host !== APP_HOST) return { ok: false, status: 403 };
  let path: string;
  try {
    path = decodeURIComponent(parsed.pathname);
  } catch {
    return { ok: false, status: 400 };
  }
  // URL parsing already folds plain "..", but encoded forms (%2e%2e, %2f, backslashes) survive it.
  if (path.includes('\0') || path.includes('\\') || path.split('/').some((s) => s === '..' || s === '.')) return { ok: false, status: 403 };
  const relative = path === '/' ? 'index.html' : path.replace(/^\/+/, '');
  const root = resolve(rootDir);
  const filePath = resolve(join(root, relative));
  if (!filePath.startsWith(root + sep)) return { ok: false, status: 403 };
  const mime = MIME_TYPES[extname(filePath).toLowerCase()];
  if (mime === undefined) return { ok: false, status: 403 };
  return { ok: true, filePath, mime };
}

/** Answer one protocol request: the file with its type and the CSP, or an empty error response. */
export async function serveAppRequest(url: string, rootDir: string): Promise<Response> {
  const resolved = resolveAppRequest(url, rootDir);
  if (!resolved.ok) return new Response(null, { status: resolved.status });
  try {
    const body = await fs.readFile(resolved.filePath);
    return new Response(body, { status: 200, headers: {
      'content-type': resolved.mime,
      'content-security-policy': CONTENT_SECURITY_POLICY,
      'x-content-type-options': 'nosniff',
    } });
  } catch {
    return new Response(null, { status: 404 });
  }
}
