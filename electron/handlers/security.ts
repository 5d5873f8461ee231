// Window security settings in one place: web preferences, the content security policy and the
// navigation rule. Plain data so a test can check every flag without Electron.

import path from 'node:path';

export const APP_SCHEME = 'app';
export const APP_HOST = 'furrow';
export const APP_ORIGIN = `${APP_SCHEME}://${APP_HOST}`;

/** No remote content: everything comes from the app's own scheme; workers may use blob: URLs. */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  "script-src 'self'",
  "worker-src 'self' blob:",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "connect-src 'self' blob: data:",
  "font-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'none'",
  "frame-ancestors 'none'",
].join('; ');

export function secureWebPreferences(preloadPath: string) {
  return {
    preload: preloadPath,
    contextIsolation: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    sandbox: true,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    experimentalFeatures: false,
    navigateOnDragDrop: false,
    spellcheck: false,
  } as const;
}

/** The window may only ever show the app's own pages. */
export function isAllowedNavigation(url: string): boolean {
  try {
    const u = new URL(url);
    return u.protocol === `${APP_SCHEME}:` && u.host === APP_HOST;
  } catch {
    return false;
  }
}

/** Map an app:// URL to a file under the renderer folder; null when it would escape it. */
export function resolveAppUrl(url: string, rendererDir: string): string | null {
  let u: URL;
  try { u = new URL(url); } catch { return null; }
  if (u.protocol !== `${APP_SCHEME}:` || u.host !== APP_HOST) return null;
  let rel: string;
  try { rel = decodeURIComponent(u.pathname === '/' ? '/index.html' : u.pathname); } catch { return null; }
  if (rel.includes('\0')) return null;
  const root = path.resolve(rendererDir);
  const full = path.resolve(root, '.' + rel);
  return full.startsWith(root + path.sep) ? full : null;
}
