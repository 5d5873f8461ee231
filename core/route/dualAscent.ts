// Lower bound for the Steiner tree problem in graphs by dual ascent (R. T. Wong, "A dual ascent
// approach for Steiner tree problems on a directed graph", Math. Programming 28, 1984), applied
// to the bidirected graph (each edge as two arcs of the same cost) rooted at one terminal.
// For an active terminal t, W(t) is a set of vertices that reach t over arcs of zero reduced
// cost and does not hold the root; every Steiner arborescence enters W(t), so the least reduced
// cost on its in-cut can be added to the bound and subtracted from those arcs.
// W(t) grows incrementally (the same scheme as site/dualAscentGrid.ts): a membership bit set per
// component and a heap of its in-cut arcs keyed by reduced cost + the component's total raise
// when the arc entered, so a raise is a heap pop; only the component being grown holds deferred
// reductions, written back to the arcs when another component is chosen, which then re-keys its
// own cut. The component with the smallest in-cut is grown (kept until its cut passes the next
// one by SWITCH_RATIO); a component stops when it takes in the root, or another active terminal
// (whose smaller set carries on, as with Wong's root components). Stopped early (by `stop` or the
// work budget) the bound is the sum of the raises made, still valid.

import type { Graph } from './graph';
import { ArcHeap } from './arcHeap';

export interface DualAscentResult {
  lowerBound: number;
  /** Reduced cost of arc 2e (edgeU->edgeV) and 2e+1 (edgeV->edgeU) at the end. */
  reducedCost: Float64Array;
  /** False when stopped early (the bound is still valid, only weaker). */
  complete: boolean;
  /** Work done (vertices taken in, arcs scanned, pushed or popped): deterministic for the input. */
  work: number;
}

const SWITCH_RATIO = 1.05;
/** `stop()` is asked once per this many raises (it may read a clock). */
const STOP_EVERY = 64;

