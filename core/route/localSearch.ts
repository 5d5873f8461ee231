// Local search for Steiner trees in graphs after Uchoa & Werneck, "Fast local search for Steiner
// trees in graphs" (ALENEX 2010): key-path exchange and key-vertex elimination. A key vertex is a
// terminal or a vertex of tree degree >= 3; a key path joins two key vertices through degree-2
// Steiner vertices. A move removes one key path (two components) or one Steiner key vertex with
// its incident key paths (d components) and reconnects the pieces as cheaply as a bounded
// multi-source Dijkstra (Voronoi regions of the pieces) plus Kruskal over the pieces allows.
// The move is kept when it is strictly cheaper; the result is tidied by MST + leaf pruning.

import type { Graph } from './graph';
import { IndexedHeap } from './heap';
import { mstPrune, pruneLeaves, TreeScratch, treeVertices } from './tree';

const EPS = 1e-9;

export class LocalSearch {
  private readonly localId: Int32Array;
  private readonly label: Int32Array;
  private readonly dist: Float64Array;
  private readonly pred: Int32Array;
  private readonly touched: Int32Array;
  private touchedCount = 0;
  private readonly heap: IndexedHeap;
  private readonly removed: Uint8Array; // per edge id
  private readonly seed: Uint8Array; // tree vertices a reconnection may start from
  private readonly seedList: number[] = [];
  private readonly treeDist: Float64Array;
  private readonly stack: Int32Array;
  private readonly scratch: TreeScratch;
  // tree index (rebuilt after each accepted move)
  private verts: number[] = [];
  private tOff = new Int32Array(0);
  private tAdj = new Int32Array(0);
  private tEdge = new Int32Array(0);

  constructor(private readonly g: Graph) {
    this.localId = new Int32Array(g.n).fill(-1);
    this.label = new Int32Array(g.n).fill(-1);
    this.dist = new Float64Array(g.n).fill(Infinity);
    this.pred = new Int32Array(g.n).fill(-1);
    this.touched = new Int32Array(g.n);
    this.heap = new IndexedHeap(g.n);
    this.removed = new Uint8Array(g.m);
    this.seed = new Uint8Array(g.n);
    this.treeDist = new Float64Array(g.n);
    this.stack = new Int32Array(g.n);
    this.scratch = new TreeScratch(g);
  }

  /**
   * Applies improving moves until none is left (or `stop()` says so). Weights come from `g`
   * (the graph given to the constructor, or `weightGraph` when set, sharing its structure).
   */
  improve(edges: Int32Array, isTerminal: Uint8Array, stop: () => boolean, weightGraph?: Graph): Int32Array {
    const g = weightGraph ?? this.g;
    let tree = edges;
    let improved = true;
    while (improved && !stop()) {
      improved = false;
      // key-path exchange, round-robin: after a success re-index and go on from the same place
      this.index(tree);
      let paths = this.keyPaths(isTerminal, g);
      for (let p = 0; p < paths.length && !stop(); p++) {
        const next = this.tryMove(tree, paths[p].edges, paths[p].inner, paths[p].cost, isTerminal, g, stop);
        if (next) {
          tree = next;
          improved = true;
          this.index(tree);
          paths = this.keyPaths(isTerminal, g);
        }
      }
      // key-vertex elimination
      for (let i = 0; i < this.verts.length && !stop(); i++) {
        const v = this.verts[i];
        if (isTerminal[v] || this.tOff[i + 1] - this.tOff[i] < 3) continue;
        const rem: number[] = [];
        const inner: number[] = [v];
        let cost = 0;
        for (const p of paths) {
          if (p.a !== v && p.b !== v) continue;
          for (const e of p.edges) rem.push(e);
          for (const x of p.inner) inner.push(x);
          cost += p.cost;
        }
        const next = this.tryMove(tree, rem, inner, cost, isTerminal, g, stop);
        if (next) {
          tree = next;
          improved = true;
          this.index(tree);
          paths = this.keyPaths(isTerminal, g);
        }
      }
      // Steiner-vertex elimination (MST over the tree's vertices minus one Steiner vertex)
      if (!stop()) {
        const next = this.eliminateVertices(tree, isTerminal, g, stop);
        if (next !== tree) {
          tree = next;
          improved = true;
        }
      }
      // Steiner-vertex insertion (MST over the tree's vertices plus one outside vertex)
      if (!stop()) {
        const next = this.insertVertices(tree, isTerminal, g, stop);
        if (next !== tree) {
          tree = next;
          improved = true;
        }
      }
    }
    this.clearIndex();
    return tree;
  }

