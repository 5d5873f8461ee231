// Electron main process: one secure window serving the built renderer from app://furrow, native menus,
// file dialogs and the bridge handlers. Each handler validates its arguments (electron/contract.ts)
// and delegates to the plain modules in electron/handlers/.

import { app, BrowserWindow, dialog, ipcMain, Menu, net, protocol, session, type IpcMainInvokeEvent, type MenuItemConstructorOptions } from 'electron';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { err, ok } from '../core/result';
import {
  CHANNELS, FILE_KINDS, validateDocumentState, validateOpenKind, validatePath, validateRecovery, validateWriteRequest,
  type BridgeResult, type FileKind, type MenuCommand, type OpenedFile, type RecoverySnapshot, type SavedFile,
} from './contract';
import { dialogFilters, readTextFile, writeFileAtomic } from './handlers/fileAccess';
import { buildMenuSpec, type MenuItemSpec } from './handlers/menu';
import { createRecentFiles } from './handlers/recentFiles';
import { createRecoverySlot } from './handlers/recovery';
import { writeKeepingBackup } from './handlers/writeBack';
import { APP_ORIGIN, APP_SCHEME, CONTENT_SECURITY_POLICY, isAllowedNavigation, resolveAppUrl, secureWebPreferences } from './handlers/security';
import { pickInitialFile } from './handlers/startup';

protocol.registerSchemesAsPrivileged([
  { scheme: APP_SCHEME, privileges: { standard: true, secure: true, supportFetchAPI: true, stream: true } },
]);

const rendererDir = path.join(app.getAppPath(), 'renderer', 'dist');
const recent = createRecentFiles(path.join(app.getPath('userData'), 'recent-files.json'));
const initialPath = pickInitialFile(process.argv.slice(app.isPackaged ? 1 : 2), process.env.FURROW_OPEN);
let initialServed = false;
let mainWindow: BrowserWindow | null = null;
let lastFolder = app.getPath('documents');
/** Folder of the drawing last opened: DXF exports are offered beside it, under a new name. */
let drawingFolder: string | null = null;
const recovery = createRecoverySlot(path.join(app.getPath('userData'), 'recovery'));
/** How long main waits for the renderer to write or clear the recovery slot before closing. */
const CLOSE_WAIT_MS = 3000;

function kindOfPath(p: string): FileKind {
  const ext = path.extname(p).slice(1).toLowerCase();
  if ((FILE_KINDS.project as readonly string[]).includes(ext)) return 'project';
  if (ext === 'csv') return 'points';
  return 'drawing';
}

/** Only our own page may call the bridge. */
function fromOurPage(e: IpcMainInvokeEvent | Electron.IpcMainEvent): boolean {
  const url = e.senderFrame?.url ?? '';
  return isAllowedNavigation(url);
}

const refused = (): BridgeResult<never> => err({ kind: 'invalid-argument', message: 'request from an unexpected page' });

async function remember(file: string): Promise<void> {
  lastFolder = path.dirname(file);
  if (kindOfPath(file) === 'drawing') drawingFolder = lastFolder;
  await recent.add(file);
  await rebuildMenu();
}

function send(command: MenuCommand): void {
  mainWindow?.webContents.send(CHANNELS.menuCommand, command);
}

function openRecentFromMenu(p: string): void {
  // the renderer opens it through the bridge (openRecent) so its document flow stays in one place
  mainWindow?.webContents.send(CHANNELS.recentChosen, p);
}

function toTemplate(items: MenuItemSpec[]): MenuItemConstructorOptions[] {
  return items.map((i): MenuItemConstructorOptions => {
    if (i.type === 'separator') return { type: 'separator' };
    const out: MenuItemConstructorOptions = { label: i.label, accelerator: i.accelerator, enabled: i.enabled ?? true };
    if (i.role) out.role = i.role;
    if (i.command) { const c = i.command; out.click = () => send(c); }
    if (i.recentPath) { const p = i.recentPath; out.click = () => openRecentFromMenu(p); }
    if (i.submenu) out.submenu = toTemplate(i.submenu);
    return out;
  });
}

async function rebuildMenu(): Promise<void> {
  Menu.setApplicationMenu(Menu.buildFromTemplate(toTemplate(buildMenuSpec(await recent.list(), process.platform))));
}

