// Steiner tree on the routing grid with bends priced exactly (state expansion).
//
// The expanded graph. A state is (grid node v, direction d of travel on arrival at v): index
// v*8+d. Moving on from (v,d) in direction e costs the move (length × surface + crossings)
// plus the bend from d to e, priced by the true turning angle (bendPenalty·θ/90°); reversing
// is not a move. Every grid node also has a hub: the hub is joined to all eight of its states
// at zero cost, and a tree may only branch at a hub. So a junction can form at any node, a
// branch leaving a junction pays no bend (the fitting is a tee), and along every path between
// hubs each change of direction is charged once at its true angle. A terminal is the hub of its
// grid node; arriving at it from direction d also pays the turn into its stub (attach.ts).
// The tree is stored as grid edges (a bit per direction per node); its cost is the sum of its
// moves, the bend at each node of degree 2 and the turn into each terminal's stub.
//
// Construction: the shortest-path heuristic of Takahashi & Matsuyama (1980) on the expanded
// graph — grow from a root, each round adding the cheapest state path from the tree to a
// terminal not yet joined. While many terminals are left, the next one is taken in Prim order
// over the terminals' Voronoi MST (Mehlhorn 1988, see lowerBound.ts) so that A* (Hart, Nilsson
// & Raphael 1968; estimate = octilinear or rectilinear distance at the cheapest surface) has
// one goal; with few left, all are goals and the nearest is joined. Tree nodes are released to
// the search by coarse cells, cheapest bound first, so a round does not touch the whole tree.
// Local search: key-path exchange (as in Uchoa & Werneck 2010, "Fast local search for Steiner
// trees in graphs"): remove a path between key nodes (terminals, junctions) and reconnect the
// two parts by the cheapest state path near the old one when that is cheaper; star exchange
// (key-vertex elimination and its two-branch variant): remove the key paths at a node and
// reconnect the parts through the hub node with the least summed distance.
// Perturbation: restarts from other roots (seeded order); the cheapest tree wins.
// Effort: the time budget is converted into a number of settled states (deterministic).

import { Cancelled, type Progress } from '../../result';
import type { Anchor } from './attach';
import { bendTable, DX, DY, moveCost, styleMask, type RoutingGrid } from './routingGrid';
import { BucketQueue } from './bucketQueue';
import { makeRng } from '../rng';

export interface SiteTree {
  /** Bit d at node v: the tree uses the grid edge from v in direction d. */
  adj: Uint8Array;
  /** Tree nodes in increasing order. */
  nodes: Int32Array;
  cost: number;
  /** Anchors (by index) that were joined. */
  joined: number[];
  rounds: number;
}

export interface SolveOptions {
  seed: number;
  /** Terminal-node MST ([nodeA, nodeB, cost]) giving the order in which to join terminals while many are left. */
  terminalTree?: readonly (readonly [number, number, number])[];
  timeBudgetMs: number;
  maxRestarts?: number;
  onProgress?: Progress;
  signal?: { readonly aborted: boolean };
}

const OPP = (d: number): number => (d + 4) & 7;

/** Settled states per millisecond of time budget (a conservative single-core rate). */
export const STATES_PER_MS = 5000;
/** A* guides a construction round while at most this many terminals are left (the estimate scans them all). */
const A_STAR_MAX_GOALS = 24;
/** Side of the coarse cells that group tree nodes for lazy seeding, in grid cells. */
const CELL = 16;
/** Margin, in cells, around removed paths where an exchange looks for the new connection. */
const STAR_MARGIN = 8;

function popcount8(b: number): number {
  b = b - ((b >> 1) & 0x55);
  b = (b & 0x33) + ((b >> 2) & 0x33);
  return (b + (b >> 4)) & 0x0f;
}

export class SiteSteiner {
  private readonly g: RoutingGrid;
  private readonly off: Int32Array;
  private readonly bend: Float64Array;
  private readonly mask: number;
  private readonly dist: Float64Array;
  private readonly pred: Int32Array;
  private readonly stamp: Int32Array;
  private epoch = 0;
  private readonly heap = new BucketQueue();
  private readonly width: number;
  /** 0 free, 1 source (not entered), 2 target. */
  private readonly mark: Uint8Array;
  private readonly adj: Uint8Array;
  private treeList: number[] = [];
  private readonly anchors: readonly Anchor[];
  /** arrive[a*8+d]: turning cost into anchor a's stub when arriving in direction d. */
  private readonly arrive: Float64Array;
  private readonly anchorsAt = new Map<number, number[]>();
  private readonly joined: Uint8Array;
  private targetCost: (v: number, d: number) => number = () => 0;
  private rootNode = 0;
  /** States settled so far (the deterministic work measure). */
  work = 0;
  private workLimit = Infinity;

