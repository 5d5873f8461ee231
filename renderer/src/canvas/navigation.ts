// Pan (drag with the pan tool, middle button, or space+drag), zoom to the cursor (wheel) and the
// cursor position in drawing units. Tool clicks that are not navigation are handed to `onPick`.

import type { SiteCanvas } from './siteCanvas';
import { panBy, screenToDrawing, wheelFactor, zoomAt } from './viewport';

export interface NavigationHooks {
  /** True when a plain left drag should pan (the pan tool is active). */
  leftDragPans(): boolean;
  onCursor(x: number, y: number, sx: number, sy: number): void;
  onPick(x: number, y: number, sx: number, sy: number): void;
  /** Pointer down on a draggable item (e.g. a point); return true to take over the drag. */
  onDragStart?(x: number, y: number, sx: number, sy: number): boolean;
  onDragMove?(x: number, y: number): void;
  onDragEnd?(x: number, y: number): void;
  onLeave(): void;
}

export function attachNavigation(view: SiteCanvas, hooks: NavigationHooks): () => void {
  const el = view.canvas;
  let spaceDown = false;
  let panning: { x: number; y: number; moved: number } | null = null;
  let itemDrag = false;
  let downAt: { x: number; y: number } | null = null;

  const local = (ev: MouseEvent): { sx: number; sy: number } => {
    const r = el.getBoundingClientRect();
    return { sx: ev.clientX - r.left, sy: ev.clientY - r.top };
  };

  const onPointerDown = (ev: PointerEvent): void => {
    const { sx, sy } = local(ev);
    downAt = { x: sx, y: sy };
    const wantsPan = ev.button === 1 || (ev.button === 0 && (spaceDown || hooks.leftDragPans()));
    if (ev.button === 0 && !wantsPan && hooks.onDragStart) {
      const p = screenToDrawing(view.viewport(), sx, sy);
      if (hooks.onDragStart(p.x, p.y, sx, sy)) {
        itemDrag = true;
        el.setPointerCapture(ev.pointerId);
        return;
      }
    }
    if (wantsPan) {
      panning = { x: sx, y: sy, moved: 0 };
      el.setPointerCapture(ev.pointerId);
      el.classList.add('panning');
      ev.preventDefault();
    }
  };

  const onPointerMove = (ev: PointerEvent): void => {
    const { sx, sy } = local(ev);
    const p = screenToDrawing(view.viewport(), sx, sy);
    hooks.onCursor(p.x, p.y, sx, sy);
    if (itemDrag) { hooks.onDragMove?.(p.x, p.y); return; }
    if (!panning) return;
    const dx = sx - panning.x;
    const dy = sy - panning.y;
    panning = { x: sx, y: sy, moved: panning.moved + Math.abs(dx) + Math.abs(dy) };
    view.setViewport(panBy(view.viewport(), dx, dy));
  };

  const onPointerUp = (ev: PointerEvent): void => {
    const { sx, sy } = local(ev);
    const p = screenToDrawing(view.viewport(), sx, sy);
    if (itemDrag) {
      itemDrag = false;
      hooks.onDragEnd?.(p.x, p.y);
    } else if (panning) {
      const moved = panning.moved;
      panning = null;
      el.classList.remove('panning');
      if (moved < 3 && ev.button === 0 && !spaceDown && !hooks.leftDragPans()) hooks.onPick(p.x, p.y, sx, sy);
    } else if (ev.button === 0 && downAt && Math.abs(downAt.x - sx) + Math.abs(downAt.y - sy) < 4) {
      hooks.onPick(p.x, p.y, sx, sy);
    }
    downAt = null;
    if (el.hasPointerCapture(ev.pointerId)) el.releasePointerCapture(ev.pointerId);
  };

  const onWheel = (ev: WheelEvent): void => {
    ev.preventDefault();
    const { sx, sy } = local(ev);
    const dy = ev.deltaMode === 1 ? ev.deltaY * 33 : ev.deltaY;
    view.setViewport(zoomAt(view.viewport(), sx, sy, wheelFactor(dy)));
    const p = screenToDrawing(view.viewport(), sx, sy);
    hooks.onCursor(p.x, p.y, sx, sy);
  };

  const isTyping = (t: EventTarget | null): boolean =>
    t instanceof HTMLElement && (t.tagName === 'INPUT' || t.tagName === 'SELECT' || t.tagName === 'TEXTAREA' || t.isContentEditable);
  const onKeyDown = (ev: KeyboardEvent): void => {
    if (ev.code === 'Space' && !isTyping(ev.target)) { spaceDown = true; el.classList.add('pan-ready'); ev.preventDefault(); }
  };
  const onKeyUp = (ev: KeyboardEvent): void => {
    if (ev.code === 'Space') { spaceDown = false; el.classList.remove('pan-ready'); }
  };
  const onLeave = (): void => hooks.onLeave();

  el.addEventListener('pointerdown', onPointerDown);
  el.addEventListener('pointermove', onPointerMove);
  el.addEventListener('pointerup', onPointerUp);
  el.addEventListener('pointerleave', onLeave);
  el.addEventListener('wheel', onWheel, { passive: false });
  window.addEventListener('keydown', onKeyDown);
  window.addEventListener('keyup', onKeyUp);
  return () => {
    el.removeEventListener('pointerdown', onPointerDown);
    el.removeEventListener('pointermove', onPointerMove);
    el.removeEventListener('pointerup', onPointerUp);
    el.removeEventListener('pointerleave', onLeave);
    el.removeEventListener('wheel', onWheel);
    window.removeEventListener('keydown', onKeyDown);
    window.removeEventListener('keyup', onKeyUp);
  };
}
