// Sandboxed preload: exposes the named functions of FurrowBridge as window.furrow — never ipcRenderer.

import { contextBridge, ipcRenderer, type IpcRendererEvent } from 'electron';
import { BRIDGE_VERSION, CHANNELS, isMenuCommand, type FurrowBridge, type MenuCommand, type WriteRequest } from './contract';

const bridge: FurrowBridge = {
  version: BRIDGE_VERSION,
  openFile: (kind) => ipcRenderer.invoke(CHANNELS.openFile, kind),
  openRecent: (path) => ipcRenderer.invoke(CHANNELS.openRecent, path),
  initialFile: () => ipcRenderer.invoke(CHANNELS.initialFile),
  saveFile: (req: WriteRequest) => ipcRenderer.invoke(CHANNELS.saveFile, req),
  recentFiles: () => ipcRenderer.invoke(CHANNELS.recentFiles),
  onMenuCommand(listener: (command: MenuCommand) => void) {
    const handler = (_e: IpcRendererEvent, command: unknown): void => {
      if (isMenuCommand(command)) listener(command);
    };
    ipcRenderer.on(CHANNELS.menuCommand, handler);
    return () => { ipcRenderer.removeListener(CHANNELS.menuCommand, handler); };
  },
  onRecentChosen(listener: (path: string) => void) {
    const handler = (_e: IpcRendererEvent, path: unknown): void => {
      if (typeof path === 'string') listener(path);
    };
    ipcRenderer.on(CHANNELS.recentChosen, handler);
    return () => { ipcRenderer.removeListener(CHANNELS.recentChosen, handler); };
  },
  setDocumentState: (title, edited) => { ipcRenderer.send(CHANNELS.setDocumentState, title, edited); },
  writeRecovery: (projectText, savedAtIso) => ipcRenderer.invoke(CHANNELS.writeRecovery, projectText, savedAtIso),
  readRecovery: () => ipcRenderer.invoke(CHANNELS.readRecovery),
  clearRecovery: () => ipcRenderer.invoke(CHANNELS.clearRecovery),
  onBeforeClose(listener: () => Promise<void>) {
    const handler = (): void => {
      // main waits for this answer (or a timeout) before it closes the window
      void listener().catch(() => undefined).finally(() => ipcRenderer.send(CHANNELS.closeReady));
    };
    ipcRenderer.on(CHANNELS.beforeClose, handler);
    return () => { ipcRenderer.removeListener(CHANNELS.beforeClose, handler); };
  },
};

contextBridge.exposeInMainWorld('furrow', bridge);