function registerHandlers(): void {
  ipcMain.handle(CHANNELS.openFile, async (e, kindArg: unknown): Promise<BridgeResult<OpenedFile | null>> => {
    if (!fromOurPage(e)) return refused();
    const kind = validateOpenKind(kindArg);
    if (!kind.ok) return kind;
    const win = BrowserWindow.fromWebContents(e.sender);
    const options = { defaultPath: lastFolder, filters: dialogFilters(kind.value), properties: ['openFile' as const] };
    const pick = win ? await dialog.showOpenDialog(win, options) : await dialog.showOpenDialog(options);
    if (pick.canceled || pick.filePaths.length === 0) return ok(null);
    const read = await readTextFile(pick.filePaths[0], kind.value);
    if (read.ok && kind.value !== 'points') await remember(read.value.path);
    return read;
  });
  ipcMain.handle(CHANNELS.openRecent, async (e, pathArg: unknown): Promise<BridgeResult<OpenedFile>> => {
    if (!fromOurPage(e)) return refused();
    const p = validatePath(pathArg);
    if (!p.ok) return p;
    const known = await recent.list();
    if (!known.includes(path.resolve(p.value))) return err({ kind: 'invalid-argument', message: 'not in the recent-files list' });
    const read = await readTextFile(p.value, kindOfPath(p.value));
    if (read.ok) await remember(read.value.path);
    else if (read.error.kind === 'not-found') { await recent.remove(p.value); await rebuildMenu(); }
    return read;
  });
  ipcMain.handle(CHANNELS.initialFile, async (e): Promise<BridgeResult<OpenedFile | null>> => {
    if (!fromOurPage(e)) return refused();
    if (initialServed || !initialPath) return ok(null);
    initialServed = true;
    const read = await readTextFile(initialPath, kindOfPath(initialPath));
    if (read.ok && kindOfPath(initialPath) === 'drawing') drawingFolder = path.dirname(path.resolve(initialPath));
    return read;
  });
  ipcMain.handle(CHANNELS.saveFile, async (e, reqArg: unknown): Promise<BridgeResult<SavedFile | null>> => {
    if (!fromOurPage(e)) return refused();
    const req = validateWriteRequest(reqArg);
    if (!req.ok) return req;
    const win = BrowserWindow.fromWebContents(e.sender);
    const isDxf = req.value.kind === 'dxf';
    const folder = isDxf && drawingFolder ? drawingFolder : lastFolder;
    const options = { defaultPath: path.join(folder, req.value.suggestedName), filters: dialogFilters(req.value.kind) };
    const pick = win ? await dialog.showSaveDialog(win, options) : await dialog.showSaveDialog(options);
    if (pick.canceled || !pick.filePath) return ok(null);
    // a drawing is never replaced in place without a backup copy of what was there
    const saved: BridgeResult<SavedFile> = isDxf
      ? await writeKeepingBackup(pick.filePath, req.value.data, req.value.kind)
      : await writeFileAtomic(pick.filePath, req.value.data, req.value.kind);
    if (saved.ok) lastFolder = path.dirname(saved.value.path);
    if (saved.ok && req.value.kind === 'project') await remember(saved.value.path);
    return saved;
  });
  ipcMain.handle(CHANNELS.writeRecovery, async (e, textArg: unknown, atArg: unknown): Promise<BridgeResult<null>> => {
    if (!fromOurPage(e)) return refused();
    const v = validateRecovery(textArg, atArg);
    if (!v.ok) return v;
    return recovery.write(v.value.project, v.value.savedAt);
  });
  ipcMain.handle(CHANNELS.readRecovery, async (e): Promise<BridgeResult<RecoverySnapshot | null>> => {
    if (!fromOurPage(e)) return refused();
    return ok(await recovery.read());
  });
  ipcMain.handle(CHANNELS.clearRecovery, async (e): Promise<BridgeResult<null>> => {
    if (!fromOurPage(e)) return refused();
    try {
      await recovery.clear();
      return ok(null);
    } catch (x) {
      return err({ kind: 'io', message: `could not clear the recovery file: ${(x as Error).message}` });
    }
  });
  ipcMain.on(CHANNELS.closeReady, (e) => {
    if (!fromOurPage(e)) return;
    closeReady?.();
  });
  ipcMain.handle(CHANNELS.recentFiles, async (e): Promise<string[]> => (fromOurPage(e) ? recent.list() : []));
  ipcMain.on(CHANNELS.setDocumentState, (e, title: unknown, edited: unknown) => {
    if (!fromOurPage(e)) return;
    const v = validateDocumentState(title, edited);
    if (!v.ok || !mainWindow) return;
    mainWindow.setTitle(v.value.title ? `${v.value.title} — Furrow` : 'Furrow');
    mainWindow.setDocumentEdited(v.value.edited);
  });
}

