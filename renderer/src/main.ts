// Renderer entry (composition root): builds the canvas, stores and panels, wires them together,
// then opens the demo site (browser) or the file the shell was started with (Electron).

import { defaultSettings } from '../../core/settings';
import { parsePointsCsv } from '../../core/site/pointsCsv';
import { parseRolesFile } from '../../core/site/rolesFile';
import type { LayerRole, PointInput } from '../../core/site/site';
import type { LengthUnit } from '../../core/units';
import { createCanvasTools } from './app/canvasTools';
import { pipelineInput } from './app/runInput';
import { initialState, newSession, type Session } from './app/session';
import { attachNavigation } from './canvas/navigation';
import { createNetworkOverlay } from './canvas/networkOverlay';
import { createPointsOverlay } from './canvas/pointsOverlay';
import { createSiteCanvas } from './canvas/siteCanvas';
import { scaleBarLength } from './canvas/viewport';
import { loadDemo, openDrawingText } from './documents/openDrawing';
import { clear, fmt, h } from './dom';
import { renderLayersPanel } from './panels/layersPanel';
import { renderPointsPanel } from './panels/pointsPanel';
import { renderResultsPanel } from './panels/resultsPanel';
import { renderSettingsPanel } from './panels/settingsPanel';
import { renderTakeoffPanel, type ExportKind } from './panels/takeoffPanel';
import { currentPlatform, type MenuCommand } from './platform/platform';
import { figuresOf, networkViewOf } from './results/runRecord';
import { createProjectStore } from './state/history';
import { parseProject, serializeProject } from './state/projectFile';
import { AUTOSAVE_PREF_KEY, autosaveIntervalMs, createAutosave, describeSavedAt, type RecoverySnapshot } from './state/recovery';
import { createRunsStore } from './state/runs';
import { createUiStore, type Step } from './state/ui';
import { startRun, type RunHandle } from './worker/routeClient';

export interface AppDebug {
  ready: boolean;
  drawingName: string | null;
  layerCount: number;
  segmentCount: number;
  lastError: string | null;
  runs: number;
  /** Milliseconds spent building the drawing's graphics and the first frame. */
  firstDrawMs: number;
  /** The view transform of the last frame (for tests that click on drawing coordinates). */
  view: { scale: number; tx: number; ty: number; ox: number; oy: number } | null;
  frames: number;
  /** True while the offer to restore autosaved work is shown. */
  recoveryOffered: boolean;
  /** Autosaves now (as the timer would); resolves true when the slot was written. */
  autosaveNow?: () => Promise<boolean>;
  autosaveIntervalMs: number;
}

declare global {
  interface Window { furrowDebug?: AppDebug }
}

const STEPS: { step: Step; label: string }[] = [
  { step: 'layers', label: 'Layers' },
  { step: 'points', label: 'Points' },
  { step: 'settings', label: 'Settings' },
  { step: 'results', label: 'Route' },
  { step: 'takeoff', label: 'Take-off' },
];

