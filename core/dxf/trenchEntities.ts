// What Furrow draws: the trench network as plain entities (polylines, circles, text) in the
// drawing's own units and frame (drawing = local / scale + origin), before any DXF syntax.

import { noticeText } from '../notice';
import type { TrenchNetwork } from '../network/trenchNetwork';
import { DEFAULT_DXF_LAYERS, type DxfLayerNames, type UtilitySetting } from '../settings';
import type { Extents } from './drawing';
import type { Terminal } from '../site/site';
import { fromMetres, unitLabels } from '../units';
import { aciForHex } from './dxfFormat';
import { trenchOutline } from './trenchOutline';

export type OutEntity =
  | { type: 'polyline'; layer: string; color?: number; hex?: string; points: Float64Array; closed: boolean }
  | { type: 'circle'; layer: string; color?: number; hex?: string; x: number; y: number; r: number }
  | { type: 'line'; layer: string; color?: number; hex?: string; x1: number; y1: number; x2: number; y2: number }
  | { type: 'text'; layer: string; color?: number; x: number; y: number; height: number; rotationDeg: number; text: string };

export interface OutLayer { name: string; color: number }

/** Per-segment facts from the take-off: full trench width (routing units) and what it carries. */
export interface SegmentDrawInfo {
  segmentId: number;
  width: number;
  /** utility key → conduit (or pipe) count */
  carries: Readonly<Record<string, number>>;
}

export interface PullBoxMark { x: number; y: number; utilities: readonly string[] }

export interface TrenchDrawingInput {
  net: TrenchNetwork;
  terminals: readonly Terminal[];
  utilities: readonly UtilitySetting[];
  segments?: readonly SegmentDrawInfo[];
  pullBoxes?: readonly PullBoxMark[];
  layers?: Partial<DxfLayerNames>;
  /** Extents of the original drawing (drawing units): the notes go to the right of them. */
  extents?: Extents;
  /** Width used when a segment has no take-off entry, routing units (default 12 in; practice). */
  defaultWidth?: number;
}

export interface TrenchDrawing {
  layers: OutLayer[];
  names: DxfLayerNames;
  entities: OutEntity[];
}

// Symbol sizes in metres (drawing aids, not quantities).
const MARK_R_M = 0.35;
const PULLBOX_SIDE_M = 0.9; // a 24 x 36 in handhole is a common size (practice); drawn square
const LABEL_H_M = 0.6;
const NOTES_H_M = 1.2;

/** Layer names with defaults filled in. */
export function layerNames(partial?: Partial<DxfLayerNames>): DxfLayerNames {
  return { ...DEFAULT_DXF_LAYERS, ...(partial ?? {}) };
}