  constructor(g: RoutingGrid, anchors: readonly Anchor[]) {
    this.g = g;
    this.off = new Int32Array(8);
    for (let d = 0; d < 8; d++) this.off[d] = DX[d] + DY[d] * g.nx;
    this.bend = bendTable(g.params.bendPenalty);
    this.mask = styleMask(g.params.style);
    // Least move cost: one cell on the cheapest surface (bucket width, slightly under it).
    this.width = 0.999 * g.h * Math.min(1, g.params.pavementFactor);
    const ns = g.n * 8;
    this.dist = new Float64Array(ns);
    this.pred = new Int32Array(ns);
    this.stamp = new Int32Array(ns);
    this.mark = new Uint8Array(g.n);
    this.adj = new Uint8Array(g.n);
    this.anchors = anchors;
    this.arrive = new Float64Array(anchors.length * 8);
    this.joined = new Uint8Array(anchors.length);
    anchors.forEach((a, i) => {
      const list = this.anchorsAt.get(a.node);
      if (list) list.push(i);
      else this.anchorsAt.set(a.node, [i]);
      for (let d = 0; d < 8; d++) {
        if (a.ax === 0 && a.ay === 0) continue;
        const len = Math.hypot(DX[d], DY[d]);
        const cos = Math.max(-1, Math.min(1, (DX[d] * a.ax + DY[d] * a.ay) / len));
        this.arrive[i * 8 + d] = (g.params.bendPenalty * ((Math.acos(cos) * 180) / Math.PI)) / 90;
      }
    });
  }

  /**
   * Cheapest state path from every source node (mark 1) to a target (mark 2): Dijkstra, or A*
   * when `goals` lists the target nodes (estimate: octilinear or rectilinear distance to the
   * nearest goal at the cheapest surface — a lower bound on any path's cost).
   */
  private search(sources: readonly number[], seedBend: ((v: number, d: number) => number) | null, limit = Infinity, goals: readonly number[] | null = null, win: readonly number[] | null = null, lazy: readonly { lb: number; nodes: number[] }[] | null = null): { state: number; cost: number } {
    const g = this.g, off = this.off, bend = this.bend, mask = this.mask;
    const dist = this.dist, pred = this.pred, stamp = this.stamp, mark = this.mark, heap = this.heap, cost = g.cost;
    const ep = ++this.epoch;
    heap.reset(this.width);
    const nx = g.nx;
    const gx = goals ? Int32Array.from(goals, (t) => t % nx) : null;
    const gy = goals ? Int32Array.from(goals, (t) => Math.floor(t / nx)) : null;
    const scale = 0.999 * g.h * Math.min(1, g.params.pavementFactor);
    const diag = mask === 0xff ? Math.SQRT2 - 2 : -1; // octile: dx + dy + (√2 − 2)·min; rectilinear: dx + dy
    // Many goals: distance to their bounding box instead (still a lower bound).
    let bx0 = Infinity, by0 = Infinity, bx1 = -Infinity, by1 = -Infinity;
    if (gx && gy) for (let i = 0; i < gx.length; i++) { bx0 = Math.min(bx0, gx[i]); bx1 = Math.max(bx1, gx[i]); by0 = Math.min(by0, gy[i]); by1 = Math.max(by1, gy[i]); }
    const useBox = gx !== null && gx.length > A_STAR_MAX_GOALS;
    const est = (v: number): number => {
      if (!gx || !gy) return 0;
      const x = v % nx, y = (v - x) / nx;
      if (useBox) {
        const dx = Math.max(0, bx0 - x, x - bx1), dy = Math.max(0, by0 - y, y - by1);
        return (dx + dy + (diag > -1 ? diag * Math.min(dx, dy) : 0)) * scale;
      }
      let m = Infinity;
      for (let i = 0; i < gx.length; i++) {
        const dx = Math.abs(x - gx[i]), dy = Math.abs(y - gy[i]);
        const o = dx + dy + (diag > -1 ? diag * Math.min(dx, dy) : 0);
        if (o < m) m = o;
      }
      return m * scale;
    };
    const wx0 = win ? win[0] : 0, wy0 = win ? win[1] : 0, wx1 = win ? win[2] : nx, wy1 = win ? win[3] : g.ny;
    const outside = (v: number): boolean => { const x = v % nx, y = (v - x) / nx; return x < wx0 || x > wx1 || y < wy0 || y > wy1; };
    const seed = (v: number): void => {
      const bits = g.moves[v] & mask;
      if (bits === 0 || (win && outside(v))) return;
      for (let d = 0; d < 8; d++) {
        if (!((bits >> d) & 1)) continue;
        const u = v + off[d];
        if (mark[u] === 1) continue;
        const c = moveCost(g, v, d) + (seedBend ? seedBend(v, d) : 0);
        const s = u * 8 + d;
        if (stamp[s] !== ep || c < dist[s]) {
          stamp[s] = ep;
          dist[s] = c;
          pred[s] = -1;
          heap.push(c + est(u), s, c);
        }
      }
    };
    for (const v of sources) seed(v);
    // Lazy sources: groups of tree nodes released when the search could reach their bound.
    let li = 0;
    const width = this.width;
    let best = limit, bestState = -1;
    for (;;) {
      if (lazy) while (li < lazy.length && lazy[li].lb < best && lazy[li].lb < heap.peekFloor() + width) for (const v of lazy[li++].nodes) seed(v);
      const s = heap.pop();
      if (s < 0 || heap.floorKey() >= best) break;
      const k = heap.lastG;
      if (k > dist[s] || heap.lastKey >= best) continue;
      this.work++;
      const v = s >> 3, d = s & 7;
      if (mark[v] === 2) {
        const cand = k + this.targetCost(v, d);
        if (cand < best) { best = cand; bestState = s; }
      }
      const bits = g.moves[v] & mask;
      const back = OPP(d);
      for (let e = 0; e < 8; e++) {
        if (e === back || !((bits >> e) & 1)) continue;
        const u = v + off[e];
        if (mark[u] === 1 || (win && outside(u))) continue;
        const nk = k + bend[d * 8 + e] + cost[v * 8 + e];
        const s2 = u * 8 + e;
        if (stamp[s2] !== ep || nk < dist[s2]) {
          stamp[s2] = ep;
          dist[s2] = nk;
          pred[s2] = s;
          heap.push(gx ? nk + est(u) : nk, s2, nk);
        }
      }
    }
    return { state: bestState, cost: best };
  }