  private index(tree: Int32Array): void {
    this.clearIndex();
    const g = this.g;
    const verts = treeVertices(g, tree, this.scratch);
    this.verts = verts;
    const k = verts.length;
    for (let i = 0; i < k; i++) this.localId[verts[i]] = i;
    const off = new Int32Array(k + 1);
    for (const e of tree) {
      off[this.localId[g.edgeU[e]] + 1]++;
      off[this.localId[g.edgeV[e]] + 1]++;
    }
    for (let i = 0; i < k; i++) off[i + 1] += off[i];
    const fill = off.slice(0, k);
    const adj = new Int32Array(2 * tree.length);
    const ed = new Int32Array(2 * tree.length);
    for (const e of tree) {
      const a = this.localId[g.edgeU[e]];
      const b = this.localId[g.edgeV[e]];
      adj[fill[a]] = b;
      ed[fill[a]++] = e;
      adj[fill[b]] = a;
      ed[fill[b]++] = e;
    }
    this.tOff = off;
    this.tAdj = adj;
    this.tEdge = ed;
  }

  private clearIndex(): void {
    for (const v of this.verts) this.localId[v] = -1;
    this.verts = [];
  }

  /**
   * Steiner-vertex elimination: for each Steiner vertex v of the tree, the MST of the subgraph
   * induced by the other tree vertices (Kruskal over the induced edges sorted once); kept, after
   * leaf pruning, when it spans them and is cheaper.
   */
  private eliminateVertices(tree: Int32Array, isTerminal: Uint8Array, g: Graph, stop: () => boolean): Int32Array {
    const { offsets, adj, adjEdge, weight, edgeU, edgeV } = g;
    const mark = this.label; // -1 between calls; 1 = tree vertex
    const uf = this.pred;
    let cur = tree;
    let curCost = 0;
    for (const e of cur) curCost += weight[e];
    let verts = treeVertices(g, cur, this.scratch);
    const induced = (): number[] => {
      for (const v of verts) mark[v] = 1;
      const out: number[] = [];
      for (const u of verts)
        for (let j = offsets[u]; j < offsets[u + 1]; j++) {
          const v = adj[j];
          if (mark[v] === 1 && u < v) out.push(adjEdge[j]);
        }
      for (const v of verts) mark[v] = -1;
      return out.sort((a, b) => weight[a] - weight[b] || a - b);
    };
    let edges = induced();
    const find = (x: number): number => {
      while (uf[x] !== x) x = uf[x] = uf[uf[x]];
      return x;
    };
    for (let qi = 0; qi < verts.length && !stop(); qi++) {
      const v = verts[qi];
      if (isTerminal[v]) continue;
      for (const x of verts) uf[x] = x;
      const chosen: number[] = [];
      let cost = 0;
      for (const e of edges) {
        const a = edgeU[e];
        const b = edgeV[e];
        if (a === v || b === v) continue;
        const ra = find(a);
        const rb = find(b);
        if (ra === rb) continue;
        uf[ra] = rb;
        chosen.push(e);
        cost += weight[e];
        if (cost >= curCost - EPS) break;
      }
      for (const x of verts) uf[x] = -1;
      if (cost >= curCost - EPS || chosen.length !== verts.length - 2) continue;
      const next = pruneLeaves(g, Int32Array.from(chosen), isTerminal, this.scratch);
      let c1 = 0;
      for (const e of next) c1 += weight[e];
      if (c1 < curCost - EPS) {
        cur = next;
        curCost = c1;
        verts = treeVertices(g, cur, this.scratch);
        edges = induced();
        qi = -1;
      }
    }
    return cur;
  }

