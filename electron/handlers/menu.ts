// The native menu as a plain template (no Electron import): each item sends one MenuCommand.

import type { MenuCommand } from '../contract';

export interface MenuItemSpec {
  label?: string;
  accelerator?: string;
  command?: MenuCommand;
  /** Open this recent file. */
  recentPath?: string;
  role?: 'quit' | 'toggleDevTools' | 'about' | 'copy' | 'paste' | 'cut' | 'selectAll' | 'togglefullscreen' | 'resetZoom';
  type?: 'separator';
  enabled?: boolean;
  submenu?: MenuItemSpec[];
}

export function buildMenuSpec(recent: readonly string[], platform: string): MenuItemSpec[] {
  const sep: MenuItemSpec = { type: 'separator' };
  const baseName = (p: string): string => p.split(/[\\/]/).pop() ?? p;
  const recentItems: MenuItemSpec[] = recent.length
    ? recent.map((p) => ({ label: baseName(p), recentPath: p }))
    : [{ label: '(none yet)', enabled: false }];
  const file: MenuItemSpec = {
    label: '&File',
    submenu: [
      { label: 'Open Site Drawing…', accelerator: 'CmdOrCtrl+O', command: 'open-drawing' },
      { label: 'Open Project…', accelerator: 'CmdOrCtrl+Shift+O', command: 'open-project' },
      { label: 'Recent', submenu: recentItems },
      sep,
      { label: 'Save Project', accelerator: 'CmdOrCtrl+S', command: 'save-project' },
      { label: 'Save Project As…', accelerator: 'CmdOrCtrl+Shift+S', command: 'save-project-as' },
      sep,
      { label: 'Import Points (CSV)…', accelerator: 'CmdOrCtrl+I', command: 'import-points' },
      {
        label: 'Export',
        submenu: [
          { label: 'DXF merged into the drawing…', accelerator: 'CmdOrCtrl+E', command: 'export-dxf-merged' },
          { label: 'DXF trench layers only…', accelerator: 'CmdOrCtrl+Shift+E', command: 'export-dxf-layers' },
          { label: 'Take-off workbook (XLSX)…', command: 'export-xlsx' },
          { label: 'Take-off table (CSV)…', command: 'export-csv' },
          { label: 'Report (PDF)…', accelerator: 'CmdOrCtrl+P', command: 'export-pdf' },
        ],
      },
      sep,
      { role: 'quit', accelerator: platform === 'darwin' ? 'Cmd+Q' : 'Ctrl+Q' },
    ],
  };
  const edit: MenuItemSpec = {
    label: '&Edit',
    submenu: [
      { label: 'Undo', accelerator: 'CmdOrCtrl+Z', command: 'undo' },
      { label: 'Redo', accelerator: platform === 'darwin' ? 'Cmd+Shift+Z' : 'Ctrl+Y', command: 'redo' },
      sep,
      { role: 'cut' }, { role: 'copy' }, { role: 'paste' }, { role: 'selectAll' },
    ],
  };
  const route: MenuItemSpec = {
    label: '&Route',
    submenu: [
      { label: 'Run', accelerator: 'F5', command: 'run' },
      { label: 'Cancel Run', accelerator: 'Escape', command: 'cancel-run' },
    ],
  };
  const view: MenuItemSpec = {
    label: '&View',
    submenu: [
      { label: 'Fit Drawing', accelerator: 'CmdOrCtrl+0', command: 'fit' },
      { role: 'togglefullscreen' },
      { role: 'toggleDevTools' },
    ],
  };
  const menus = [file, edit, route, view];
  return platform === 'darwin' ? [{ label: 'Furrow', submenu: [{ role: 'about' }, sep, { role: 'quit' }] }, ...menus] : menus;
}

/** Every accelerator in the spec (for the uniqueness test). */
export function acceleratorsOf(spec: readonly MenuItemSpec[]): string[] {
  const out: string[] = [];
  const walk = (items: readonly MenuItemSpec[]): void => {
    for (const i of items) {
      if (i.accelerator) out.push(i.accelerator);
      if (i.submenu) walk(i.submenu);
    }
  };
  walk(spec);
  return out;
}