/** Dual ascent from `root` (a terminal). `stop()` or `maxWork` may end it early; the bound stays valid. */
export function dualAscent(g: Graph, terminals: ArrayLike<number>, root: number, stop: () => boolean = () => false, maxWork = Infinity): DualAscentResult {
  const { n, m, offsets, adj, adjEdge, edgeU, edgeV, weight } = g;
  const rc = new Float64Array(2 * m);
  let maxW = 0;
  for (let e = 0; e < m; e++) {
    rc[2 * e] = weight[e];
    rc[2 * e + 1] = weight[e];
    if (weight[e] > maxW) maxW = weight[e];
  }
  const eps = maxW * 1e-12;
  const termSet = new Set<number>();
  for (let i = 0; i < terminals.length; i++) if (terminals[i] !== root) termSet.add(terminals[i]);
  const terms = [...termSet].sort((a, b) => a - b);
  const k = terms.length;
  if (k === 0) return { lowerBound: 0, reducedCost: rc, complete: true, work: 0 };
  const termOf = new Int32Array(n).fill(-1);
  terms.forEach((t, i) => { termOf[t] = i; });
  const words = (n + 31) >>> 5;
  const member: (Uint32Array | null)[] = new Array(k).fill(null);
  const heaps: (ArcHeap | null)[] = new Array(k).fill(null);
  const raised = new Float64Array(k);
  const cut = new Int32Array(k);
  const status = new Uint8Array(k); // 0 active, 1 finished (holds the root), 2 stopped (holds another active terminal)
  const stack: number[] = [];
  const added: number[] = [];
  const fresh = new Uint32Array(words);
  const absorbed: number[] = [];
  const tail = (a: number): number => ((a & 1) === 0 ? edgeU[a >> 1] : edgeV[a >> 1]);
  let work = 0;
  let lb = 0;

  /** Takes x and all that reaches it over zero reduced cost into component i; true when the root came in. */
  const absorb = (i: number, x0: number): boolean => {
    const bits = member[i]!, heap = heaps[i]!;
    const base = raised[i];
    let c = cut[i];
    let hitRoot = false;
    stack.length = 0;
    added.length = 0;
    stack.push(x0);
    while (stack.length > 0) {
      const x = stack.pop()!;
      if ((bits[x >>> 5] >>> (x & 31)) & 1) continue;
      bits[x >>> 5] |= 1 << (x & 31);
      fresh[x >>> 5] |= 1 << (x & 31);
      added.push(x);
      work++;
      if (x === root) hitRoot = true;
      if (termOf[x] >= 0 && termOf[x] !== i) absorbed.push(termOf[x]);
      for (let j = offsets[x]; j < offsets[x + 1]; j++) {
        const y = adj[j];
        work++;
        if (y === x || ((bits[y >>> 5] >>> (y & 31)) & 1)) continue;
        const e = adjEdge[j];
        if (rc[edgeV[e] === x ? 2 * e : 2 * e + 1] <= eps) stack.push(y);
      }
    }
    for (const x of added) {
      for (let j = offsets[x]; j < offsets[x + 1]; j++) {
        const y = adj[j];
        if (y === x) continue;
        work++;
        const e = adjEdge[j];
        const aIn = edgeV[e] === x ? 2 * e : 2 * e + 1; // y → x
        if ((bits[y >>> 5] >>> (y & 31)) & 1) {
          if ((fresh[y >>> 5] >>> (y & 31)) & 1) continue;
          c--; // the arc x → y leaves the cut: back to its reduced cost
          const aOut = aIn ^ 1;
          const r = rc[aOut] - base;
          rc[aOut] = r > 0 ? r : 0;
          continue;
        }
        c++;
        const key = rc[aIn] + base;
        rc[aIn] = key;
        heap.push(key, aIn);
      }
    }
    for (const x of added) fresh[x >>> 5] = 0;
    cut[i] = c;
    if (heap.size > 2 * c + 64) {
      let w = 0;
      for (let j = 0; j < heap.size; j++) {
        const a = heap.arcs[j], y = tail(a);
        if ((bits[y >>> 5] >>> (y & 31)) & 1) continue;
        heap.arcs[w] = a;
        heap.keys[w++] = heap.keys[j];
      }
      work += heap.size;
      heap.size = w;
      heap.heapify();
    }
    return hitRoot;
  };

  const flush = (i: number): void => {
    const heap = heaps[i]!, bits = member[i]!, D = raised[i];
    let w = 0;
    for (let j = 0; j < heap.size; j++) {
      const a = heap.arcs[j], y = tail(a);
      if ((bits[y >>> 5] >>> (y & 31)) & 1) continue;
      const r = rc[a] - D;
      rc[a] = r > 0 ? r : 0;
      heap.arcs[w++] = a;
    }
    heap.size = w;
    work += heap.size;
  };

  const resume = (i: number): void => {
    const heap = heaps[i]!, D = raised[i];
    for (let j = 0; j < heap.size; j++) { const a = heap.arcs[j]; rc[a] += D; heap.keys[j] = rc[a]; }
    heap.heapify();
    work += heap.size;
  };

  const release = (i: number): void => { member[i] = null; heaps[i] = null; };

  const queue = new ArcHeap();
  for (let i = 0; i < k; i++) {
    member[i] = new Uint32Array(words);
    heaps[i] = new ArcHeap();
    absorbed.length = 0;
    if (absorb(i, terms[i])) { status[i] = 1; flush(i); release(i); continue; }
    absorbed.length = 0;
    queue.push(cut[i], i);
  }
  let complete = true;
  let cur = -1;
  let steps = 0;
  for (;;) {
    if (work > maxWork || (++steps % STOP_EVERY === 0 && stop())) { complete = false; break; }
    if (cur < 0) {
      while (queue.size > 0 && (status[queue.arcs[0]] !== 0 || queue.keys[0] !== cut[queue.arcs[0]])) queue.pop();
      if (queue.size === 0) break;
      cur = queue.arcs[0];
      queue.pop();
      resume(cur);
    }
    const i = cur, heap = heaps[i]!, bits = member[i]!;
    let y = -1, key = 0;
    while (heap.size > 0) {
      const a = heap.arcs[0];
      key = heap.keys[0];
      heap.pop();
      work++;
      const t = tail(a);
      if ((bits[t >>> 5] >>> (t & 31)) & 1) continue;
      y = t;
      break;
    }
    if (y < 0) throw new Error(`dualAscent: terminal ${terms[i]} cannot be reached from root ${root}`);
    lb += key - raised[i];
    raised[i] = key;
    if (absorb(i, y)) { absorbed.length = 0; status[i] = 1; flush(i); release(i); cur = -1; continue; }
    let subsumed = false;
    for (const t of absorbed) if (status[t] === 0 && t !== i) subsumed = true;
    absorbed.length = 0;
    if (subsumed) { status[i] = 2; flush(i); release(i); cur = -1; continue; }
    while (queue.size > 0 && (status[queue.arcs[0]] !== 0 || queue.keys[0] !== cut[queue.arcs[0]])) queue.pop();
    if (queue.size > 0 && cut[i] > SWITCH_RATIO * queue.keys[0]) {
      flush(i);
      queue.push(cut[i], i);
      cur = -1;
    }
  }
  if (cur >= 0) flush(cur);
  return { lowerBound: lb, reducedCost: rc, complete, work };
}