  /**
   * Steiner-vertex insertion (after Minoux's MST-based insertion): for each outside vertex with at
   * least two tree neighbours, the MST of the tree's vertices plus that vertex is the MST of the
   * current tree edges plus its edges into the tree; keep it (after leaf pruning) when cheaper.
   */
  private insertVertices(tree: Int32Array, isTerminal: Uint8Array, g: Graph, stop: () => boolean): Int32Array {
    const { offsets, adj, adjEdge, weight, edgeU, edgeV } = g;
    const mark = this.label; // -1 everywhere between calls; 1 = tree vertex, 2 = tried
    const uf = this.pred; // reused as union-find parent, reset below
    let cur = tree;
    let curCost = 0;
    for (const e of cur) curCost += weight[e];
    let verts = treeVertices(g, cur, this.scratch);
    for (const v of verts) mark[v] = 1;
    let sorted = Array.from(cur).sort((a, b) => weight[a] - weight[b] || a - b);
    const tried: number[] = [];
    for (let qi = 0; qi < verts.length && !stop(); qi++) {
      const a = verts[qi];
      for (let j = offsets[a]; j < offsets[a + 1]; j++) {
        const v = adj[j];
        if (mark[v] !== -1) continue;
        mark[v] = 2;
        tried.push(v);
        // v's edges into the tree, cheapest first
        const ve: number[] = [];
        for (let k = offsets[v]; k < offsets[v + 1]; k++) if (mark[adj[k]] === 1) ve.push(adjEdge[k]);
        if (ve.length < 2) continue;
        ve.sort((x, y) => weight[x] - weight[y] || x - y);
        // Kruskal over sorted tree edges merged with ve
        uf[v] = v;
        for (const x of verts) uf[x] = x;
        const find = (x: number): number => {
          while (uf[x] !== x) x = uf[x] = uf[uf[x]];
          return x;
        };
        const chosen: number[] = [];
        let i1 = 0;
        let i2 = 0;
        let cost = 0;
        while (i1 < sorted.length || i2 < ve.length) {
          let e: number;
          if (i2 >= ve.length || (i1 < sorted.length && weight[sorted[i1]] <= weight[ve[i2]])) e = sorted[i1++];
          else e = ve[i2++];
          const ra = find(edgeU[e]);
          const rb = find(edgeV[e]);
          if (ra === rb) continue;
          uf[ra] = rb;
          chosen.push(e);
          cost += weight[e];
          if (cost >= curCost - EPS) break;
        }
        for (const x of verts) uf[x] = -1;
        uf[v] = -1;
        if (cost >= curCost - EPS || chosen.length !== verts.length) continue;
        const next = pruneLeaves(g, Int32Array.from(chosen), isTerminal, this.scratch);
        let c1 = 0;
        for (const e of next) c1 += weight[e];
        if (c1 < curCost - EPS) {
          cur = next;
          curCost = c1;
          for (const x of verts) mark[x] = -1;
          verts = treeVertices(g, cur, this.scratch);
          for (const x of verts) mark[x] = 1;
          sorted = Array.from(cur).sort((p, q) => weight[p] - weight[q] || p - q);
          qi = -1; // rescan neighbours of the new tree; tried vertices stay tried this pass
          break;
        }
      }
    }
    for (const x of verts) mark[x] = -1;
    for (const x of tried) mark[x] = -1;
    return cur;
  }

  private keyPaths(isTerminal: Uint8Array, g: Graph): { a: number; b: number; edges: number[]; inner: number[]; cost: number }[] {
    const out: { a: number; b: number; edges: number[]; inner: number[]; cost: number }[] = [];
    const { tOff, tAdj, tEdge, verts } = this;
    const isKey = (i: number) => isTerminal[verts[i]] === 1 || tOff[i + 1] - tOff[i] !== 2;
    for (let s = 0; s < verts.length; s++) {
      if (!isKey(s)) continue;
      for (let j = tOff[s]; j < tOff[s + 1]; j++) {
        let prev = s;
        let cur = tAdj[j];
        const edges = [tEdge[j]];
        const inner: number[] = [];
        let cost = g.weight[tEdge[j]];
        while (!isKey(cur)) {
          inner.push(verts[cur]);
          const k0 = tOff[cur];
          const k = tAdj[k0] === prev && tEdge[k0] === edges[edges.length - 1] ? k0 + 1 : k0;
          prev = cur;
          cur = tAdj[k];
          edges.push(tEdge[k]);
          cost += g.weight[tEdge[k]];
        }
        if (s < cur) out.push({ a: verts[s], b: verts[cur], edges, inner, cost });
      }
    }
    return out;
  }

  /** Remaining tree edges plus each chosen edge with the search paths behind both its ends, tidied; null unless cheaper. */
  private rebuild(tree: Int32Array, chosen: number[], isTerminal: Uint8Array, g: Graph): Int32Array | null {
    const { removed, pred } = this;
    const keep = new Set<number>();
    for (const e of tree) if (!removed[e]) keep.add(e);
    for (const e of chosen) {
      keep.add(e);
      for (const x0 of [g.edgeU[e], g.edgeV[e]]) {
        let x = x0;
        while (pred[x] !== -1) {
          const pe = pred[x];
          keep.add(pe);
          x = g.edgeU[pe] === x ? g.edgeV[pe] : g.edgeU[pe];
        }
      }
    }
    const nodes = treeVertices(this.g, Int32Array.from(keep), this.scratch);
    const next = mstPrune(g, nodes, isTerminal, this.scratch);
    let c0 = 0;
    for (const e of tree) c0 += g.weight[e];
    let c1 = 0;
    for (const e of next) c1 += g.weight[e];
    return c1 < c0 - EPS ? next : null;
  }

