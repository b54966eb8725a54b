/**
 * Serves the built renderer from the custom app scheme. Only files inside the renderer folder are
 * served (no path escapes), each with the strict Content-Security-Policy.
 */
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { APP_ORIGIN, CONTENT_SECURITY_POLICY } from './security-policy.ts';

const CONTENT_TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
  '.gz': 'application/gzip',
};

/** Maps an app-scheme URL to a file inside `rendererRoot`, or null when it would leave it. */
export function resolveAppFile(url: string, rendererRoot: string): string | null {
  if (!url.startsWith(`${APP_ORIGIN}/`)) return null;
  const pathname = decodeURIComponent(new URL(url.replace(/^[a-z]+:/, 'http:')).pathname);
  const relative = pathname === '/' ? 'index.html' : pathname.replace(/^\/+/, '');
  const resolved = path.resolve(rendererRoot, relative);
  const root = path.resolve(rendererRoot);
  return resolved === root || !resolved.startsWith(root + path.sep) ? null : resolved;
}

export async function serveAppRequest(request: Request, rendererRoot: string): Promise<Response> {
  const file = resolveAppFile(request.url, rendererRoot);
  if (file === null) return new Response('Not found', { status: 404 });
  try {
    const body = await readFile(file);
    const type = CONTENT_TYPES[path.extname(file).toLowerCase()] ?? 'application/octet-stream';
    return new Response(body, {
      status: 200,
      headers: { 'Content-Type': type, 'Content-Security-Policy': CONTENT_SECURITY_POLICY, 'X-Content-Type-Options': 'nosniff' },
    });
  } catch {
    return new Response('Not found', { status: 404 });
  }
}