  /** Adds the state path ending in `state` to the tree; returns its nodes from the target back. */
  private addPath(state: number): number[] {
    const nodes: number[] = [];
    let s = state;
    for (;;) {
      const v = s >> 3, d = s & 7;
      const p = v - this.off[d];
      this.adj[p] |= 1 << d;
      this.adj[v] |= 1 << OPP(d);
      nodes.push(v);
      if (this.pred[s] < 0) { nodes.push(p); break; }
      s = this.pred[s];
    }
    for (const v of nodes) if (this.mark[v] !== 1) { this.mark[v] = 1; this.treeList.push(v); this.addToCell(v); }
    return nodes;
  }

  private terminalTargetCost = (v: number, d: number): number => {
    let best = Infinity;
    for (const a of this.anchorsAt.get(v) ?? []) {
      if (this.joined[a]) continue;
      const c = this.arrive[a * 8 + d];
      if (c < best) best = c;
    }
    return best;
  };

  /** Takahashi–Matsuyama construction from anchor `root` over the anchors in `members`. */
  private construct(root: number, members: readonly number[], opts: SolveOptions, first: boolean): boolean {
    this.adj.fill(0);
    this.mark.fill(0);
    this.joined.fill(0);
    this.treeList = [];
    const rootNode = this.anchors[root].node;
    this.rootNode = rootNode;
    this.mark[rootNode] = 1;
    this.treeList.push(rootNode);
    this.cells.clear();
    this.addToCell(rootNode);
    for (const a of this.anchorsAt.get(rootNode) ?? []) this.joined[a] = 1;
    let left = members.filter((a) => !this.joined[a]).length;
    const total = left;
    const order = this.primOrder(rootNode, members, opts.terminalTree);
    let next = 0;
    this.targetCost = this.terminalTargetCost;
    while (left > 0) {
      if (opts.signal?.aborted) {
        if (first) throw new Cancelled();
        return false;
      }
      if (!first && this.over()) return false;
      for (const a of members) if (!this.joined[a] && this.mark[this.anchors[a].node] !== 1) this.mark[this.anchors[a].node] = 2;
      const lone = this.treeList.length === 1;
      const seedBend = lone ? (v: number, d: number): number => {
        let c = Infinity;
        for (const a of this.anchorsAt.get(v) ?? []) c = Math.min(c, this.arrive[a * 8 + OPP(d)]);
        return c === Infinity ? 0 : c;
      } : null;
      // Few terminals left: all are goals (the nearest is joined). Many: the next one in MST order,
      // so A* stays focused.
      let goals = members.filter((a) => !this.joined[a]).map((a) => this.anchors[a].node);
      if (goals.length > A_STAR_MAX_GOALS) {
        while (this.joined[order[next]]) next++;
        goals = [this.anchors[order[next]].node];
        for (const a of members) if (!this.joined[a] && this.anchors[a].node !== goals[0] && this.mark[this.anchors[a].node] === 2) this.mark[this.anchors[a].node] = 0;
      }
      const r = lone ? this.search(this.treeList, seedBend, Infinity, goals) : this.search([], null, Infinity, goals, null, this.lazyCells(goals));
      for (const a of members) if (this.mark[this.anchors[a].node] === 2) this.mark[this.anchors[a].node] = 0;
      if (r.state < 0) throw new Error('siteSteiner: a terminal of the routed component was not reached');
      this.addPath(r.state);
      for (const a of members) {
        if (!this.joined[a] && this.mark[this.anchors[a].node] === 1) { this.joined[a] = 1; left--; }
      }
      if (first) opts.onProgress?.('route', 0.6 * (1 - left / Math.max(1, total)));
    }
    return true;
  }