  /**
   * Two pieces (labels 0 and 1 on the tree vertices, at distance 0): the shortest path between
   * them, searched from the smaller piece only and cut off at remCost. Dijkstra pops in
   * non-decreasing order, so once the popped distance reaches the best entry into the other
   * piece, that entry is the shortest connection.
   */
  private reconnectTwo(tree: Int32Array, remCost: number, isTerminal: Uint8Array, g: Graph, stop: () => boolean): Int32Array | null {
    const { label, dist, pred, heap } = this;
    const treeCount = this.touchedCount;
    let size0 = 0;
    for (let i = 0; i < treeCount; i++) if (label[this.touched[i]] === 0) size0++;
    const src = size0 <= treeCount - size0 ? 0 : 1;
    const tgt = 1 - src;
    for (let i = 0; i < treeCount; i++) if (label[this.touched[i]] === src && this.seed[this.touched[i]]) heap.push(this.touched[i], 0);
    const { offsets, adj, adjEdge, weight } = g;
    let best = remCost - EPS;
    let bestEdge = -1;
    let steps = 0;
    while (heap.size > 0) {
      if ((++steps & 1023) === 0 && stop()) {
        bestEdge = -1; // abandoned: the move is not applied
        break;
      }
      const u = heap.pop();
      const du = dist[u];
      if (du >= best) break;
      for (let j = offsets[u]; j < offsets[u + 1]; j++) {
        const v = adj[j];
        const lv = label[v];
        if (lv === src && dist[v] === 0) continue;
        const nd = du + weight[adjEdge[j]];
        if (lv === tgt && dist[v] === 0) {
          if (nd < best) {
            best = nd;
            bestEdge = adjEdge[j];
          }
          continue;
        }
        if (nd < dist[v]) {
          if (dist[v] === Infinity) this.touched[this.touchedCount++] = v;
          dist[v] = nd;
          pred[v] = adjEdge[j];
          label[v] = src;
          heap.push(v, nd);
        }
      }
    }
    heap.clear();
    if (bestEdge < 0) return null;
    return this.rebuild(tree, [bestEdge], isTerminal, g);
  }

  /**
   * Seeds for the reconnection search: tree vertices within tree distance `radius` of the removed
   * part. A cheaper reconnection starting farther away would be a different move; bounding the
   * seeds keeps each move local instead of searching around the whole tree.
   */
  private markSeeds(rem: number[], radius: number, g: Graph): void {
    const { label, seed, seedList, treeDist, localId, tOff, tAdj, tEdge, verts, removed } = this;
    const stack = this.stack;
    let top = 0;
    for (const e of rem)
      for (let end = 0; end < 2; end++) {
        const x = end === 0 ? g.edgeU[e] : g.edgeV[e];
        if (label[x] < 0 || seed[x]) continue;
        seed[x] = 1;
        seedList.push(x);
        treeDist[x] = 0;
        stack[top++] = x;
      }
    while (top > 0) {
      const x = stack[--top];
      const i = localId[x];
      for (let j = tOff[i]; j < tOff[i + 1]; j++) {
        const e = tEdge[j];
        if (removed[e]) continue;
        const y = verts[tAdj[j]];
        const d = treeDist[x] + g.weight[e];
        if (d > radius || (seed[y] && treeDist[y] <= d)) continue;
        if (!seed[y]) {
          seed[y] = 1;
          seedList.push(y);
        }
        treeDist[y] = d;
        stack[top++] = y;
      }
    }
  }

