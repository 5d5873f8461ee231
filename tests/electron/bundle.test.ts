// The bundled preload and main process, loaded in Node with a recording stand-in for the `electron`
// module (the Electron binary cannot run here). Checks what crosses the bridge and how the window is set up.
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import vm from 'node:vm';
import { createRequire } from 'node:module';
import { beforeAll, describe, expect, it } from 'vitest';
import { CHANNELS } from '../../electron/contract';

const REPO = path.resolve(__dirname, '../..');
const DIST = path.join(REPO, 'electron', 'dist');
const nodeRequire = createRequire(import.meta.url);

function loadCjs(file: string, electron: unknown): void {
  const code = fs.readFileSync(file, 'utf8');
  const module = { exports: {} as unknown };
  const req = (name: string): unknown => (name === 'electron' ? electron : nodeRequire(name));
  vm.runInThisContext(`(function (require, module, exports, __dirname, __filename) {${code}\n})`, { filename: file })(
    req, module, module.exports, path.dirname(file), file,
  );
}

beforeAll(() => {
  execFileSync(process.execPath, [path.join(REPO, 'electron', 'bundle.mjs')], { stdio: 'pipe' });
});

describe('preload bundle', () => {
  it('exposes only the named bridge functions on window.furrow, each invoking its own channel', async () => {
    const exposed: Record<string, unknown> = {};
    const calls: unknown[][] = [];
    const listeners: Record<string, (...a: unknown[]) => void> = {};
    const electron = {
      contextBridge: { exposeInMainWorld: (name: string, api: unknown) => { exposed[name] = api; } },
      ipcRenderer: {
        invoke: (...a: unknown[]) => { calls.push(['invoke', ...a]); return Promise.resolve({ ok: true, value: null }); },
        send: (...a: unknown[]) => { calls.push(['send', ...a]); },
        on: (ch: string, fn: (...a: unknown[]) => void) => { listeners[ch] = fn; },
        removeListener: (ch: string) => { delete listeners[ch]; },
      },
    };
    loadCjs(path.join(DIST, 'preload.cjs'), electron);
    expect(Object.keys(exposed)).toEqual(['furrow']);
    const api = exposed.furrow as Record<string, unknown>;
    expect(Object.keys(api).sort()).toEqual(
      ['clearRecovery', 'initialFile', 'onBeforeClose', 'onMenuCommand', 'onRecentChosen', 'openFile', 'openRecent', 'readRecovery',
        'recentFiles', 'saveFile', 'setDocumentState', 'version', 'writeRecovery'],
    );
    for (const [k, v] of Object.entries(api)) if (k !== 'version') expect(typeof v, k).toBe('function');
    expect(Object.values(api)).not.toContain(electron.ipcRenderer);

    await (api.openFile as (k: string) => Promise<unknown>)('drawing');
    await (api.saveFile as (r: unknown) => Promise<unknown>)({ kind: 'csv', suggestedName: 'a.csv', data: 'x' });
    (api.setDocumentState as (t: string, e: boolean) => void)('site.dxf', true);
    await (api.writeRecovery as (t: string, at: string) => Promise<unknown>)('{}', '2026-12-02T16:00:00.000Z');
    await (api.readRecovery as () => Promise<unknown>)();
    await (api.clearRecovery as () => Promise<unknown>)();
    expect(calls).toEqual([
      ['invoke', CHANNELS.openFile, 'drawing'],
      ['invoke', CHANNELS.saveFile, { kind: 'csv', suggestedName: 'a.csv', data: 'x' }],
      ['send', CHANNELS.setDocumentState, 'site.dxf', true],
      ['invoke', CHANNELS.writeRecovery, '{}', '2026-12-02T16:00:00.000Z'],
      ['invoke', CHANNELS.readRecovery],
      ['invoke', CHANNELS.clearRecovery],
    ]);

    // before the window closes: the renderer's listener runs to the end, then main is told it may close
    calls.length = 0;
    let flushed = false;
    const offClose = (api.onBeforeClose as (l: () => Promise<void>) => () => void)(async () => {
      await new Promise((r) => setTimeout(r, 20));
      flushed = true;
    });
    listeners[CHANNELS.beforeClose]({});
    expect(calls).toEqual([]);
    await new Promise((r) => setTimeout(r, 60));
    expect(flushed).toBe(true);
    expect(calls).toEqual([['send', CHANNELS.closeReady]]);
    offClose();
    expect(listeners[CHANNELS.beforeClose]).toBeUndefined();

    // menu commands are filtered: unknown strings never reach the renderer
    const got: string[] = [];
    const off = (api.onMenuCommand as (l: (c: string) => void) => () => void)((c) => got.push(c));
    listeners[CHANNELS.menuCommand]({}, 'undo');
    listeners[CHANNELS.menuCommand]({}, 'format-disk');
    expect(got).toEqual(['undo']);
    off();
    expect(listeners[CHANNELS.menuCommand]).toBeUndefined();
  });
});