let closeReady: (() => void) | null = null;
let closeAllowed = false;
/** Set when the user quits (menu, shortcut): once the window has closed after the handshake, quit goes on. */
let quitting = false;

/** Before the window closes (also on quit), let the renderer write or clear the recovery slot. */
function guardClose(win: BrowserWindow): void {
  win.on('close', (ev) => {
    if (closeAllowed) return;
    ev.preventDefault();
    if (closeReady) return; // already asked
    const timer = setTimeout(() => closeReady?.(), CLOSE_WAIT_MS);
    closeReady = () => {
      clearTimeout(timer);
      closeReady = null;
      closeAllowed = true;
      if (!win.isDestroyed()) win.close();
      // the stopped close also stopped a quit in progress (macOS keeps running without windows)
      if (quitting) app.quit();
    };
    win.webContents.send(CHANNELS.beforeClose);
  });
}

function createWindow(): void {
  closeAllowed = false;
  mainWindow = new BrowserWindow({
    width: 1440,
    height: 900,
    minWidth: 960,
    minHeight: 600,
    backgroundColor: '#1a1d17',
    title: 'Furrow',
    show: false,
    webPreferences: secureWebPreferences(path.join(__dirname, 'preload.cjs')),
  });
  const wc = mainWindow.webContents;
  wc.on('will-navigate', (ev, url) => { if (!isAllowedNavigation(url)) ev.preventDefault(); });
  wc.on('will-redirect', (ev, url) => { if (!isAllowedNavigation(url)) ev.preventDefault(); });
  wc.setWindowOpenHandler(() => ({ action: 'deny' }));
  wc.on('will-attach-webview', (ev) => ev.preventDefault());
  // the page crashed: load it again; it finds the last autosave in the recovery slot and offers it
  wc.on('render-process-gone', (_ev, details) => {
    if (details.reason !== 'clean-exit' && mainWindow && !mainWindow.isDestroyed()) void mainWindow.loadURL(`${APP_ORIGIN}/index.html`);
  });
  mainWindow.once('ready-to-show', () => mainWindow?.show());
  guardClose(mainWindow);
  mainWindow.on('closed', () => { mainWindow = null; });
  void mainWindow.loadURL(`${APP_ORIGIN}/index.html`);
}

app.whenReady().then(async () => {
  protocol.handle(APP_SCHEME, async (request) => {
    const file = resolveAppUrl(request.url, rendererDir);
    if (!file) return new Response('not found', { status: 404 });
    const res = await net.fetch(pathToFileURL(file).toString());
    const headers = new Headers(res.headers);
    headers.set('Content-Security-Policy', CONTENT_SECURITY_POLICY);
    headers.set('X-Content-Type-Options', 'nosniff');
    return new Response(res.body, { status: res.status, headers });
  });
  // no camera, microphone, notifications, geolocation …
  session.defaultSession.setPermissionRequestHandler((_wc, _perm, done) => done(false));
  session.defaultSession.setPermissionCheckHandler(() => false);
  registerHandlers();
  await rebuildMenu();
  createWindow();
  app.on('activate', () => { if (BrowserWindow.getAllWindows().length === 0) createWindow(); });
}).catch((e: unknown) => {
  dialog.showErrorBox('Furrow could not start', e instanceof Error ? e.message : String(e));
  app.quit();
});

app.on('web-contents-created', (_e, contents) => {
  contents.on('will-navigate', (ev, url) => { if (!isAllowedNavigation(url)) ev.preventDefault(); });
  contents.setWindowOpenHandler(() => ({ action: 'deny' }));
});

app.on('before-quit', () => { quitting = true; });

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
