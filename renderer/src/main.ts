// Renderer entry: builds the canvas, the panels and the stores, then opens the demo site (browser)
// or whatever the shell asks for (Electron).

import { createSiteCanvas } from './canvas/siteCanvas';
import { attachNavigation } from './canvas/navigation';
import { scaleBarLength } from './canvas/viewport';
import { loadDemo, openDrawingText, parseRolesJson, type OpenedDrawing } from './documents/openDrawing';
import { h, clear, fmt } from './dom';
import type { LayerRole } from '../../core/site/site';

interface AppDebug {
  ready: boolean;
  drawingName: string | null;
  layerCount: number;
  segmentCount: number;
  lastError: string | null;
}

declare global {
  interface Window { furrowDebug?: AppDebug }
}

async function boot(): Promise<void> {
  const debug: AppDebug = { ready: false, drawingName: null, layerCount: 0, segmentCount: 0, lastError: null };
  window.furrowDebug = debug;
  const host = document.getElementById('canvas-host')!;
  const empty = document.getElementById('stage-empty')!;
  const status = document.getElementById('statusline')!;
  const scalebar = document.getElementById('scalebar')!;
  const view = await createSiteCanvas(host);

  const cursorEl = h('span', { id: 'cursor-xy' }, '—');
  const zoomEl = h('span', { id: 'zoom' }, '');
  const rendererEl = h('span', { className: 'grow', id: 'renderer-name' }, `WebGL (${view.canvas.getAttribute('data-renderer')})`);
  status.append(cursorEl, zoomEl, rendererEl);

  let doc: OpenedDrawing | null = null;
  let roles: Record<string, LayerRole> = {};

  view.onFrame((vp) => {
    const { length, px } = scaleBarLength(vp.scale);
    (scalebar.firstElementChild as HTMLElement).style.width = `${px.toFixed(1)}px`;
    (scalebar.lastElementChild as HTMLElement).textContent = `${length} ${unitName()}`;
    zoomEl.textContent = `${fmt(vp.scale, 3)} px/${unitName()}`;
  });

  function unitName(): string {
    const code = doc?.drawing.header.insUnits ?? 0;
    return code === 6 ? 'm' : code === 2 ? 'ft' : code === 1 ? 'in' : code === 4 ? 'mm' : 'units';
  }

  attachNavigation(view, {
    leftDragPans: () => true,
    onCursor: (x, y) => { cursorEl.textContent = `X ${fmt(x, 3)}  Y ${fmt(y, 3)} ${unitName()}`; },
    onPick: () => {},
    onLeave: () => { cursorEl.textContent = '—'; },
  });

  function showEmpty(message: string | null, isError = false): void {
    clear(empty);
    if (message === null) { empty.hidden = true; return; }
    empty.hidden = false;
    empty.append(h('div', { className: isError ? 'big error' : 'big' }, message));
  }

  function showDocument(opened: OpenedDrawing, givenRoles: Record<string, LayerRole>): void {
    doc = opened;
    roles = { ...givenRoles };
    const drawn = view.showDrawing(opened.drawing, roles);
    debug.drawingName = opened.name;
    debug.layerCount = opened.drawing.layers.length;
    debug.segmentCount = drawn.segmentCount;
    showEmpty(null);
  }

  const demo = await loadDemo();
  const opened = openDrawingText('site.dxf (demo)', demo.dxf);
  if (!opened.ok) {
    debug.lastError = opened.error;
    showEmpty(opened.error, true);
  } else {
    const r = parseRolesJson(demo.roles);
    showDocument(opened.value, r.ok ? r.value : {});
  }
  await view.nextFrame();
  debug.ready = true;
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
