// What each trench segment carries: per utility, the conduits (radial) or the one pipe (main),
// found by following the tree from each utility's own point(s) of connection to its services.
// A service is fed from the nearest connection carrying its utility, measured along the tree.

import type { Terminal } from '../site/site';
import type { UtilitySetting } from '../settings';
import type { TrenchNetwork, TrenchSegment } from './trenchNetwork';

/** One conduit run: a utility from one point of connection to one service, along the tree. */
export interface ConduitRun {
  utility: string;
  connectionId: string;
  serviceId: string;
  connectionNode: number;
  serviceNode: number;
  /** Segments in order from the connection to the service; forward = walked from → to. */
  steps: { segment: number; forward: boolean }[];
  /** Nodes passed in order, both ends included (steps.length + 1 entries). */
  nodes: number[];
  /** Length along the tree, routing units. */
  length: number;
}

export interface UtilityLoad {
  utility: string;
  /** Radial: perService × services downstream; main: 1. */
  conduits: number;
  /** Services whose runs pass through this segment. */
  services: string[];
  /** Points of connection those runs start from. */
  connections: string[];
}

export interface SegmentContents {
  segmentId: number;
  /** Utilities carried, in the order of the utility settings; absent when nothing passes. */
  loads: UtilityLoad[];
  /** The same as a map: utility key → conduits (pipes for mains). */
  byUtility: Record<string, number>;
}

/** Adjacency of the tree: node id → incident segment indices (ascending). */
export function adjacency(net: TrenchNetwork): Map<number, number[]> {
  const adj = new Map<number, number[]>();
  for (const n of net.nodes) adj.set(n.id, []);
  net.segments.forEach((s, i) => {
    adj.get(s.from)?.push(i);
    adj.get(s.to)?.push(i);
  });
  return adj;
}

/** The segment's polyline as walked in the given direction, flat x,y pairs. */
export function orientedPoints(seg: TrenchSegment, forward: boolean): Float64Array {
  if (forward) return seg.points;
  const p = seg.points;
  const out = new Float64Array(p.length);
  for (let i = 0, j = p.length - 2; j >= 0; i += 2, j -= 2) {
    out[i] = p[j];
    out[i + 1] = p[j + 1];
  }
  return out;
}

/** Length of a flat x,y polyline. */
export function polylineLength(p: Float64Array): number {
  let len = 0;
  for (let i = 2; i < p.length; i += 2) len += Math.hypot(p[i] - p[i - 2], p[i + 1] - p[i - 1]);
  return len;
}

/** Turning angle in degrees (0 straight, 180 reversal) between direction (ax,ay) and (bx,by). */
export function turnDeg(ax: number, ay: number, bx: number, by: number): number {
  if ((ax === 0 && ay === 0) || (bx === 0 && by === 0)) return 0;
  // atan2 of |cross| and dot stays accurate near 0° and 180°, where acos does not.
  return (Math.atan2(Math.abs(ax * by - ay * bx), ax * bx + ay * by) * 180) / Math.PI;
}

/** Direction of the first (atEnd=false) or last non-zero piece of a polyline. */
export function endDirection(p: Float64Array, atEnd: boolean): [number, number] {
  const n = p.length / 2;
  if (!atEnd) {
    for (let i = 1; i < n; i++) {
      const dx = p[2 * i] - p[0];
      const dy = p[2 * i + 1] - p[1];
      if (dx !== 0 || dy !== 0) return [dx, dy];
    }
  } else {
    for (let i = n - 2; i >= 0; i--) {
      const dx = p[2 * n - 2] - p[2 * i];
      const dy = p[2 * n - 1] - p[2 * i + 1];
      if (dx !== 0 || dy !== 0) return [dx, dy];
    }
  }
  return [0, 0];
}

interface Rooted {
  parentSeg: Map<number, number>;
  dist: Map<number, number>;
}

