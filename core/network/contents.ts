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

/** The tree walked from one point of connection, by node index (index into net.nodes). */
export interface RootedTree {
  connectionId: string;
  root: number;
  /** Segment index leading to each node from the root side; -1 at the root and off the tree. */
  parentSeg: Int32Array;
  /** Distance along the tree from the root (routing units); NaN off the tree. */
  dist: Float64Array;
}

/** Which point of connection feeds each service, per utility, and the trees walked from them. */
export interface Feeds {
  nodeIndex: Map<number, number>;
  /** Node index at each end of each segment. */
  segFrom: Int32Array;
  segTo: Int32Array;
  trees: Map<string, RootedTree>;
  /** Per utility key: the fed services in terminal order. */
  byUtility: Map<string, { serviceId: string; connectionId: string; node: number; dist: number }[]>;
  warnings: string[];
}

function rootTree(net: TrenchNetwork, segFrom: Int32Array, segTo: Int32Array, adj: Int32Array[], root: number, connectionId: string): RootedTree {
  const n = net.nodes.length;
  const parentSeg = new Int32Array(n).fill(-1);
  const dist = new Float64Array(n).fill(NaN);
  dist[root] = 0;
  const stack = [root];
  while (stack.length) {
    const v = stack.pop() as number;
    for (const si of adj[v]) {
      const w = segFrom[si] === v ? segTo[si] : segFrom[si];
      if (!Number.isNaN(dist[w])) continue;
      parentSeg[w] = si;
      dist[w] = dist[v] + net.segments[si].length;
      stack.push(w);
    }
  }
  return { connectionId, root, parentSeg, dist };
}

/** Feed every service from the nearest point of connection (along the tree) carrying each utility. */
export function computeFeeds(net: TrenchNetwork, terminals: readonly Terminal[], utilities: readonly UtilitySetting[]): Feeds {
  const warnings: string[] = [];
  const nodeIndex = new Map<number, number>();
  net.nodes.forEach((n, i) => nodeIndex.set(n.id, i));
  const segFrom = Int32Array.from(net.segments, (s) => nodeIndex.get(s.from) ?? -1);
  const segTo = Int32Array.from(net.segments, (s) => nodeIndex.get(s.to) ?? -1);
  const adj: Int32Array[] = [];
  {
    const lists: number[][] = net.nodes.map(() => []);
    net.segments.forEach((_s, i) => {
      if (segFrom[i] >= 0) lists[segFrom[i]].push(i);
      if (segTo[i] >= 0) lists[segTo[i]].push(i);
    });
    for (const l of lists) adj.push(Int32Array.from(l));
  }
  const nodeOf = new Map<string, number>();
  net.nodes.forEach((n, i) => {
    if (n.terminalId !== undefined && !nodeOf.has(n.terminalId)) nodeOf.set(n.terminalId, i);
  });
  const known = new Set(utilities.map((u) => u.key));
  for (const t of terminals) {
    for (const k of t.utilities) if (!known.has(k)) warnings.push(`${t.id}: utility '${k}' has no settings; ignored`);
  }
  const trees = new Map<string, RootedTree>();
  const byUtility: Feeds['byUtility'] = new Map();
  for (const u of utilities) {
    const conns = terminals.filter((t) => t.role === 'connection' && t.utilities.includes(u.key) && nodeOf.has(t.id));
    for (const c of conns) {
      if (!trees.has(c.id)) trees.set(c.id, rootTree(net, segFrom, segTo, adj, nodeOf.get(c.id) as number, c.id));
    }
    const fed: { serviceId: string; connectionId: string; node: number; dist: number }[] = [];
    for (const t of terminals) {
      if (t.role !== 'service' || !t.utilities.includes(u.key)) continue;
      const node = nodeOf.get(t.id);
      if (node === undefined) continue; // unreachable terminals are reported by the router
      let best: { id: string; d: number } | null = null;
      for (const c of conns) {
        const d = (trees.get(c.id) as RootedTree).dist[node];
        if (!Number.isNaN(d) && (best === null || d < best.d)) best = { id: c.id, d };
      }
      if (!best) {
        warnings.push(`${t.id}: no point of connection for ${u.key} is connected to it`);
        continue;
      }
      fed.push({ serviceId: t.id, connectionId: best.id, node, dist: best.d });
    }
    byUtility.set(u.key, fed);
  }
  return { nodeIndex, segFrom, segTo, trees, byUtility, warnings };
}