export function buildTrenchDrawing(input: TrenchDrawingInput): TrenchDrawing {
  const { net } = input;
  const names = layerNames(input.layers);
  const { originX, originY, scale } = net.frame;
  const u = net.units;
  const toD = (v: number): number => v / scale; // routing units → drawing units (lengths)
  const X = (x: number): number => x / scale + originX;
  const Y = (y: number): number => y / scale + originY;
  const pts = (local: Float64Array): Float64Array => {
    const out = new Float64Array(local.length);
    for (let i = 0; i < local.length; i += 2) { out[i] = X(local[i]); out[i + 1] = Y(local[i + 1]); }
    return out;
  };
  const util = new Map(input.utilities.map((x) => [x.key, x]));
  const utilColor = (key: string): { color: number; hex?: string } => {
    const s = util.get(key);
    return s ? { color: aciForHex(s.color), hex: s.color } : { color: 7 };
  };
  const info = new Map((input.segments ?? []).map((s) => [s.segmentId, s]));
  const defaultWidth = input.defaultWidth ?? fromMetres(0.3048, u);
  const markR = toD(fromMetres(MARK_R_M, u));
  const labelH = toD(fromMetres(LABEL_H_M, u));
  const ents: OutEntity[] = [];

  // Centreline: one polyline per segment, proposed excavation in white (APWA).
  for (const s of net.segments) {
    ents.push({ type: 'polyline', layer: names.centerline, points: pts(s.points), closed: false });
  }

  // Outline: buffered and unioned in local units, then moved to the drawing frame.
  const degree = new Map<number, number>();
  for (const s of net.segments) for (const n of [s.from, s.to]) degree.set(n, (degree.get(n) ?? 0) + 1);
  const widthOf = (id: number): number => info.get(id)?.width ?? defaultWidth;
  const jointR = new Map<number, number>();
  for (const s of net.segments) for (const n of [s.from, s.to]) jointR.set(n, Math.max(jointR.get(n) ?? 0, widthOf(s.id) / 2));
  const joints = net.nodes.filter((n) => (degree.get(n.id) ?? 0) >= 2).map((n) => ({ x: n.x, y: n.y, radius: jointR.get(n.id) ?? 0 }));
  for (const ring of trenchOutline(net.segments.map((s) => ({ points: s.points, width: widthOf(s.id) })), joints)) {
    ents.push({ type: 'polyline', layer: names.outline, points: pts(ring), closed: true });
  }

  // Pull boxes: nested squares, one per utility in its APWA colour.
  for (const pb of input.pullBoxes ?? []) {
    const keys = pb.utilities.length ? pb.utilities : [''];
    keys.forEach((k, i) => {
      const h = toD(fromMetres(PULLBOX_SIDE_M, u)) / 2 + i * markR * 0.3;
      const cx = X(pb.x), cy = Y(pb.y);
      ents.push({ type: 'polyline', layer: names.pullBox, ...utilColor(k), closed: true, points: Float64Array.of(cx - h, cy - h, cx + h, cy - h, cx + h, cy + h, cx - h, cy + h) });
    });
  }

  // Services (concentric circles) and connections (diamonds), one ring per utility; id beside.
  const unreachable = new Set(net.unreachable.map((x) => x.id));
  for (const t of input.terminals) {
    const cx = X(t.x), cy = Y(t.y);
    t.utilities.forEach((k, i) => {
      const r = markR * (1 + 0.35 * i);
      if (t.role === 'service') ents.push({ type: 'circle', layer: names.service, ...utilColor(k), x: cx, y: cy, r });
      else ents.push({ type: 'polyline', layer: names.service, ...utilColor(k), closed: true, points: Float64Array.of(cx, cy - r * 1.4, cx + r * 1.4, cy, cx, cy + r * 1.4, cx - r * 1.4, cy) });
    });
    if (t.snapDistance > 0) ents.push({ type: 'line', layer: names.service, x1: X(t.given.x), y1: Y(t.given.y), x2: cx, y2: cy });
    const tag = unreachable.has(t.id) ? `${t.id} (NOT CONNECTED)` : t.id;
    ents.push({ type: 'text', layer: names.service, x: cx + markR * 2, y: cy + markR * 2, height: labelH, rotationDeg: 0, text: tag });
  }

  // Labels: segment id, length, contents, at the middle of the segment along its longest piece.
  const lenLabel = unitLabels(u).length;
  // utilities in the order of the settings, unknown keys after them alphabetically
  const rank = (k: string): number => { const i = input.utilities.findIndex((x) => x.key === k); return i < 0 ? Infinity : i; };
  const byUtilityOrder = (a: string, b: string): number => rank(a) - rank(b) || (a < b ? -1 : a > b ? 1 : 0);
  for (const s of net.segments) {
    const carried = info.get(s.id)?.carries ?? {};
    const contents = Object.keys(carried).sort(byUtilityOrder).filter((k) => carried[k] > 0).map((k) => `${k} ${carried[k]}`).join(', ');
    const text = `S${s.id} ${s.length.toFixed(1)} ${lenLabel}${contents ? ' ' + contents : ''}`;
    const at = labelAnchor(s.points);
    const off = widthOf(s.id) / 2 + fromMetres(LABEL_H_M, u) * 0.5;
    ents.push({ type: 'text', layer: names.label, x: X(at.x - at.sin * off), y: Y(at.y + at.cos * off), height: labelH, rotationDeg: at.angleDeg, text });
  }

  // Notes: the verification notice (core/notice.ts), beside the drawing.
  const ext = input.extents ?? networkExtents(net, X, Y);
  const spanX = Math.max(ext.maxX - ext.minX, 1e-9), spanY = Math.max(ext.maxY - ext.minY, 1e-9);
  const notesH = Math.max(toD(fromMetres(NOTES_H_M, u)), spanY / 80);
  const nx = ext.maxX + Math.max(spanX * 0.05, notesH * 4);
  noticeText('\n').split('\n').forEach((line, i) => {
    ents.push({ type: 'text', layer: names.notes, x: nx, y: ext.maxY - notesH * (1 + i * 1.6), height: notesH, rotationDeg: 0, text: line });
  });

  const layers: OutLayer[] = [
    { name: names.centerline, color: 7 },
    { name: names.outline, color: 8 },
    { name: names.pullBox, color: 7 },
    { name: names.service, color: 7 },
    { name: names.label, color: 7 },
    { name: names.notes, color: 7 },
  ];
  return { layers, names, entities: ents };
}

function labelAnchor(p: Float64Array): { x: number; y: number; angleDeg: number; cos: number; sin: number } {
  let total = 0;
  for (let i = 2; i < p.length; i += 2) total += Math.hypot(p[i] - p[i - 2], p[i + 1] - p[i - 1]);
  let acc = 0;
  for (let i = 2; i < p.length; i += 2) {
    const l = Math.hypot(p[i] - p[i - 2], p[i + 1] - p[i - 1]);
    if (acc + l >= total / 2 && l > 0) {
      const t = (total / 2 - acc) / l;
      let dx = (p[i] - p[i - 2]) / l, dy = (p[i + 1] - p[i - 1]) / l;
      if (dx < -1e-12 || (Math.abs(dx) <= 1e-12 && dy < 0)) { dx = -dx; dy = -dy; } // keep text upright
      return { x: p[i - 2] + (p[i] - p[i - 2]) * t, y: p[i - 1] + (p[i + 1] - p[i - 1]) * t, angleDeg: (Math.atan2(dy, dx) * 180) / Math.PI, cos: dx, sin: dy };
    }
    acc += l;
  }
  return { x: p[0] ?? 0, y: p[1] ?? 0, angleDeg: 0, cos: 1, sin: 0 };
}

function networkExtents(net: TrenchNetwork, X: (x: number) => number, Y: (y: number) => number): Extents {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const n of net.nodes) {
    minX = Math.min(minX, X(n.x)); maxX = Math.max(maxX, X(n.x));
    minY = Math.min(minY, Y(n.y)); maxY = Math.max(maxY, Y(n.y));
  }
  if (!Number.isFinite(minX)) return { minX: X(0), minY: Y(0), maxX: X(0), maxY: Y(0) };
  return { minX, minY, maxX, maxY };
}