  /** Removes `rem` edges and `inner` vertices, reconnects the pieces; returns the new tree if cheaper. */
  private tryMove(tree: Int32Array, rem: number[], inner: number[], remCost: number, isTerminal: Uint8Array, g: Graph, stop: () => boolean): Int32Array | null {
    if (remCost <= EPS) return null;
    const { label, dist, pred, heap, removed, verts, tOff, tAdj, tEdge } = this;
    for (const e of rem) removed[e] = 1;
    for (const x of inner) label[x] = -2; // freed
    // label the pieces by flood fill over the remaining tree
    let pieces = 0;
    const stack = this.stack;
    let top = 0;
    this.touchedCount = 0;
    heap.clear();
    for (let i = 0; i < verts.length; i++) {
      const v0 = verts[i];
      if (label[v0] !== -1) continue;
      label[v0] = pieces;
      stack[top++] = i;
      while (top > 0) {
        const a = stack[--top];
        const va = verts[a];
        dist[va] = 0;
        pred[va] = -1;
        this.touched[this.touchedCount++] = va;
        for (let j = tOff[a]; j < tOff[a + 1]; j++) {
          if (removed[tEdge[j]]) continue;
          const b = tAdj[j];
          if (label[verts[b]] === -1) {
            label[verts[b]] = pieces;
            stack[top++] = b;
          }
        }
      }
      pieces++;
    }
    for (const x of inner) label[x] = -1;
    this.markSeeds(rem, pieces === 2 ? Infinity : remCost, g);
    let result: Int32Array | null = null;
    if (pieces === 2) {
      result = this.reconnectTwo(tree, remCost, isTerminal, g, stop);
    } else if (pieces > 2) {
      for (let i = 0; i < this.touchedCount; i++) if (this.seed[this.touched[i]]) heap.push(this.touched[i], 0);
      // bounded multi-source Dijkstra (Voronoi regions of the pieces). Searching to half the
      // removed cost keeps the regions local; boundary edges may still end at a tentative vertex.
      const { offsets, adj, adjEdge, weight } = g;
      const radius = remCost / 2;
      let steps = 0;
      let abandoned = false;
      while (heap.size > 0) {
        if ((++steps & 1023) === 0 && stop()) {
          abandoned = true;
          break;
        }
        const u = heap.pop();
        const du = dist[u];
        if (du >= radius) break;
        const lu = label[u];
        for (let j = offsets[u]; j < offsets[u + 1]; j++) {
          const v = adj[j];
          const nd = du + weight[adjEdge[j]];
          if (nd < dist[v]) {
            if (dist[v] === Infinity) this.touched[this.touchedCount++] = v;
            dist[v] = nd;
            pred[v] = adjEdge[j];
            label[v] = lu;
            heap.push(v, nd);
          }
        }
      }
      // boundary edges between pieces, cheapest first, Kruskal over pieces
      const cand: number[] = [];
      const candCost: number[] = [];
      const scan = abandoned ? 0 : this.touchedCount; // an abandoned move is not applied
      for (let i = 0; i < scan; i++) {
        const u = this.touched[i];
        for (let j = offsets[u]; j < offsets[u + 1]; j++) {
          const v = adj[j];
          if (v <= u && dist[v] !== Infinity) continue; // each pair once when both touched
          if (dist[v] === Infinity || label[v] === label[u]) continue;
          const c = dist[u] + weight[adjEdge[j]] + dist[v];
          if (c < remCost - EPS) {
            cand.push(adjEdge[j]);
            candCost.push(c);
          }
        }
      }
      const order = cand.map((_, i) => i).sort((x, y) => candCost[x] - candCost[y] || cand[x] - cand[y]);
      const uf = new Int32Array(pieces);
      for (let i = 0; i < pieces; i++) uf[i] = i;
      const find = (x: number): number => {
        while (uf[x] !== x) x = uf[x] = uf[uf[x]];
        return x;
      };
      let total = 0;
      let joined = 0;
      const chosen: number[] = [];
      for (const i of order) {
        const e = cand[i];
        const ra = find(label[g.edgeU[e]]);
        const rb = find(label[g.edgeV[e]]);
        if (ra === rb) continue;
        uf[ra] = rb;
        total += candCost[i];
        chosen.push(e);
        if (++joined === pieces - 1 || total >= remCost - EPS) break;
      }
      if (joined === pieces - 1 && total < remCost - EPS) {
        result = this.rebuild(tree, chosen, isTerminal, g);
      }
    }
    // reset scratch
    for (let i = 0; i < this.touchedCount; i++) {
      const v = this.touched[i];
      dist[v] = Infinity;
      pred[v] = -1;
      label[v] = -1;
    }
    for (const x of inner) label[x] = -1;
    for (const x of this.seedList) this.seed[x] = 0;
    this.seedList.length = 0;
    for (const e of rem) removed[e] = 0;
    heap.clear();
    return result;
  }
}
