// The pixi.js v8 canvas: two stacked WebGL canvases, one for the drawing and one for what is drawn
// over it (points, network, cues). It draws what it is given and holds no project state.
//
// Why two: without a GPU (software WebGL) stroking 100,000 entities takes far longer than a frame.
// While the view moves, the drawing canvas is only moved and scaled by a CSS transform (the browser
// composites it); once the view has been still for SETTLE_MS the drawing is re-rendered crisp.
// The overlay is small and is rendered every frame, so points and the network always line up.

import 'pixi.js/unsafe-eval'; // keeps a strict CSP (no 'unsafe-eval') working
import { Application, Container } from 'pixi.js';
import type { Drawing, Extents } from '../../../core/dxf/drawing';
import type { LayerRole } from '../../../core/site/site';
import { CANVAS_BACKGROUND } from '../theme';
import { applyRoles, buildDrawingGraphics, type DrawingGraphics } from './drawingGraphics';
import { fitViewport, type Viewport } from './viewport';

export interface SiteCanvas {
  /** The interactive (top) canvas; pointer events go here. */
  readonly canvas: HTMLCanvasElement;
  /** Screen-space layer above the drawing (points, network, cues), redrawn by its owners before a frame. */
  readonly overlay: Container;
  /** Runs before every frame with the current view (overlays redraw when the view changed). */
  onBeforeRender(cb: (vp: Viewport) => void): void;
  showDrawing(drawing: Drawing | null, roles: Record<string, LayerRole>): { skippedTexts: number; segmentCount: number };
  setRoles(roles: Record<string, LayerRole>, hidden?: ReadonlySet<string>): void;
  viewport(): Viewport;
  setViewport(vp: Viewport): void;
  fit(): void;
  extents(): Extents | null;
  size(): { width: number; height: number };
  requestRender(): void;
  /** Called after every rendered frame with its view and the time spent rendering. */
  onFrame(cb: (vp: Viewport, renderMs: number) => void): void;
  /** Resolves once the next frame has been rendered. */
  nextFrame(): Promise<number>;
  /** Render now and wait for the GPU; `settle` also re-renders the drawing for the current view. */
  renderSync(settle?: boolean): number;
  /** True while the drawing shown is a moved/scaled copy waiting for its crisp re-render. */
  settlePending(): boolean;
  destroy(): void;
}

/** How long the view must be still before the drawing is re-rendered crisp. */
export const SETTLE_MS = 160;

async function makeApp(host: HTMLElement, transparent: boolean): Promise<Application> {
  const app = new Application();
  await app.init({
    preference: 'webgl',
    // a transparent canvas must clear to (0,0,0,0): the page composites it premultiplied
    background: transparent ? 0x000000 : CANVAS_BACKGROUND,
    backgroundAlpha: transparent ? 0 : 1,
    antialias: transparent, // smooth point symbols; the drawing's 1-pixel lines need none
    autoStart: false,
    resizeTo: host,
    autoDensity: true,
    resolution: Math.min(window.devicePixelRatio || 1, 2),
    failIfMajorPerformanceCaveat: false,
  });
  app.ticker.stop();
  app.stage.eventMode = 'none';
  host.appendChild(app.canvas);
  return app;
}

function syncGpu(app: Application): void {
  // reading one pixel waits for every queued GL command (gl.finish does not block in Chromium)
  const gl = (app.renderer as unknown as { gl?: WebGLRenderingContext }).gl;
  if (gl) gl.readPixels(0, 0, 1, 1, gl.RGBA, gl.UNSIGNED_BYTE, new Uint8Array(4));
}