describe('main bundle', () => {
  it('opens one sandboxed window on app://furrow, registers every channel, and guards the handlers', async () => {
    const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'furrow-main-'));
    const drawing = path.join(tmp, 'site.dxf');
    fs.writeFileSync(drawing, '0\nEOF\n');
    const handles = new Map<string, (...a: unknown[]) => unknown>();
    const ons = new Map<string, (...a: unknown[]) => unknown>();
    const windows: {
      options: any; url?: string; wcHandlers: Map<string, (...a: unknown[]) => void>; openHandler?: () => unknown;
      winHandlers: Map<string, (...a: unknown[]) => void>; sent: unknown[][]; closes: number;
    }[] = [];
    let savePick: { canceled: boolean; filePath?: string } = { canceled: true };
    const appHandlers = new Map<string, (...a: unknown[]) => void>();
    let quits = 0;
    const saveDialogPaths: string[] = [];
    let protocolHandler: ((req: { url: string }) => Promise<Response>) | null = null;
    let ready!: () => void;
    const whenReady = new Promise<void>((r) => { ready = r; });
    class FakeWindow {
      static all: FakeWindow[] = [];
      rec: (typeof windows)[number];
      webContents: any;
      constructor(options: unknown) {
        this.rec = { options, wcHandlers: new Map(), winHandlers: new Map(), sent: [], closes: 0 };
        windows.push(this.rec);
        const rec = this.rec;
        this.webContents = {
          on: (ev: string, fn: (...a: unknown[]) => void) => rec.wcHandlers.set(ev, fn),
          setWindowOpenHandler: (fn: () => unknown) => { rec.openHandler = fn; },
          send: (...a: unknown[]) => { rec.sent.push(a); },
        };
        FakeWindow.all.push(this);
      }
      static getAllWindows = () => FakeWindow.all;
      static fromWebContents = () => null;
      once() { /* ready-to-show */ }
      on(ev: string, fn: (...a: unknown[]) => void) { this.rec.winHandlers.set(ev, fn); }
      close() { this.rec.closes++; this.rec.winHandlers.get('close')?.({ preventDefault: () => { throw new Error('a permitted close must not be stopped'); } }); }
      isDestroyed() { return false; }
      loadURL(url: string) { this.rec.url = url; return Promise.resolve(); }
      setTitle() { /* title */ }
      setDocumentEdited() { /* macOS dot */ }
    }
    const electron = {
      app: {
        getAppPath: () => REPO, getPath: () => tmp, isPackaged: false, whenReady: () => whenReady,
        on: (ev: string, fn: (...a: unknown[]) => void) => { appHandlers.set(ev, fn); }, quit: () => { quits++; },
      },
      protocol: { registerSchemesAsPrivileged: () => undefined, handle: (_s: string, fn: typeof protocolHandler) => { protocolHandler = fn; } },
      ipcMain: { handle: (ch: string, fn: (...a: unknown[]) => unknown) => handles.set(ch, fn), on: (ch: string, fn: (...a: unknown[]) => unknown) => ons.set(ch, fn) },
      BrowserWindow: FakeWindow,
      Menu: { buildFromTemplate: (t: unknown) => t, setApplicationMenu: () => undefined },
      session: { defaultSession: { setPermissionRequestHandler: () => undefined, setPermissionCheckHandler: () => undefined } },
      dialog: {
        showOpenDialog: async () => ({ canceled: false, filePaths: [drawing] }),
        showSaveDialog: async (o: { defaultPath: string }) => { saveDialogPaths.push(o.defaultPath); return savePick; },
        showErrorBox: () => undefined,
      },
      net: { fetch: (url: string) => Promise.resolve(new Response(fs.readFileSync(new URL(url)))) },
    };
    const savedArgv = process.argv;
    process.argv = ['electron', '.'];
    try {
      loadCjs(path.join(DIST, 'main.cjs'), electron);
    } finally {
      process.argv = savedArgv;
    }
    ready();
    await new Promise((r) => setTimeout(r, 50));

    expect(windows.length).toBe(1);
    const w = windows[0];
    expect(w.url).toBe('app://furrow/index.html');
    expect(w.options.webPreferences).toMatchObject({ contextIsolation: true, nodeIntegration: false, sandbox: true });
    expect(w.options.webPreferences.preload).toBe(path.join(DIST, 'preload.cjs'));
    expect(w.openHandler?.()).toEqual({ action: 'deny' });
    let prevented = false;
    w.wcHandlers.get('will-navigate')!({ preventDefault: () => { prevented = true; } }, 'https://example.com/');
    expect(prevented).toBe(true);

    expect([...handles.keys()].sort()).toEqual([
      CHANNELS.initialFile, CHANNELS.openFile, CHANNELS.openRecent, CHANNELS.recentFiles, CHANNELS.saveFile,
      CHANNELS.writeRecovery, CHANNELS.readRecovery, CHANNELS.clearRecovery,
    ].sort());
    expect([...ons.keys()].sort()).toEqual([CHANNELS.closeReady, CHANNELS.setDocumentState].sort());

    const ours = { senderFrame: { url: 'app://furrow/index.html' }, sender: {} };
    const foreign = { senderFrame: { url: 'https://example.com/' }, sender: {} };
    const open = handles.get(CHANNELS.openFile)!;
    expect(await open(foreign, 'drawing')).toMatchObject({ ok: false });
    expect(await open(ours, 'pdf')).toMatchObject({ ok: false, error: { kind: 'invalid-argument' } });
    expect(await open(ours, 'drawing')).toEqual({ ok: true, value: { path: drawing, name: 'site.dxf', text: '0\nEOF\n' } });
    expect(await handles.get(CHANNELS.recentFiles)!(ours)).toEqual([drawing]);
    expect(await handles.get(CHANNELS.openRecent)!(ours, '/etc/passwd')).toMatchObject({ ok: false });
    expect(await handles.get(CHANNELS.saveFile)!(ours, { kind: 'dxf', suggestedName: '../x.dxf', data: '' })).toMatchObject({ ok: false });

    // the recovery slot lives under userData/recovery, and main validates what it is given
    const writeRec = handles.get(CHANNELS.writeRecovery)!, readRec = handles.get(CHANNELS.readRecovery)!;
    expect(await readRec(ours)).toEqual({ ok: true, value: null });
    expect(await writeRec(ours, '', '2026-12-02T16:00:00.000Z')).toMatchObject({ ok: false, error: { kind: 'invalid-argument' } });
    expect(await writeRec(ours, '{}', 'not a time')).toMatchObject({ ok: false, error: { kind: 'invalid-argument' } });
    expect(await writeRec(foreign, '{}', '2026-12-02T16:00:00.000Z')).toMatchObject({ ok: false });
    expect(await writeRec(ours, '{"p":1}', '2026-12-02T16:00:00.000Z')).toEqual({ ok: true, value: null });
    expect(fs.existsSync(path.join(tmp, 'recovery', 'autosave.furrow'))).toBe(true);
    expect(await readRec(foreign)).toMatchObject({ ok: false });
    expect(await readRec(ours)).toEqual({ ok: true, value: { savedAt: '2026-12-02T16:00:00.000Z', project: '{"p":1}' } });
    expect(await handles.get(CHANNELS.clearRecovery)!(ours)).toEqual({ ok: true, value: null });
    expect(await readRec(ours)).toEqual({ ok: true, value: null });

    // the app:// scheme serves renderer/dist with the CSP header and nothing outside it
    const distIndex = path.join(REPO, 'renderer', 'dist', 'index.html');
    if (fs.existsSync(distIndex)) {
      const res = await protocolHandler!({ url: 'app://furrow/index.html' });
      expect(res.status).toBe(200);
      expect(res.headers.get('content-security-policy')).toContain("script-src 'self'");
    }
    expect((await protocolHandler!({ url: 'app://furrow/..%2f..%2fpackage.json' })).status).toBe(404);
    // a crashed page is loaded again (it then offers the last autosave)
    w.url = undefined;
    w.wcHandlers.get('render-process-gone')!({}, { reason: 'clean-exit' });
    expect(w.url).toBeUndefined();
    w.wcHandlers.get('render-process-gone')!({}, { reason: 'crashed' });
    expect(w.url).toBe('app://furrow/index.html');

    // a merged DXF is offered beside the opened drawing under a new name; picking the original
    // itself keeps a backup copy of it before it is replaced
    const save = handles.get(CHANNELS.saveFile)!;
    expect(await save(ours, { kind: 'dxf', suggestedName: 'site-routed.dxf', data: 'ROUTED' })).toEqual({ ok: true, value: null });
    expect(saveDialogPaths.at(-1)).toBe(path.join(tmp, 'site-routed.dxf'));
    savePick = { canceled: false, filePath: drawing };
    const replaced = await save(ours, { kind: 'dxf', suggestedName: 'site-routed.dxf', data: 'ROUTED' });
    expect(replaced).toEqual({ ok: true, value: { path: drawing, name: 'site.dxf', backupPath: path.join(tmp, 'site.bak.dxf') } });
    expect(fs.readFileSync(path.join(tmp, 'site.bak.dxf'), 'utf8')).toBe('0\nEOF\n');
    expect(fs.readFileSync(drawing, 'utf8')).toBe('ROUTED');

    // closing the window first lets the renderer write or clear the recovery slot, then closes
    const closeHandler = w.winHandlers.get('close')!;
    let stopped = 0;
    closeHandler({ preventDefault: () => { stopped++; } });
    expect(stopped).toBe(1);
    expect(w.sent.at(-1)).toEqual([CHANNELS.beforeClose]);
    expect(w.closes).toBe(0);
    ons.get(CHANNELS.closeReady)!(foreign); // only our page may release it
    expect(w.closes).toBe(0);
    ons.get(CHANNELS.closeReady)!(ours);
    expect(w.closes).toBe(1);
    expect(quits).toBe(0); // a window close is not a quit

    // quitting: the close is held for the handshake, and the quit carries on after it
    appHandlers.get('before-quit')!();
    FakeWindow.all.length = 0;
    appHandlers.get('activate')!(); // a fresh window with its own guard
    expect(windows.length).toBe(2);
    const w2 = windows[1];
    let stopped2 = 0;
    w2.winHandlers.get('close')!({ preventDefault: () => { stopped2++; } });
    expect(stopped2).toBe(1);
    expect(w2.sent.at(-1)).toEqual([CHANNELS.beforeClose]);
    expect(quits).toBe(0);
    ons.get(CHANNELS.closeReady)!(ours);
    expect(w2.closes).toBe(1);
    expect(quits).toBe(1);
    fs.rmSync(tmp, { recursive: true, force: true });
  });
});