  /** Members in Prim order over the terminal MST from the root's node (plain member order without a tree). */
  private primOrder(rootNode: number, members: readonly number[], tree?: readonly (readonly [number, number, number])[]): number[] {
    if (!tree || tree.length === 0) return members.slice();
    const adj = new Map<number, [number, number][]>();
    for (const [a, b, c] of tree) {
      (adj.get(a) ?? adj.set(a, []).get(a)!).push([b, c]);
      (adj.get(b) ?? adj.set(b, []).get(b)!).push([a, c]);
    }
    const seen = new Set<number>([rootNode]);
    const frontier: [number, number][] = [...(adj.get(rootNode) ?? [])];
    const nodeOrder: number[] = [rootNode];
    while (frontier.length) {
      let bi = 0;
      for (let i = 1; i < frontier.length; i++) if (frontier[i][1] < frontier[bi][1] || (frontier[i][1] === frontier[bi][1] && frontier[i][0] < frontier[bi][0])) bi = i;
      const [v] = frontier.splice(bi, 1)[0];
      if (seen.has(v)) continue;
      seen.add(v);
      nodeOrder.push(v);
      for (const e of adj.get(v) ?? []) if (!seen.has(e[0])) frontier.push(e);
    }
    const memberSet = new Set(members);
    const out: number[] = [];
    for (const v of nodeOrder) for (const a of this.anchorsAt.get(v) ?? []) if (memberSet.has(a)) out.push(a);
    for (const a of members) if (!out.includes(a)) out.push(a);
    return out;
  }

  /** Tree nodes by coarse cell (CELL × CELL nodes), for lazy seeding during construction. */
  private readonly cells = new Map<number, number[]>();

  private addToCell(v: number): void {
    const x = v % this.g.nx, y = (v - x) / this.g.nx;
    const key = Math.floor(y / CELL) * Math.ceil(this.g.nx / CELL) + Math.floor(x / CELL);
    const list = this.cells.get(key);
    if (list) list.push(v); else this.cells.set(key, [v]);
  }

  /** Cells of tree nodes with a lower bound on any path from them to a goal, cheapest first. */
  private lazyCells(goals: readonly number[]): { lb: number; nodes: number[] }[] {
    const nx = this.g.nx, cols = Math.ceil(nx / CELL);
    const scale = 0.999 * this.g.h * Math.min(1, this.g.params.pavementFactor);
    const octile = this.mask === 0xff;
    const out: { lb: number; nodes: number[]; key: number }[] = [];
    for (const [key, nodes] of this.cells) {
      const x0 = (key % cols) * CELL, y0 = Math.floor(key / cols) * CELL, x1 = x0 + CELL - 1, y1 = y0 + CELL - 1;
      let m = Infinity;
      for (const t of goals) {
        const gx = t % nx, gy = (t - gx) / nx;
        const dx = Math.max(0, x0 - gx, gx - x1), dy = Math.max(0, y0 - gy, gy - y1);
        const o = octile ? Math.max(dx, dy) + (Math.SQRT2 - 1) * Math.min(dx, dy) : dx + dy;
        if (o < m) m = o;
      }
      // One step back: a seed sits a move beyond its tree node.
      out.push({ lb: Math.max(0, (m - 1.5) * scale), nodes, key });
    }
    out.sort((a, b) => a.lb - b.lb || a.key - b.key);
    return out;
  }

  private isAnchorNode(v: number): boolean {
    return this.anchorsAt.has(v);
  }

  /** Full cost of the current tree: moves, bends at degree-2 nodes, turns into stubs. */
  treeCost(): number {
    const g = this.g;
    let c = 0;
    for (const v of this.treeList) {
      const bits = this.adj[v];
      if (bits === 0) continue;
      for (let d = 0; d < 4; d++) if ((bits >> d) & 1) c += moveCost(g, v, d);
      const deg = popcount8(bits);
      if (deg === 2 && !this.isAnchorNode(v)) {
        let a = -1, b = -1;
        for (let d = 0; d < 8; d++) if ((bits >> d) & 1) { if (a < 0) a = d; else b = d; }
        c += this.bend[OPP(a) * 8 + b];
      } else if (deg === 1 && this.isAnchorNode(v)) {
        let e = 0;
        while (!((bits >> e) & 1)) e++;
        let m = Infinity;
        for (const a of this.anchorsAt.get(v)!) m = Math.min(m, this.arrive[a * 8 + OPP(e)]);
        c += m;
      }
    }
    return c;
  }

