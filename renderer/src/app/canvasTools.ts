// What a click, drag or hover on the canvas means for the current tool: add a service snapped to
// the nearest wall (with a cue), add a connection point, pick and move points, hover labels.

import { nearestWall } from '../../../core/site/placeTerminals';
import { toDrawing, toLocal } from '../../../core/site/siteFrame';
import type { PointInput, Site } from '../../../core/site/site';
import { fromMetres } from '../../../core/units';
import type { NavigationHooks } from '../canvas/navigation';
import type { PointsOverlay, SnapCue } from '../canvas/pointsOverlay';
import type { SiteCanvas } from '../canvas/siteCanvas';
import { drawingToScreen } from '../canvas/viewport';
import type { ProjectStore } from '../state/history';
import type { RunsStore } from '../state/runs';
import type { UiStore } from '../state/ui';
import type { Session } from './session';

export interface CanvasToolDeps {
  view: SiteCanvas;
  store: ProjectStore;
  ui: UiStore;
  runs: RunsStore;
  points: PointsOverlay;
  session(): Session | null;
  showCursor(text: string): void;
  showTip(text: string | null, sx: number, sy: number): void;
}

const PICK_PX = 10;

export function nextPointId(points: readonly PointInput[], prefix: string): string {
  let n = 1;
  const used = new Set(points.map((p) => p.id));
  while (used.has(`${prefix}${n}`)) n++;
  return `${prefix}${n}`;
}