async function boot(): Promise<void> {
  const debug: AppDebug = { ready: false, drawingName: null, layerCount: 0, segmentCount: 0, lastError: null, runs: 0, firstDrawMs: 0, view: null, frames: 0, recoveryOffered: false, autosaveIntervalMs: 0 };
  window.furrowDebug = debug;
  const platform = currentPlatform();
  const utilities = defaultSettings().utilities;
  const byId = (id: string): HTMLElement => document.getElementById(id)!;
  const host = byId('canvas-host'), empty = byId('stage-empty'), status = byId('statusline');
  const scalebar = byId('scalebar'), tip = byId('hover-tip'), sheet = byId('sheet'), rail = byId('rail'), topbar = byId('topbar');

  const view = await createSiteCanvas(host);
  const networkOverlay = createNetworkOverlay(view.overlay);
  const pointsOverlay = createPointsOverlay(view.overlay);
  view.onBeforeRender((vp) => { networkOverlay.draw(vp); pointsOverlay.draw(vp); });

  let session: Session | null = null;
  const store = createProjectStore(Object.freeze({ roles: {}, points: [], route: defaultSettings().route, utilitiesOn: utilities.map((u) => u.key), units: null }));
  const ui = createUiStore({ step: 'layers', tool: 'select', selectedPoint: null, message: null, hiddenLayers: new Set() });
  const runs = createRunsStore();
  let savedAt: unknown = store.get();
  let activeRun: RunHandle | null = null;
  const autosave = createAutosave({
    slot: platform.recovery,
    unsaved: () => {
      const st = store.get(), doc = session;
      return doc && st !== savedAt ? { key: st, text: () => serializeProject(doc.name, doc.text, st) } : null;
    },
    now: () => new Date(),
  });
  debug.autosaveNow = () => autosave.tick();
  const autosavePref = {
    get minutes(): number { return debug.autosaveIntervalMs / 60_000; },
    setMinutes(m: number): void {
      try { window.localStorage.setItem(AUTOSAVE_PREF_KEY, String(m)); } catch { /* storage off: this session only */ }
      debug.autosaveIntervalMs = m * 60_000;
      autosave.start(debug.autosaveIntervalMs);
    },
  };
  platform.onBeforeClose(() => autosave.closing());

  // ---- status line, scale bar, hover tip ----
  const cursorEl = h('span', { id: 'cursor-xy' }, '—');
  const zoomEl = h('span', { id: 'zoom' }, '');
  const messageEl = h('span', { id: 'message-line' }, '');
  status.append(cursorEl, zoomEl, messageEl, h('span', { className: 'grow', id: 'renderer-name' }, `WebGL · ${view.canvas.getAttribute('data-renderer')}`));
  const unitName = (): string => {
    const code = session?.drawing.header.insUnits ?? 0;
    return ({ 1: 'in', 2: 'ft', 4: 'mm', 5: 'cm', 6: 'm', 21: 'US ft' } as Record<number, string>)[code] ?? 'units';
  };
  view.onFrame((vp) => {
    debug.view = { ...vp };
    debug.frames++;
    const { length, px } = scaleBarLength(vp.scale);
    (scalebar.firstElementChild as HTMLElement).style.width = `${px.toFixed(1)}px`;
    (scalebar.lastElementChild as HTMLElement).textContent = `${length} ${unitName()}`;
    zoomEl.textContent = `${fmt(vp.scale, 3)} px per ${unitName()}`;
  });
  const showTip = (text: string | null, sx: number, sy: number): void => {
    if (!text) { tip.hidden = true; return; }
    tip.textContent = text; // drawing text and ids are shown as text, never as HTML
    tip.style.left = `${sx + 14}px`;
    tip.style.top = `${sy + 14}px`;
    tip.hidden = false;
  };

  attachNavigation(view, createCanvasTools({
    view, store, ui, runs, points: pointsOverlay, session: () => session,
    showCursor: (t) => { cursorEl.textContent = t === '—' ? t : `${t} ${unitName()}`; },
    showTip,
  }));

  // ---- top bar and step rail ----
  const docName = h('span', { className: 'docname', id: 'doc-name' }, 'No drawing');
  const undoBtn = h('button', { id: 'undo', title: 'Undo (Ctrl+Z)', onclick: () => store.undo() }, 'Undo');
  const redoBtn = h('button', { id: 'redo', title: 'Redo (Ctrl+Y)', onclick: () => store.redo() }, 'Redo');
  topbar.append(h('span', { className: 'mark' }, 'FURROW'), docName,
    h('button', { id: 'open-drawing', onclick: () => void command('open-drawing') }, 'Open drawing…'),
    h('button', { id: 'open-project', onclick: () => void command('open-project') }, 'Open project…'),
    h('button', { id: 'save-project', onclick: () => void command('save-project') }, 'Save project'),
    undoBtn, redoBtn,
    h('button', { id: 'fit', title: 'Fit the drawing (Ctrl+0)', onclick: () => view.fit() }, 'Fit'));
  const renderRail = (): void => {
    clear(rail);
    STEPS.forEach((s, i) => rail.append(h('button', {
      className: ui.get().step === s.step ? 'active' : '', 'data-step': s.step,
      onclick: () => ui.set({ step: s.step, message: null }),
    }, h('span', { className: 'step-no' }, String(i + 1)), s.label)));
  };

  // ---- the sheet (the active step's panel) ----
  const renderSheet = (): void => {
    const scroll = sheet.scrollTop;
    clear(sheet);
    const msg = ui.get().message;
    if (msg) sheet.append(h('div', { className: `message ${msg.kind === 'info' ? '' : msg.kind}`, id: 'ui-message' }, msg.text));
    if (!session) {
      sheet.append(h('h2', {}, 'Start'), h('div', { className: 'message' }, 'Open a DXF site plan or a saved project to begin.'));
      return;
    }
    switch (ui.get().step) {
      case 'layers': renderLayersPanel(sheet, { store, ui, drawing: session.drawing, model: session.model }); break;
      case 'points': renderPointsPanel(sheet, { store, ui, utilities, importCsv: () => void command('import-points') }); break;
      case 'settings': renderSettingsPanel(sheet, { store, ui, utilities, autosave: autosavePref }); break;
      case 'results': renderResultsPanel(sheet, { runs, utilities, canRun, run: () => void command('run'), cancel: () => void command('cancel-run') }); break;
      case 'takeoff': renderTakeoffPanel(sheet, { runs, exportFile: (k) => void exportFile(k) }); break;
    }
    sheet.scrollTop = scroll;
  };

  const refreshChrome = (): void => {
    undoBtn.disabled = !store.canUndo();
    redoBtn.disabled = !store.canRedo();
    undoBtn.title = store.undoLabel() ? `Undo: ${store.undoLabel()} (Ctrl+Z)` : 'Nothing to undo';
    redoBtn.title = store.redoLabel() ? `Redo: ${store.redoLabel()} (Ctrl+Y)` : 'Nothing to redo';
    const edited = store.get() !== savedAt;
    docName.textContent = session ? `${session.name}${edited ? ' •' : ''}` : 'No drawing';
    platform.setDocumentState(session?.name ?? '', edited);
  };

  store.subscribe((state, diff) => {
    if (!diff || diff.roles.length) view.setRoles(state.roles as Record<string, LayerRole>, ui.get().hiddenLayers);
    pointsOverlay.setPoints(state.points, ui.get().selectedPoint);
    if (diff && runs.get().current && !runs.get().stale) runs.set({ stale: true });
    view.requestRender();
    refreshChrome();
    renderSheet();
  });
  ui.subscribe((s, prev) => {
    if (s.hiddenLayers !== prev.hiddenLayers) view.setRoles(store.get().roles as Record<string, LayerRole>, s.hiddenLayers);
    if (s.selectedPoint !== prev.selectedPoint) pointsOverlay.setPoints(store.get().points, s.selectedPoint);
    if (s.tool !== prev.tool) pointsOverlay.setCue(null);
    messageEl.textContent = s.message?.text ?? '';
    if (s.step !== prev.step) {
      renderRail();
      // the take-off table needs a wider sheet; the canvas follows through its resize observer
      byId('app').classList.toggle('wide-sheet', s.step === 'takeoff');
    }
    view.requestRender();
    renderSheet();
  });
  runs.subscribe((r) => {
    networkOverlay.set(r.current ? r.current.view : null);
    view.requestRender();
    renderSheet();
  });

  // ---- documents ----
  function showEmpty(message: string | null, isError = false): void {
    clear(empty);
    empty.hidden = message === null;
    if (message !== null) empty.append(h('div', { className: isError ? 'big error' : 'big' }, message));
  }

  function openDocument(name: string, text: string, given: { roles?: Record<string, LayerRole>; points?: PointInput[]; units?: LengthUnit | null; route?: Record<string, unknown>; utilitiesOn?: string[] } = {}): boolean {
    const opened = openDrawingText(name, text);
    if (!opened.ok) {
      ui.set({ message: { kind: 'error', text: opened.error } });
      if (!session) showEmpty(opened.error, true);
      debug.lastError = opened.error;
      return false;
    }
    activeRun?.cancel();
    session = newSession(name, text, opened.value.drawing);
    const t0 = performance.now();
    const drawn = view.showDrawing(session.drawing, {});
    let state = initialState(session, utilities, given);
    if (given.route) state = { ...state, route: Object.freeze({ ...state.route, ...given.route }) as typeof state.route };
    if (given.utilitiesOn) state = { ...state, utilitiesOn: Object.freeze([...given.utilitiesOn]) };
    store.reset(Object.freeze(state));
    savedAt = store.get();
    runs.set({ current: null, previous: null, running: null, lastError: null, stale: false });
    ui.set({ selectedPoint: null, hiddenLayers: new Set(), message: drawn.skippedTexts ? { kind: 'info', text: `${drawn.skippedTexts} drawing texts not drawn (too many to show).` } : null });
    debug.drawingName = name;
    debug.layerCount = session.drawing.layers.length;
    debug.segmentCount = drawn.segmentCount;
    showEmpty(null);
    void view.nextFrame().then(() => { debug.firstDrawMs = performance.now() - t0; });
    refreshChrome();
    return true;
  }

  function openProjectText(text: string): boolean {
    const p = parseProject(text, utilities.map((u) => u.key));
    if (!p.ok) { ui.set({ message: { kind: 'error', text: p.error.message } }); return false; }
    const f = p.value;
    return openDocument(f.drawing.name, f.drawing.text, {
      roles: f.state.roles, points: f.state.points, units: f.units, route: { ...f.state.route }, utilitiesOn: f.state.utilitiesOn,
    });
  }

  /** A recovery slot at start-up: the last session ended without a clean save or close. */
  function offerRestore(snap: RecoverySnapshot): void {
    autosave.hold(true); // leave the older work in the slot until the user decides
    const parsed = parseProject(snap.project, utilities.map((u) => u.key));
    const what = parsed.ok ? `your work on ${parsed.value.drawing.name}` : 'a project';
    const problem = h('p', { className: 'recovery-problem', id: 'recovery-problem', hidden: true });
    const close = (): void => { box.remove(); autosave.hold(false); debug.recoveryOffered = false; };
    const restore = (): void => {
      const p = parseProject(snap.project, utilities.map((u) => u.key));
      if (!p.ok) {
        problem.textContent = `This autosave cannot be restored: ${p.error.message}`;
        problem.hidden = false;
        return;
      }
      close();
      if (openProjectText(snap.project)) {
        savedAt = null; // restored work is not in any saved file yet
        refreshChrome();
        ui.set({ message: { kind: 'info', text: `Restored the work autosaved at ${describeSavedAt(snap.savedAt)}. Save the project to keep it.` } });
      }
    };
    const discard = (): void => {
      close();
      void autosave.cleared();
      ui.set({ message: { kind: 'info', text: 'The autosaved work was discarded.' } });
    };
    const box = h('div', { className: 'recovery-offer', id: 'recovery-offer', role: 'alertdialog', 'aria-labelledby': 'recovery-title', 'aria-describedby': 'recovery-text' },
      h('h2', { id: 'recovery-title' }, 'Unsaved work was kept'),
      h('p', { id: 'recovery-text' },
        `Furrow did not close normally last time. It autosaved ${what} at `, h('strong', { id: 'recovery-time' }, describeSavedAt(snap.savedAt)), '.'),
      h('p', {}, 'Restore it to continue from there, or discard it and keep what is open now.'),
      problem,
      h('div', { className: 'recovery-actions' },
        h('button', { id: 'recovery-restore', className: 'primary', onclick: restore }, 'Restore'),
        h('button', { id: 'recovery-discard', onclick: discard }, 'Discard')));
    document.body.append(box);
    debug.recoveryOffered = true;
    (box.querySelector('#recovery-restore') as HTMLButtonElement).focus();
  }

  function canRun(): string | null {
    if (!session) return 'Open a drawing first.';
    const st = store.get();
    const site = session.model.site(st.roles, st.units);
    if (!site.ok) return `The site cannot be built: ${site.error.message}`;
    if (site.value.buildings.length === 0) return 'No buildings: give the building layer the role "Building".';
    if (!st.points.some((p) => p.role === 'connection')) return 'Add at least one connection point.';
    if (!st.points.some((p) => p.role === 'service')) return 'Add at least one service.';
    if (st.utilitiesOn.length === 0) return 'Switch on at least one utility in Route settings.';
    return null;
  }

  function run(): void {
    const blocker = canRun();
    if (blocker || !session || runs.get().running) { if (blocker) ui.set({ message: { kind: 'warn', text: blocker } }); return; }
    const runSession = session;
    const st = store.get();
    const { input, dropped } = pipelineInput(runSession, st, utilities, new Date().toISOString().slice(0, 10));
    if (dropped.length) ui.set({ message: { kind: 'warn', text: `Left out (no utility switched on): ${dropped.join(', ')}` } });
    runs.set({ running: { stage: 'start', fraction: 0, startedAt: performance.now() }, lastError: null });
    let lastUi = 0;
    const handle = startRun(input, (stage, fraction) => {
      const t = performance.now();
      if (t - lastUi < 100 && fraction < 1) return;
      lastUi = t;
      runs.set({ running: { stage, fraction, startedAt: runs.get().running?.startedAt ?? t } });
    });
    activeRun = handle;
    void handle.outcome.then((o) => {
      if (activeRun === handle) activeRun = null;
      if (session !== runSession) return;
      if (o.kind === 'done') {
        debug.runs++;
        const id = (runs.get().current?.id ?? 0) + 1;
        runs.push({ id, label: `Run ${id}`, route: st.route, output: o.output, figures: figuresOf(o.output), view: networkViewOf(o.output) });
      } else if (o.kind === 'cancelled') {
        runs.set({ running: null, lastError: 'Run cancelled.' });
      } else {
        runs.set({ running: null, lastError: `The run stopped while ${o.stage}: ${o.message}` });
      }
    });
    ui.set({ step: 'results' });
  }

  async function exportFile(kind: ExportKind): Promise<void> {
    const cur = runs.get().current;
    if (!cur || !session) { ui.set({ message: { kind: 'warn', text: 'Run the route before exporting.' } }); return; }
    const base = session.name.replace(/\.[^.]*$/, '').replace(/\s*\(demo\)$/, '');
    const f = cur.output.files;
    const req = {
      'dxf-merged': { kind: 'dxf' as const, suggestedName: `${base}-routed.dxf`, data: f.routedDxf },
      'dxf-layers': { kind: 'dxf' as const, suggestedName: `${base}-trench-layers.dxf`, data: f.trenchDxf },
      xlsx: { kind: 'xlsx' as const, suggestedName: `${base}-takeoff.xlsx`, data: f.takeoffXlsx },
      csv: { kind: 'csv' as const, suggestedName: `${base}-takeoff.csv`, data: f.takeoffCsv },
      pdf: { kind: 'pdf' as const, suggestedName: `${base}-report.pdf`, data: f.reportPdf },
    }[kind];
    const r = await platform.saveFile(req);
    if (!r.ok) ui.set({ message: { kind: 'error', text: `Export failed: ${r.error.message}` } });
    else if (r.value) ui.set({ message: { kind: 'info', text: `Saved ${r.value.name}.` } });
  }

  async function command(c: MenuCommand): Promise<void> {
    switch (c) {
      case 'open-drawing': {
        const r = await platform.openFile('drawing');
        if (!r.ok) ui.set({ message: { kind: 'error', text: r.error.message } });
        else if (r.value) openDocument(r.value.name, r.value.text);
        return;
      }
      case 'open-project': {
        const r = await platform.openFile('project');
        if (!r.ok) ui.set({ message: { kind: 'error', text: r.error.message } });
        else if (r.value) openProjectText(r.value.text);
        return;
      }
      case 'save-project':
      case 'save-project-as': {
        if (!session) return;
        const data = serializeProject(session.name, session.text, store.get());
        const r = await platform.saveFile({ kind: 'project', suggestedName: `${session.name.replace(/\.[^.]*$/, '').replace(/\s*\(demo\)$/, '')}.furrow`, data });
        if (!r.ok) ui.set({ message: { kind: 'error', text: `Could not save: ${r.error.message}` } });
        else if (r.value) {
          savedAt = store.get();
          void autosave.cleared(); // saved cleanly: nothing left to recover
          refreshChrome();
          ui.set({ message: { kind: 'info', text: `Saved ${r.value.name}.` } });
        }
        return;
      }
      case 'import-points': {
        const r = await platform.openFile('points');
        if (!r.ok) { ui.set({ message: { kind: 'error', text: r.error.message } }); return; }
        if (!r.value) return;
        const p = parsePointsCsv(r.value.text, utilities.map((u) => u.key), r.value.name);
        if (!p.ok) { ui.set({ message: { kind: 'error', text: p.error.message } }); return; }
        store.edit({ kind: 'replace-points', points: p.value });
        ui.set({ message: { kind: 'info', text: `Imported ${p.value.length} points from ${r.value.name}.` }, step: 'points' });
        return;
      }
      case 'export-dxf-merged': return exportFile('dxf-merged');
      case 'export-dxf-layers': return exportFile('dxf-layers');
      case 'export-xlsx': return exportFile('xlsx');
      case 'export-csv': return exportFile('csv');
      case 'export-pdf': return exportFile('pdf');
      case 'undo': store.undo(); return;
      case 'redo': store.redo(); return;
      case 'fit': view.fit(); return;
      case 'run': run(); return;
      case 'cancel-run': activeRun?.cancel(); return;
    }
  }

  platform.onMenuCommand((c) => void command(c));
  platform.onRecentChosen(async (path) => {
    const r = await platform.openRecent(path);
    if (!r.ok) { ui.set({ message: { kind: 'error', text: r.error.message } }); return; }
    if (/\.(furrow|json)$/i.test(r.value.name)) openProjectText(r.value.text); else openDocument(r.value.name, r.value.text);
  });

  window.addEventListener('keydown', (ev) => {
    const typing = ev.target instanceof HTMLElement && ['INPUT', 'SELECT', 'TEXTAREA'].includes(ev.target.tagName);
    if (platform.kind === 'electron') return; // the native menu owns the shortcuts
    const mod = ev.ctrlKey || ev.metaKey;
    if (mod && ev.key.toLowerCase() === 'z' && !typing) { ev.preventDefault(); void command(ev.shiftKey ? 'redo' : 'undo'); }
    else if (mod && ev.key.toLowerCase() === 'y' && !typing) { ev.preventDefault(); void command('redo'); }
    else if (mod && ev.key.toLowerCase() === 's') { ev.preventDefault(); void command('save-project'); }
    else if (mod && ev.key === '0') { ev.preventDefault(); view.fit(); }
    else if (ev.key === 'Escape') void command('cancel-run');
    else if ((ev.key === 'Delete' || ev.key === 'Backspace') && !typing && ui.get().selectedPoint) {
      store.edit({ kind: 'remove-point', id: ui.get().selectedPoint! });
      ui.set({ selectedPoint: null });
    }
  });

  // ---- start: the shell's file, else the demo site ----
  renderRail();
  renderSheet();
  refreshChrome();
  const initial = await platform.initialFile();
  const params = new URLSearchParams(location.search);
  if (initial.ok && initial.value) {
    if (/\.(furrow|json)$/i.test(initial.value.name)) openProjectText(initial.value.text);
    else if (openDocument(initial.value.name, initial.value.text) && initial.value.name === 'site.dxf') await addDemoExtras(true);
  } else if (!initial.ok) {
    ui.set({ message: { kind: 'error', text: initial.error.message } });
  } else if (platform.kind === 'browser' && !params.has('empty')) {
    await addDemoExtras(false);
  } else {
    showEmpty('Open a DXF site plan (File ▸ Open Site Drawing) or a saved project.');
  }
  const found = await platform.recovery.read();
  if (found.ok && found.value) offerRestore(found.value);
  let storedMinutes: string | null = null;
  try { storedMinutes = window.localStorage.getItem(AUTOSAVE_PREF_KEY); } catch { /* storage off: the default */ }
  debug.autosaveIntervalMs = autosaveIntervalMs(location.search, storedMinutes);
  autosave.start(debug.autosaveIntervalMs);
  await view.nextFrame();
  debug.ready = true;

  /** The demo ships its roles and points beside the drawing; in the browser the drawing comes from the bundle too. */
  async function addDemoExtras(drawingAlreadyOpen: boolean): Promise<void> {
    const demo = await loadDemo();
    if (!drawingAlreadyOpen && !openDocument('site.dxf (demo)', demo.dxf)) return;
    const layers = session!.drawing.layers.map((l) => l.name);
    const roles = parseRolesFile(demo.roles, 'roles.json', layers);
    const pts = parsePointsCsv(demo.services, utilities.map((u) => u.key), 'services.csv');
    store.reset(initialState(session!, utilities, { roles: roles.ok ? roles.value.roles : {}, points: pts.ok ? pts.value : [] }));
    savedAt = store.get();
    refreshChrome();
  }
}

boot().catch((e: unknown) => {
  const empty = document.getElementById('stage-empty');
  const message = e instanceof Error ? e.message : String(e);
  if (window.furrowDebug) window.furrowDebug.lastError = message;
  if (empty) {
    empty.hidden = false;
    empty.textContent = `Furrow could not start: ${message}`;
  }
  console.error(e);
});