  /** Key paths: maximal runs through degree-2 non-terminal nodes, each listed once. */
  private keyPaths(): { nodes: number[]; dirs: number[]; cost: number }[] {
    const out: { nodes: number[]; dirs: number[]; cost: number }[] = [];
    const isKey = (v: number): boolean => this.isAnchorNode(v) || popcount8(this.adj[v]) !== 2;
    for (const s of this.treeList) {
      if (this.adj[s] === 0 || !isKey(s)) continue;
      for (let d0 = 0; d0 < 8; d0++) {
        if (!((this.adj[s] >> d0) & 1)) continue;
        const nodes = [s];
        const dirs: number[] = [];
        let v = s, d = d0, cost = 0, prevD = -1;
        for (;;) {
          cost += moveCost(this.g, v, d);
          if (prevD >= 0) cost += this.bend[prevD * 8 + d];
          dirs.push(d);
          v += this.off[d];
          nodes.push(v);
          if (isKey(v)) break;
          prevD = d;
          const bits = this.adj[v] & ~(1 << OPP(d));
          let e = 0;
          while (!((bits >> e) & 1)) e++;
          d = e;
        }
        const end = nodes[nodes.length - 1];
        if (s < end || (s === end && d0 < OPP(dirs[dirs.length - 1]))) out.push({ nodes, dirs, cost });
      }
    }
    out.sort((a, b) => b.cost - a.cost || a.nodes[0] - b.nodes[0] || a.dirs[0] - b.dirs[0]);
    return out;
  }

  private setPath(nodes: number[], dirs: number[], on: boolean): void {
    for (let i = 0; i < dirs.length; i++) {
      const v = nodes[i], d = dirs[i], u = nodes[i + 1];
      if (on) { this.adj[v] |= 1 << d; this.adj[u] |= 1 << OPP(d); } else { this.adj[v] &= ~(1 << d); this.adj[u] &= ~(1 << OPP(d)); }
    }
  }

  /** Marks the tree component containing `start` with `value`; returns its nodes. */
  private component(start: number, value: number): number[] {
    const out = [start];
    this.mark[start] = value;
    for (let i = 0; i < out.length; i++) {
      const v = out[i];
      const bits = this.adj[v];
      for (let d = 0; d < 8; d++) {
        if (!((bits >> d) & 1)) continue;
        const u = v + this.off[d];
        if (this.mark[u] !== value) { this.mark[u] = value; out.push(u); }
      }
    }
    return out;
  }

  /** Key-path exchange until no path improves or the deadline passes; returns improvements made. */
  private improve(signal?: { readonly aborted: boolean }): number {
    let gains = 0;
    for (let pass = 0; pass < 4; pass++) {
      let improved = false;
      for (const kp of this.keyPaths()) {
        if (signal?.aborted || this.over()) return gains;
        let intact = true;
        for (let i = 0; i < kp.dirs.length && intact; i++) intact = ((this.adj[kp.nodes[i]] >> kp.dirs[i]) & 1) === 1;
        // Still a key path: an earlier exchange may have branched off an interior node.
        for (let i = 1; i < kp.nodes.length - 1 && intact; i++) intact = popcount8(this.adj[kp.nodes[i]]) === 2;
        if (!intact) continue;
        this.setPath(kp.nodes, kp.dirs, false);
        for (const v of this.treeList) this.mark[v] = 0;
        let a = this.component(kp.nodes[0], 1);
        let b = this.component(kp.nodes[kp.nodes.length - 1], 2);
        if (b.length < a.length) {
          // Search from the smaller part (state paths reverse at equal cost).
          [a, b] = [b, a];
          for (const v of a) this.mark[v] = 1;
          for (const v of b) this.mark[v] = 2;
        }
        this.targetCost = () => 0;
        // The new connection is sought near the old one: the path's box plus a margin.
        const win = [Infinity, Infinity, -Infinity, -Infinity];
        for (const v of kp.nodes) {
          const xi = v % this.g.nx, yi = (v - xi) / this.g.nx;
          win[0] = Math.min(win[0], xi - STAR_MARGIN); win[1] = Math.min(win[1], yi - STAR_MARGIN);
          win[2] = Math.max(win[2], xi + STAR_MARGIN); win[3] = Math.max(win[3], yi + STAR_MARGIN);
        }
        const r = this.search(a, null, kp.cost - 1e-9, b, win);
        if (r.state >= 0 && r.cost < kp.cost - 1e-9) {
          for (let i = 1; i < kp.nodes.length - 1; i++) this.mark[kp.nodes[i]] = 0;
          this.addPathRaw(r.state);
          improved = true;
          gains++;
        } else {
          this.setPath(kp.nodes, kp.dirs, true);
        }
        for (const v of a) this.mark[v] = 0;
        for (const v of b) this.mark[v] = 0;
        this.rebuildTreeList();
      }
      if (!improved) break;
    }
    return gains;
  }

  /** Adds the state path ending in `state`; returns the grid edges it newly set as (node, dir) pairs. */
  private addPathRaw(state: number): number[] {
    const added: number[] = [];
    let s = state;
    for (;;) {
      const v = s >> 3, d = s & 7;
      const p = v - this.off[d];
      if (!((this.adj[p] >> d) & 1)) added.push(p, d);
      this.adj[p] |= 1 << d;
      this.adj[v] |= 1 << OPP(d);
      if (this.pred[s] < 0) break;
      s = this.pred[s];
    }
    return added;
  }