export function createCanvasTools(deps: CanvasToolDeps): NavigationHooks {
  const { view, store, ui } = deps;
  let dragging: { id: string; pos: { x: number; y: number } } | null = null;

  const currentSite = (): Site | null => {
    const s = deps.session();
    if (!s) return null;
    const r = s.model.site(store.get().roles, store.get().units);
    return r.ok ? r.value : null;
  };

  /** The wall point a service at (x, y) drawing units would snap to, within the snap distance. */
  const snapToWall = (x: number, y: number): SnapCue => {
    const site = currentSite();
    if (!site) return { pointer: { x, y }, target: null, normal: null };
    const local = toLocal(site.frame, [x, y]);
    const hit = nearestWall(site, local[0], local[1]);
    const tol = fromMetres(store.get().route.snapToleranceM, site.units);
    if (!hit || hit.dist > tol) return { pointer: { x, y }, target: null, normal: null };
    return { pointer: { x, y }, target: toDrawing(site.frame, hit.x, hit.y), normal: { x: hit.nx, y: hit.ny } };
  };

  const pointAt = (sx: number, sy: number): PointInput | null => {
    let best: PointInput | null = null;
    let bestD = PICK_PX;
    for (const p of store.get().points) {
      const s = drawingToScreen(view.viewport(), p.x, p.y);
      const d = Math.hypot(s.x - sx, s.y - sy);
      if (d <= bestD) { best = p; bestD = d; }
    }
    return best;
  };

  const hoverText = (sx: number, sy: number): string | null => {
    const p = pointAt(sx, sy);
    if (p) return `${p.role === 'service' ? 'Service' : 'Connection'} ${p.id}\n${p.utilities.join(', ')}`;
    const run = deps.runs.get().current;
    if (!run) return null;
    const vp = view.viewport();
    for (const b of run.view.pullBoxes) {
      const s = drawingToScreen(vp, b.x, b.y);
      if (Math.hypot(s.x - sx, s.y - sy) <= 7) return b.label;
    }
    let best: { id: number; d: number } | null = null;
    for (const seg of run.view.segments) {
      const pts = seg.points;
      for (let i = 0; i + 3 < pts.length; i += 2) {
        const a = drawingToScreen(vp, pts[i], pts[i + 1]);
        const b = drawingToScreen(vp, pts[i + 2], pts[i + 3]);
        const d = distToSegment(sx, sy, a.x, a.y, b.x, b.y);
        if (d <= 6 && (!best || d < best.d)) best = { id: seg.id, d };
      }
    }
    if (!best) return null;
    const row = run.output.takeOff.segments.find((r) => r.segmentId === best!.id);
    if (!row) return `Segment ${best.id}`;
    const L = run.output.takeOff.labels.length;
    return `Segment ${row.segmentId}${row.stub ? ' (stub)' : ''}: ${row.length.toFixed(1)} ${L}, ${row.surface}\n` +
      `carries ${row.carriesText || 'nothing'}\n${row.width.toFixed(2)} × ${row.depth.toFixed(2)} ${L} (w × d)` +
      (row.crossings ? `\n${row.crossingsText}` : '');
  };

  return {
    leftDragPans: () => ui.get().tool === 'pan',
    onCursor(x, y, sx, sy) {
      deps.showCursor(`X ${x.toFixed(3)}  Y ${y.toFixed(3)}`);
      const tool = ui.get().tool;
      if (tool === 'add-service') deps.points.setCue(snapToWall(x, y));
      else if (tool === 'add-connection') deps.points.setCue({ pointer: { x, y }, target: { x, y }, normal: null });
      else if (!dragging) deps.points.setCue(null);
      if (!dragging) deps.showTip(hoverText(sx, sy), sx, sy);
      view.requestRender();
    },
    onPick(x, y, sx, sy) {
      const tool = ui.get().tool;
      const points = store.get().points;
      if (tool === 'add-service') {
        const cue = snapToWall(x, y);
        if (!cue.target) {
          ui.set({ message: { kind: 'warn', text: 'No building wall within the snap distance here; click closer to a wall (or raise the snap distance in Route settings).' } });
          return;
        }
        const id = nextPointId(points, 'S');
        store.edit({ kind: 'add-point', point: { id, x: cue.target.x, y: cue.target.y, role: 'service', utilities: [...store.get().utilitiesOn] } });
        ui.set({ selectedPoint: id, message: null });
      } else if (tool === 'add-connection') {
        const id = nextPointId(points, 'POC');
        store.edit({ kind: 'add-point', point: { id, x, y, role: 'connection', utilities: [...store.get().utilitiesOn] } });
        ui.set({ selectedPoint: id, message: null });
      } else if (tool === 'select') {
        ui.set({ selectedPoint: pointAt(sx, sy)?.id ?? null });
      }
    },
    onDragStart(_x, _y, sx, sy) {
      if (ui.get().tool !== 'select') return false;
      const p = pointAt(sx, sy);
      if (!p) return false;
      dragging = { id: p.id, pos: { x: p.x, y: p.y } };
      ui.set({ selectedPoint: p.id });
      return true;
    },
    onDragMove(x, y) {
      if (!dragging) return;
      const p = store.get().points.find((q) => q.id === dragging!.id);
      if (!p) return;
      const cue = p.role === 'service' ? snapToWall(x, y) : { pointer: { x, y }, target: { x, y }, normal: null };
      dragging.pos = cue.target ?? { x, y };
      deps.points.setCue(cue);
      deps.points.setPoints(store.get().points.map((q) => (q.id === p.id ? { ...q, ...dragging!.pos } : q)), p.id);
      view.requestRender();
    },
    onDragEnd(x, y) {
      if (!dragging) return;
      const id = dragging.id;
      const p = store.get().points.find((q) => q.id === id);
      dragging = null;
      deps.points.setCue(null);
      if (!p) return;
      const cue = p.role === 'service' ? snapToWall(x, y) : { pointer: { x, y }, target: { x, y }, normal: null };
      if (!cue.target) {
        ui.set({ message: { kind: 'warn', text: `${id} stays where it was: no building wall within the snap distance of where it was dropped.` } });
        deps.points.setPoints(store.get().points, id);
        view.requestRender();
        return;
      }
      if (!store.edit({ kind: 'update-point', id, patch: { x: cue.target.x, y: cue.target.y } })) {
        deps.points.setPoints(store.get().points, id);
        view.requestRender();
      }
    },
    onLeave() {
      deps.showCursor('—');
      deps.showTip(null, 0, 0);
      if (!dragging) deps.points.setCue(null);
      view.requestRender();
    },
  };
}

function distToSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax, dy = by - ay;
  const l2 = dx * dx + dy * dy;
  const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / l2));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}
