// The pixi.js v8 canvas: owns the pixi Application, the world transform and render scheduling.
// It draws what it is given (drawing, points, network); it holds no project state of its own.

import 'pixi.js/unsafe-eval'; // keeps a strict CSP (no 'unsafe-eval') working
import { Application, Container } from 'pixi.js';
import type { Drawing, Extents } from '../../../core/dxf/drawing';
import type { LayerRole } from '../../../core/site/site';
import { CANVAS_BACKGROUND } from '../theme';
import { applyRoles, buildDrawingGraphics, type DrawingGraphics } from './drawingGraphics';
import { fitViewport, type Viewport } from './viewport';

export interface SiteCanvas {
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
  /** Called after every rendered frame with its view and the time spent in app.render(). */
  onFrame(cb: (vp: Viewport, renderMs: number) => void): void;
  /** Resolves once the next frame has been rendered. */
  nextFrame(): Promise<number>;
  destroy(): void;
}

export async function createSiteCanvas(host: HTMLElement): Promise<SiteCanvas> {
  const app = new Application();
  await app.init({
    preference: 'webgl',
    background: CANVAS_BACKGROUND,
    antialias: true,
    autoStart: false,
    resizeTo: host,
    autoDensity: true,
    resolution: Math.min(window.devicePixelRatio || 1, 2),
    failIfMajorPerformanceCaveat: false,
  });
  app.ticker.stop();
  app.stage.eventMode = 'none';
  app.canvas.classList.add('site-canvas');
  app.canvas.setAttribute('data-renderer', app.renderer.name);
  host.appendChild(app.canvas);

  const world = new Container({ label: 'world' });
  const overlay = new Container({ label: 'overlay' });
  app.stage.addChild(world, overlay);
  const beforeRender: ((vp: Viewport) => void)[] = [];
  let drawingGraphics: DrawingGraphics | null = null;
  let ext: Extents | null = null;
  let vp: Viewport = { scale: 1, tx: 0, ty: 0, ox: 0, oy: 0 };
  let frameRequested = false;
  const frameListeners: ((vp: Viewport, ms: number) => void)[] = [];
  let waiters: ((ms: number) => void)[] = [];

  const applyViewport = (): void => {
    world.position.set(vp.tx, vp.ty);
    world.scale.set(vp.scale, -vp.scale);
  };

  const renderNow = (): void => {
    frameRequested = false;
    applyViewport();
    for (const cb of beforeRender) cb(vp);
    const t0 = performance.now();
    app.render();
    const ms = performance.now() - t0;
    for (const cb of frameListeners) cb(vp, ms);
    const w = waiters;
    waiters = [];
    for (const r of w) r(ms);
  };

  const requestRender = (): void => {
    if (frameRequested) return;
    frameRequested = true;
    requestAnimationFrame(renderNow);
  };

  const size = (): { width: number; height: number } => ({ width: app.screen.width, height: app.screen.height });

  const observer = new ResizeObserver(() => {
    app.resize();
    requestRender();
  });
  observer.observe(host);

  const canvas: SiteCanvas = {
    canvas: app.canvas,
    overlay,
    onBeforeRender(cb) { beforeRender.push(cb); },
    showDrawing(drawing, roles) {
      world.removeChildren();
      if (drawingGraphics) drawingGraphics.root.destroy({ children: true });
      drawingGraphics = null;
      ext = null;
      if (!drawing) { requestRender(); return { skippedTexts: 0, segmentCount: 0 }; }
      ext = drawing.header.extents;
      vp = fitViewport(ext, size().width, size().height);
      drawingGraphics = buildDrawingGraphics(drawing, vp.ox, vp.oy);
      applyRoles(drawingGraphics, roles, new Set());
      world.addChild(drawingGraphics.root);
      requestRender();
      return { skippedTexts: drawingGraphics.skippedTexts, segmentCount: drawingGraphics.segmentCount };
    },
    setRoles(roles, hidden = new Set()) {
      if (drawingGraphics) applyRoles(drawingGraphics, roles, hidden);
      requestRender();
    },
    viewport: () => vp,
    setViewport(next) {
      vp = next;
      requestRender();
    },
    fit() {
      if (!ext) return;
      // same origin as the geometry was built against (both are the extents' minimum)
      vp = fitViewport(ext, size().width, size().height);
      requestRender();
    },
    extents: () => ext,
    size,
    requestRender,
    onFrame(cb) { frameListeners.push(cb); },
    nextFrame() {
      return new Promise<number>((resolve) => { waiters.push(resolve); requestRender(); });
    },
    destroy() {
      observer.disconnect();
      app.destroy(true, { children: true });
    },
  };
  return canvas;
}