  /** Bounded Dijkstra from the source nodes (mark 1); records the cheapest arrival per node. */
  private explore(sources: readonly number[], bound: number, out: Float64Array, outStamp: Int32Array, ep: number, touched: number[], win: readonly number[]): void {
    const g = this.g, off = this.off, bend = this.bend, mask = this.mask;
    const dist = this.dist, stamp = this.stamp, mark = this.mark, heap = this.heap, cost = g.cost;
    const se = ++this.epoch;
    heap.reset(this.width);
    const nx = g.nx, [wx0, wy0, wx1, wy1] = win;
    const inWin = (v: number): boolean => { const x = v % nx, y = (v - x) / nx; return x >= wx0 && x <= wx1 && y >= wy0 && y <= wy1; };
    for (const v of sources) {
      if (!inWin(v)) continue;
      if (outStamp[v] !== ep) { outStamp[v] = ep; out[v] = 0; touched.push(v); }
      const bits = g.moves[v] & mask;
      for (let d = 0; d < 8; d++) {
        if (!((bits >> d) & 1)) continue;
        const u = v + off[d];
        if (mark[u] === 1) continue;
        const c = moveCost(g, v, d);
        if (c > bound) continue;
        const st = u * 8 + d;
        if (stamp[st] !== se || c < dist[st]) { stamp[st] = se; dist[st] = c; heap.push(c, st); }
      }
    }
    for (;;) {
      const st = heap.pop();
      if (st < 0) break;
      this.work++;
      const k = heap.lastKey;
      if (k > dist[st]) continue;
      const v = st >> 3, d = st & 7;
      if (outStamp[v] !== ep) { outStamp[v] = ep; out[v] = k; touched.push(v); } else if (k < out[v]) out[v] = k;
      const bits = g.moves[v] & mask;
      const back = OPP(d);
      for (let e = 0; e < 8; e++) {
        if (e === back || !((bits >> e) & 1)) continue;
        const u = v + off[e];
        if (mark[u] === 1 || !inWin(u)) continue;
        const nk = k + bend[d * 8 + e] + cost[v * 8 + e];
        if (nk > bound) continue;
        const s2 = u * 8 + e;
        if (stamp[s2] !== se || nk < dist[s2]) { stamp[s2] = se; dist[s2] = nk; heap.push(nk, s2); }
      }
    }
  }

  private walkKeyPath(x: number, d0: number): { nodes: number[]; dirs: number[]; cost: number } {
    const nodes = [x];
    const dirs: number[] = [];
    let v = x, d = d0, cost = 0, prevD = -1;
    for (;;) {
      cost += moveCost(this.g, v, d);
      if (prevD >= 0) cost += this.bend[prevD * 8 + d];
      dirs.push(d);
      v += this.off[d];
      nodes.push(v);
      if (this.isAnchorNode(v) || popcount8(this.adj[v]) !== 2) break;
      prevD = d;
      const bits = this.adj[v] & ~(1 << OPP(d));
      let e = 0;
      while (!((bits >> e) & 1)) e++;
      d = e;
    }
    return { nodes, dirs, cost };
  }

  private starBuf: { dist: Float64Array[]; stamp: Int32Array[]; epoch: number } | null = null;

  /**
   * Star exchange: remove some key paths at key node x (all of them when x is a junction and
   * not a terminal, else a pair) and reconnect the parts through one hub node, the node
   * minimising the sum of the parts' distances to it (key-vertex elimination when x goes).
   */
  private starExchange(signal?: { readonly aborted: boolean }): number {
    if (!this.starBuf) {
      this.starBuf = { dist: [0, 1, 2, 3].map(() => new Float64Array(this.g.n)), stamp: [0, 1, 2, 3].map(() => new Int32Array(this.g.n)), epoch: 0 };
    }
    const buf = this.starBuf;
    let gains = 0;
    const keys = this.treeList.filter((v) => this.adj[v] !== 0 && (this.isAnchorNode(v) || popcount8(this.adj[v]) >= 3)).sort((a, b) => a - b);
    for (const x of keys) {
      const deg = popcount8(this.adj[x]);
      if (deg < 2) continue;
      const dirs: number[] = [];
      for (let d = 0; d < 8; d++) if ((this.adj[x] >> d) & 1) dirs.push(d);
      const groups: number[][] = [];
      if (!this.isAnchorNode(x) && deg >= 3 && deg <= 4) groups.push(dirs);
      // Pairs at a terminal, when its two branches leave less than 120° apart (a heuristic filter:
      // for straight branches at 120° or more the terminal itself is the Fermat point).
      if (this.isAnchorNode(x)) {
        for (let i = 0; i < dirs.length; i++) {
          for (let j = i + 1; j < dirs.length; j++) {
            const k = Math.abs(dirs[i] - dirs[j]) % 8;
            if (Math.min(k, 8 - k) * 45 < 120) groups.push([dirs[i], dirs[j]]);
          }
        }
      }
      for (const grp of groups) {
        if (signal?.aborted || this.over()) return gains;
        if (grp.some((d) => !((this.adj[x] >> d) & 1))) continue;
        if (this.tryStar(x, grp, buf)) gains++;
      }
    }
    return gains;
  }