/** Calls visit(segmentIndex) for each segment from a node up to the root of its tree. */
export function walkToRoot(f: Feeds, tree: RootedTree, node: number, visit: (segment: number, childNode: number) => void): void {
  let v = node;
  for (let si = tree.parentSeg[v]; si >= 0; si = tree.parentSeg[v]) {
    visit(si, v);
    v = f.segFrom[si] === v ? f.segTo[si] : f.segFrom[si];
  }
}

/** Every conduit run of every utility in full (segments and nodes in order), with warnings. */
export function traceRuns(
  net: TrenchNetwork,
  terminals: Terminal[],
  utilities: UtilitySetting[],
  feeds: Feeds = computeFeeds(net, terminals, utilities),
): { runs: ConduitRun[]; warnings: string[] } {
  const runs: ConduitRun[] = [];
  for (const u of utilities) {
    for (const fed of feeds.byUtility.get(u.key) ?? []) {
      const tree = feeds.trees.get(fed.connectionId) as RootedTree;
      const steps: ConduitRun['steps'] = [];
      const nodes = [net.nodes[fed.node].id];
      walkToRoot(feeds, tree, fed.node, (si, child) => {
        const parent = feeds.segFrom[si] === child ? feeds.segTo[si] : feeds.segFrom[si];
        steps.push({ segment: si, forward: feeds.segFrom[si] === parent });
        nodes.push(net.nodes[parent].id);
      });
      steps.reverse();
      nodes.reverse();
      runs.push({
        utility: u.key, connectionId: fed.connectionId, serviceId: fed.serviceId,
        connectionNode: nodes[0], serviceNode: net.nodes[fed.node].id, steps, nodes, length: fed.dist,
      });
    }
  }
  return { runs, warnings: feeds.warnings };
}

/** Contents of every segment (same order as net.segments), from the feeds. */
export function contentsFromFeeds(net: TrenchNetwork, feeds: Feeds, utilities: readonly UtilitySetting[]): SegmentContents[] {
  const out: SegmentContents[] = net.segments.map((s) => ({ segmentId: s.id, loads: [], byUtility: {} }));
  for (const u of utilities) {
    const services: (string[] | undefined)[] = new Array(net.segments.length);
    const conns: (Set<string> | undefined)[] = new Array(net.segments.length);
    for (const fed of feeds.byUtility.get(u.key) ?? []) {
      walkToRoot(feeds, feeds.trees.get(fed.connectionId) as RootedTree, fed.node, (si) => {
        (services[si] ??= []).push(fed.serviceId);
        (conns[si] ??= new Set()).add(fed.connectionId);
      });
    }
    for (let i = 0; i < net.segments.length; i++) {
      const list = services[i];
      if (!list) continue;
      const conduits = u.kind === 'radial' ? u.perService * list.length : 1;
      out[i].loads.push({ utility: u.key, conduits, services: list, connections: [...(conns[i] as Set<string>)].sort() });
      out[i].byUtility[u.key] = conduits;
    }
  }
  return out;
}

/** Per segment: utility → conduit count, and the runs (services, connections) per utility. */
export function computeContents(net: TrenchNetwork, terminals: Terminal[], utilities: UtilitySetting[]): SegmentContents[] {
  return contentsFromFeeds(net, computeFeeds(net, terminals, utilities), utilities);
}