/** Walk the tree from a root: parent segment and distance along the tree for every reachable node. */
function rootAt(net: TrenchNetwork, adj: Map<number, number[]>, root: number): Rooted {
  const parentSeg = new Map<number, number>([[root, -1]]);
  const dist = new Map<number, number>([[root, 0]]);
  const stack = [root];
  while (stack.length) {
    const v = stack.pop() as number;
    for (const si of adj.get(v) ?? []) {
      const s = net.segments[si];
      const w = s.from === v ? s.to : s.from;
      if (parentSeg.has(w)) continue;
      parentSeg.set(w, si);
      dist.set(w, (dist.get(v) as number) + s.length);
      stack.push(w);
    }
  }
  return { parentSeg, dist };
}

/** Every conduit run of every utility, with the services that could not be fed. */
export function traceRuns(
  net: TrenchNetwork,
  terminals: Terminal[],
  utilities: UtilitySetting[],
): { runs: ConduitRun[]; warnings: string[] } {
  const warnings: string[] = [];
  const adj = adjacency(net);
  const nodeOf = new Map<string, number>();
  for (const n of net.nodes) if (n.terminalId !== undefined && !nodeOf.has(n.terminalId)) nodeOf.set(n.terminalId, n.id);
  const known = new Set(utilities.map((u) => u.key));
  for (const t of terminals) {
    for (const k of t.utilities) if (!known.has(k)) warnings.push(`${t.id}: utility '${k}' has no settings; ignored`);
  }
  const rooted = new Map<number, Rooted>();
  const runs: ConduitRun[] = [];
  for (const u of utilities) {
    const conns = terminals.filter((t) => t.role === 'connection' && t.utilities.includes(u.key) && nodeOf.has(t.id));
    for (const t of terminals) {
      if (t.role !== 'service' || !t.utilities.includes(u.key)) continue;
      const sNode = nodeOf.get(t.id);
      if (sNode === undefined) continue; // unreachable terminals are reported by the router
      let best: { c: Terminal; r: Rooted; d: number } | null = null;
      for (const c of conns) {
        const cNode = nodeOf.get(c.id) as number;
        let r = rooted.get(cNode);
        if (!r) {
          r = rootAt(net, adj, cNode);
          rooted.set(cNode, r);
        }
        const d = r.dist.get(sNode);
        if (d !== undefined && (best === null || d < best.d)) best = { c, r, d };
      }
      if (!best) {
        warnings.push(`${t.id}: no point of connection for ${u.key} is connected to it`);
        continue;
      }
      const steps: ConduitRun['steps'] = [];
      const nodes = [sNode];
      let v = sNode;
      for (;;) {
        const si = best.r.parentSeg.get(v) as number;
        if (si < 0) break;
        const s = net.segments[si];
        const w = s.from === v ? s.to : s.from;
        steps.push({ segment: si, forward: s.from === w });
        nodes.push(w);
        v = w;
      }
      steps.reverse();
      nodes.reverse();
      runs.push({
        utility: u.key, connectionId: best.c.id, serviceId: t.id,
        connectionNode: nodes[0], serviceNode: sNode, steps, nodes, length: best.d,
      });
    }
  }
  return { runs, warnings };
}

/** Contents of every segment (same order as net.segments). */
export function contentsFromRuns(net: TrenchNetwork, runs: ConduitRun[], utilities: UtilitySetting[]): SegmentContents[] {
  const out: SegmentContents[] = net.segments.map((s) => ({ segmentId: s.id, loads: [], byUtility: {} }));
  for (const u of utilities) {
    const per = net.segments.map(() => ({ services: [] as string[], connections: new Set<string>() }));
    for (const r of runs) {
      if (r.utility !== u.key) continue;
      for (const st of r.steps) {
        per[st.segment].services.push(r.serviceId);
        per[st.segment].connections.add(r.connectionId);
      }
    }
    per.forEach((p, i) => {
      if (p.services.length === 0) return;
      const conduits = u.kind === 'radial' ? u.perService * p.services.length : 1;
      out[i].loads.push({ utility: u.key, conduits, services: p.services, connections: [...p.connections].sort() });
      out[i].byUtility[u.key] = conduits;
    });
  }
  return out;
}

/** Per segment: utility → conduit count, and the runs (services, connections) per utility. */
export function computeContents(net: TrenchNetwork, terminals: Terminal[], utilities: UtilitySetting[]): SegmentContents[] {
  return contentsFromRuns(net, traceRuns(net, terminals, utilities).runs, utilities);
}