  private tryStar(x: number, grp: number[], buf: { dist: Float64Array[]; stamp: Int32Array[]; epoch: number }): boolean {
    const before = this.treeCost();
    const savedNodes = this.treeList.slice();
    const savedAdj = savedNodes.map((v) => this.adj[v]);
    const paths = grp.map((d) => this.walkKeyPath(x, d));
    let old = 0;
    for (const p of paths) { old += p.cost; this.setPath(p.nodes, p.dirs, false); }
    const whole = grp.length === popcount8(this.adj[x]) + grp.length && !this.isAnchorNode(x);
    for (const v of this.treeList) this.mark[v] = 0;
    const ends = paths.map((p) => p.nodes[p.nodes.length - 1]);
    if (!whole) ends.unshift(x);
    const comps: number[][] = ends.map((e) => {
      const c = this.component(e, 3);
      for (const v of c) this.mark[v] = 0;
      return c;
    });
    const restore = (): void => {
      for (const p of paths) this.setPath(p.nodes, p.dirs, true);
      this.rebuildTreeList();
    };
    if (comps.length > 4) { restore(); return false; }
    // Node-level distances from every part, bounded by the removed cost.
    const ep = ++buf.epoch;
    const touched: number[][] = comps.map(() => []);
    // The hub is sought within the bounding box of the removed paths plus a margin.
    const win = [Infinity, Infinity, -Infinity, -Infinity];
    for (const p of paths) {
      for (const v of p.nodes) {
        const xi = v % this.g.nx, yi = (v - xi) / this.g.nx;
        win[0] = Math.min(win[0], xi - STAR_MARGIN); win[1] = Math.min(win[1], yi - STAR_MARGIN);
        win[2] = Math.max(win[2], xi + STAR_MARGIN); win[3] = Math.max(win[3], yi + STAR_MARGIN);
      }
    }
    comps.forEach((c, k) => {
      for (const v of c) this.mark[v] = 1;
      this.explore(c, old / 2, buf.dist[k], buf.stamp[k], ep, touched[k], win);
      for (const v of c) this.mark[v] = 0;
    });
    let best = Infinity, hub = -1;
    for (const v of touched[0]) {
      let sum = buf.dist[0][v];
      for (let k = 1; k < comps.length && sum < best; k++) sum = buf.stamp[k][v] === ep ? sum + buf.dist[k][v] : Infinity;
      if (sum < best || (sum === best && v < hub)) { best = sum; hub = v; }
    }
    if (!(best < old - 1e-9)) { restore(); return false; }
    // Reconnect: the part holding the hub first (or the hub alone), then each part to the union.
    const added: number[] = [];
    const holder = comps.findIndex((c) => c.includes(hub));
    const union = new Set<number>(holder >= 0 ? comps[holder] : [hub]);
    const order = comps.map((_, k) => k).filter((k) => k !== holder);
    this.targetCost = () => 0;
    let failed = false;
    for (let i = 0; i < order.length; i++) {
      const k = order[i];
      // Parts not yet joined are closed to the search, so no path runs through them (no cycles).
      for (let j = i; j < order.length; j++) for (const v of comps[order[j]]) this.mark[v] = 1;
      for (const v of union) this.mark[v] = 2;
      const r = this.search(comps[k], null);
      for (let j = i; j < order.length; j++) for (const v of comps[order[j]]) this.mark[v] = 0;
      for (const v of union) this.mark[v] = 0;
      if (r.state < 0) { failed = true; break; }
      const a = this.addPathRaw(r.state);
      for (let i = 0; i < a.length; i += 2) added.push(a[i], a[i + 1]);
      for (const v of comps[k]) union.add(v);
      let s = r.state;
      for (;;) { union.add(s >> 3); union.add((s >> 3) - this.off[s & 7]); if (this.pred[s] < 0) break; s = this.pred[s]; }
    }
    const undo = (): void => {
      for (let i = 0; i < added.length; i += 2) {
        const v = added[i], d = added[i + 1];
        this.adj[v] = 0;
        this.adj[v + this.off[d]] = 0;
      }
      for (const v of this.treeList) this.adj[v] = 0;
      savedNodes.forEach((v, i) => { this.adj[v] = savedAdj[i]; });
      this.rebuildTreeList();
    };
    if (failed) { undo(); return false; }
    this.rebuildTreeList();
    this.prune();
    const after = this.treeCost();
    if (after < before - 1e-9) return true;
    undo();
    return false;
  }