export async function createSiteCanvas(host: HTMLElement): Promise<SiteCanvas> {
  const drawingApp = await makeApp(host, false);
  const overlayApp = await makeApp(host, true);
  const drawingCanvas = drawingApp.canvas;
  drawingCanvas.classList.add('drawing-canvas');
  drawingCanvas.style.transformOrigin = '0 0';
  const top = overlayApp.canvas;
  top.classList.add('site-canvas');
  top.setAttribute('data-renderer', overlayApp.renderer.name === drawingApp.renderer.name ? overlayApp.renderer.name : `${drawingApp.renderer.name}+${overlayApp.renderer.name}`);

  const world = new Container({ label: 'world' });
  drawingApp.stage.addChild(world);
  const overlay = new Container({ label: 'overlay' });
  overlayApp.stage.addChild(overlay);

  const beforeRender: ((vp: Viewport) => void)[] = [];
  let drawingGraphics: DrawingGraphics | null = null;
  let ext: Extents | null = null;
  let vp: Viewport = { scale: 1, tx: 0, ty: 0, ox: 0, oy: 0 };
  /** The view the drawing canvas was last rendered with (null: must re-render). */
  let drawnVp: Viewport | null = null;
  let settleTimer: ReturnType<typeof setTimeout> | null = null;
  let frameRequested = false;
  const frameListeners: ((vp: Viewport, ms: number) => void)[] = [];
  let waiters: ((ms: number) => void)[] = [];

  const size = (): { width: number; height: number } => ({ width: overlayApp.screen.width, height: overlayApp.screen.height });

  const renderDrawing = (): void => {
    if (settleTimer) { clearTimeout(settleTimer); settleTimer = null; }
    world.position.set(vp.tx, vp.ty);
    world.scale.set(vp.scale, -vp.scale);
    drawingApp.render();
    drawingCanvas.style.transform = '';
    drawnVp = vp;
  };

  /** Show the last drawing render moved and scaled to the current view (both share ox, oy). */
  const transformDrawing = (): void => {
    if (!drawnVp || drawnVp === vp) return;
    const k = vp.scale / drawnVp.scale;
    drawingCanvas.style.transform = `translate(${vp.tx - drawnVp.tx * k}px, ${vp.ty - drawnVp.ty * k}px) scale(${k})`;
  };

  const renderNow = (): number => {
    frameRequested = false;
    const t0 = performance.now();
    if (!drawnVp) renderDrawing();
    else transformDrawing();
    for (const cb of beforeRender) cb(vp);
    overlayApp.render();
    const ms = performance.now() - t0;
    for (const cb of frameListeners) cb(vp, ms);
    const w = waiters;
    waiters = [];
    for (const r of w) r(ms);
    return ms;
  };

  function requestRender(): void {
    if (frameRequested) return;
    frameRequested = true;
    requestAnimationFrame(() => { renderNow(); });
  }

  const invalidate = (): void => { drawnVp = null; requestRender(); };

  const scheduleSettle = (): void => {
    if (settleTimer) clearTimeout(settleTimer);
    settleTimer = setTimeout(() => { settleTimer = null; invalidate(); }, SETTLE_MS);
  };

  let lastSize = size();
  const observer = new ResizeObserver(() => {
    drawingApp.resize();
    overlayApp.resize();
    // keep the centre of the view where it was when the panels change width
    const now = size();
    vp = { ...vp, tx: vp.tx + (now.width - lastSize.width) / 2, ty: vp.ty + (now.height - lastSize.height) / 2 };
    lastSize = now;
    invalidate();
  });
  observer.observe(host);

  return {
    canvas: top,
    overlay,
    onBeforeRender(cb) { beforeRender.push(cb); },
    showDrawing(drawing, roles) {
      world.removeChildren();
      if (drawingGraphics) drawingGraphics.root.destroy({ children: true });
      drawingGraphics = null;
      ext = null;
      if (!drawing) { invalidate(); return { skippedTexts: 0, segmentCount: 0 }; }
      ext = drawing.header.extents;
      lastSize = size();
      vp = fitViewport(ext, lastSize.width, lastSize.height);
      drawingGraphics = buildDrawingGraphics(drawing, vp.ox, vp.oy);
      applyRoles(drawingGraphics, roles, new Set());
      world.addChild(drawingGraphics.root);
      invalidate();
      return { skippedTexts: drawingGraphics.skippedTexts, segmentCount: drawingGraphics.segmentCount };
    },
    setRoles(roles, hidden = new Set()) {
      if (drawingGraphics) applyRoles(drawingGraphics, roles, hidden);
      invalidate();
    },
    viewport: () => vp,
    setViewport(next) {
      vp = next;
      scheduleSettle();
      requestRender();
    },
    fit() {
      if (!ext) return;
      // same origin as the geometry was built against (both are the extents' minimum)
      vp = fitViewport(ext, size().width, size().height);
      invalidate();
    },
    extents: () => ext,
    size,
    requestRender,
    onFrame(cb) { frameListeners.push(cb); },
    nextFrame() {
      return new Promise<number>((resolve) => { waiters.push(resolve); requestRender(); });
    },
    renderSync(settle = false) {
      const t0 = performance.now();
      if (settle) drawnVp = null;
      renderNow();
      if (settle) syncGpu(drawingApp);
      syncGpu(overlayApp);
      return performance.now() - t0;
    },
    settlePending: () => settleTimer !== null,
    destroy() {
      observer.disconnect();
      if (settleTimer) clearTimeout(settleTimer);
      drawingApp.destroy(true, { children: true });
      overlayApp.destroy(true, { children: true });
    },
  };
}
