// The plain modules behind the bridge handlers, run in Node without Electron.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { decodeText, readTextFile, withExtension, writeFileAtomic, dialogFilters } from '../../electron/handlers/fileAccess';
import { createRecentFiles, RECENT_LIMIT } from '../../electron/handlers/recentFiles';
import { acceleratorsOf, buildMenuSpec } from '../../electron/handlers/menu';
import { pickInitialFile } from '../../electron/handlers/startup';
import { CONTENT_SECURITY_POLICY, isAllowedNavigation, resolveAppUrl, secureWebPreferences } from '../../electron/handlers/security';
import { MENU_COMMANDS } from '../../electron/contract';

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'furrow-electron-'));
afterAll(() => fs.rmSync(tmp, { recursive: true, force: true }));

describe('file access', () => {
  it('reads a drawing as text and refuses the wrong type, a missing file and an oversized file', async () => {
    const f = path.join(tmp, 'a.dxf');
    fs.writeFileSync(f, '0\nSECTION\n0\nEOF\n');
    const r = await readTextFile(f, 'drawing');
    expect(r.ok && r.value.text).toBe('0\nSECTION\n0\nEOF\n');
    expect(r.ok && r.value.name).toBe('a.dxf');
    const wrong = await readTextFile(f, 'project');
    expect(!wrong.ok && wrong.error.kind).toBe('wrong-type');
    const missing = await readTextFile(path.join(tmp, 'none.dxf'), 'drawing');
    expect(!missing.ok && missing.error.kind).toBe('not-found');
    const big = await readTextFile(f, 'drawing', 4);
    expect(!big.ok && big.error.kind).toBe('too-large');
  });

  it('decodes Latin-1 drawings that are not valid UTF-8', () => {
    expect(decodeText(new Uint8Array([0x53, 0xe9, 0x67]))).toBe('Ség'); // 0xE9 = é in ISO-8859-1
    expect(decodeText(new TextEncoder().encode('Ség'))).toBe('Ség');
  });

  it('writes atomically, adds a missing extension and leaves no partial file on failure', async () => {
    const saved = await writeFileAtomic(path.join(tmp, 'out'), 'hello', 'csv');
    expect(saved.ok && saved.value.name).toBe('out.csv');
    expect(fs.readFileSync(path.join(tmp, 'out.csv'), 'utf8')).toBe('hello');
    const bytes = await writeFileAtomic(path.join(tmp, 'b.xlsx'), new Uint8Array([1, 2, 3]), 'xlsx');
    expect(bytes.ok).toBe(true);
    expect([...fs.readFileSync(path.join(tmp, 'b.xlsx'))]).toEqual([1, 2, 3]);
    const failed = await writeFileAtomic(path.join(tmp, 'no-such-dir', 'x.pdf'), 'x', 'pdf');
    expect(!failed.ok && failed.error.kind).toBe('io');
    expect(fs.readdirSync(tmp).filter((n) => n.endsWith('.part'))).toEqual([]);
    expect(withExtension('/x/job.furrow', 'project')).toBe('/x/job.furrow');
    expect(dialogFilters('pdf')).toEqual([{ name: 'PDF report', extensions: ['pdf'] }]);
  });
});

describe('recent files', () => {
  it('keeps the newest first, without duplicates, at most the limit, and survives a damaged store', async () => {
    const store = path.join(tmp, 'recent', 'recent.json');
    const rf = createRecentFiles(store);
    expect(await rf.list()).toEqual([]);
    for (let i = 0; i < RECENT_LIMIT + 3; i++) await rf.add(path.join(tmp, `f${i}.dxf`));
    await rf.add(path.join(tmp, 'f5.dxf'));
    const list = await rf.list();
    expect(list.length).toBe(RECENT_LIMIT);
    expect(list[0]).toBe(path.join(tmp, 'f5.dxf'));
    expect(new Set(list).size).toBe(list.length);
    await rf.remove(path.join(tmp, 'f5.dxf'));
    expect((await rf.list()).includes(path.join(tmp, 'f5.dxf'))).toBe(false);
    fs.writeFileSync(store, '{not json');
    expect(await rf.list()).toEqual([]);
  });
});

describe('menus', () => {
  it('has no duplicate shortcuts and every command reachable from a menu item', () => {
    for (const platform of ['linux', 'win32', 'darwin']) {
      const spec = buildMenuSpec(['/p/site.dxf'], platform);
      const acc = acceleratorsOf(spec);
      expect(new Set(acc).size, platform).toBe(acc.length);
      const commands = new Set<string>();
      const walk = (items: typeof spec): void => items.forEach((i) => { if (i.command) commands.add(i.command); if (i.submenu) walk(i.submenu); });
      walk(spec);
      expect([...commands].sort()).toEqual([...MENU_COMMANDS].sort());
    }
  });

  it('lists recent files by name', () => {
    const spec = buildMenuSpec(['/jobs/brackenrise/site.dxf'], 'linux');
    const recent = spec[0].submenu!.find((i) => i.label === 'Recent')!;
    expect(recent.submenu![0]).toEqual({ label: 'site.dxf', recentPath: '/jobs/brackenrise/site.dxf' });
  });
});

describe('start-up file', () => {
  it('takes the first drawing/project argument, else the environment path', () => {
    expect(pickInitialFile(['--inspect', 'job.furrow'], undefined)).toBe('job.furrow');
    expect(pickInitialFile(['--x'], '/demo/site.dxf')).toBe('/demo/site.dxf');
    expect(pickInitialFile(['notes.txt'], undefined)).toBeNull();
  });
});

describe('window security', () => {
  it('turns on isolation and the sandbox and turns off node integration', () => {
    const w = secureWebPreferences('/app/preload.cjs');
    expect(w.contextIsolation).toBe(true);
    expect(w.sandbox).toBe(true);
    expect(w.nodeIntegration).toBe(false);
    expect(w.nodeIntegrationInWorker).toBe(false);
    expect(w.webSecurity).toBe(true);
    expect(w.webviewTag).toBe(false);
  });

  it('has a CSP without remote sources, inline scripts or eval', () => {
    expect(CONTENT_SECURITY_POLICY).toContain("default-src 'self'");
    expect(CONTENT_SECURITY_POLICY).toContain("script-src 'self'");
    expect(CONTENT_SECURITY_POLICY).not.toMatch(/unsafe-eval|https?:|\*/);
    expect(CONTENT_SECURITY_POLICY).toMatch(/script-src 'self';/);
  });

  it('allows navigation only within app://furrow and serves only files under the renderer folder', () => {
    expect(isAllowedNavigation('app://furrow/index.html')).toBe(true);
    expect(isAllowedNavigation('https://example.com/')).toBe(false);
    expect(isAllowedNavigation('file:///etc/passwd')).toBe(false);
    expect(isAllowedNavigation('app://other/index.html')).toBe(false);
    const root = path.join(tmp, 'dist');
    expect(resolveAppUrl('app://furrow/', root)).toBe(path.join(root, 'index.html'));
    expect(resolveAppUrl('app://furrow/assets/a.js', root)).toBe(path.join(root, 'assets', 'a.js'));
    // URL parsing folds %2e%2e segments at the root, so this stays inside the folder
    expect(resolveAppUrl('app://furrow/%2e%2e/%2e%2e/etc/passwd', root)).toBe(path.join(root, 'etc', 'passwd'));
    expect(resolveAppUrl('app://furrow/..%2f..%2fsecret', root)).toBeNull();
    expect(resolveAppUrl('https://furrow/index.html', root)).toBeNull();
  });
});