  /** Re-lists the tree from the root node (the tree is connected) and marks it as source. */
  private rebuildTreeList(): void {
    for (const v of this.treeList) this.mark[v] = 0;
    const list = [this.rootNode];
    this.mark[this.rootNode] = 1;
    for (let i = 0; i < list.length; i++) {
      const v = list[i];
      const bits = this.adj[v];
      for (let d = 0; d < 8; d++) {
        if (!((bits >> d) & 1)) continue;
        const u = v + this.off[d];
        if (this.mark[u] !== 1) { this.mark[u] = 1; list.push(u); }
      }
    }
    this.treeList = list;
  }

  /** Removes non-terminal leaves. */
  private prune(): void {
    const stack = this.treeList.filter((v) => popcount8(this.adj[v]) === 1 && !this.isAnchorNode(v));
    while (stack.length) {
      const v = stack.pop()!;
      const bits = this.adj[v];
      if (popcount8(bits) !== 1 || this.isAnchorNode(v)) continue;
      let d = 0;
      while (!((bits >> d) & 1)) d++;
      const u = v + this.off[d];
      this.adj[v] = 0;
      this.adj[u] &= ~(1 << OPP(d));
      if (popcount8(this.adj[u]) === 1 && !this.isAnchorNode(u)) stack.push(u);
    }
    this.rebuildTreeList();
  }

  /** Internal check: every member's node is reached from the first one through the tree. */
  private assertSpans(adj: Uint8Array, members: readonly number[]): void {
    const start = this.anchors[members[0]].node;
    const seen = new Set<number>([start]);
    const stack = [start];
    while (stack.length) {
      const v = stack.pop()!;
      for (let d = 0; d < 8; d++) {
        if (!((adj[v] >> d) & 1)) continue;
        const u = v + this.off[d];
        if (!seen.has(u)) { seen.add(u); stack.push(u); }
      }
    }
    const missing = members.filter((a) => !seen.has(this.anchors[a].node));
    if (missing.length) throw new Error(`siteSteiner: internal error, tree misses anchors ${missing.join(', ')}`);
  }

  /** The search's per-state buffer (g.n·8 entries), free for other use once solve() has returned; overwritten by the next solve. */
  stateBuffer(): Float64Array {
    return this.dist;
  }

  /** Past the work budget (deterministic: no clock is read). */
  private over(): boolean {
    return this.work > this.workLimit;
  }

  /**
   * Solves for the anchors in `members` (all in one grid component). The time budget becomes a
   * work budget of STATES_PER_MS settled states per millisecond, so the same input gives the same
   * tree on any machine (a busy machine takes longer than the budget; the signal still cancels).
   * The first construction always completes.
   */
  solve(members: readonly number[], opts: SolveOptions): SiteTree {
    this.work = 0;
    this.workLimit = opts.timeBudgetMs * STATES_PER_MS;
    if (members.length === 0) return { adj: new Uint8Array(this.g.n), nodes: new Int32Array(0), cost: 0, joined: [], rounds: 0 };
    const rand = makeRng(opts.seed);
    const order = members.slice();
    // Root order: the given first member, then a seeded shuffle of the rest.
    for (let i = order.length - 1; i > 1; i--) {
      const j = 1 + Math.floor(rand() * i);
      [order[i], order[j]] = [order[j], order[i]];
    }
    const restarts = Math.min(order.length, opts.maxRestarts ?? 3);
    let bestAdj: Uint8Array | null = null;
    let bestCost = Infinity;
    let rounds = 0;
    for (let r = 0; r < restarts; r++) {
      const done = this.construct(order[r], members, opts, r === 0);
      if (!done) break;
      this.prune();
      // Key-path exchange runs to a local optimum; star exchanges (the costlier move, first
      // construction only) then try to leave it; both repeat only after a star gain.
      for (let round = 0; round < 4; round++) {
        this.improve(opts.signal);
        this.prune();
        if (r > 0 || opts.signal?.aborted || this.over()) break;
        const b = this.starExchange(opts.signal);
        this.prune();
        if (b === 0 || opts.signal?.aborted || this.over()) break;
      }
      const c = this.treeCost();
      rounds++;
      if (c < bestCost - 1e-9) { bestCost = c; bestAdj = this.adj.slice(); }
      opts.onProgress?.('route', 0.6 + (0.4 * (r + 1)) / restarts);
      if (opts.signal?.aborted || this.over()) break;
    }
    const adj = bestAdj!;
    this.assertSpans(adj, members);
    const nodes: number[] = [];
    for (let v = 0; v < adj.length; v++) if (adj[v] !== 0) nodes.push(v);
    if (nodes.length === 0) nodes.push(this.anchors[members[0]].node);
    return { adj, nodes: Int32Array.from(nodes), cost: bestCost, joined: members.slice(), rounds };
  }
}
