// Lower bound for the routing grid's Steiner tree by dual ascent (R. T. Wong, "A dual ascent
// approach for Steiner tree problems on a directed graph", Math. Programming 28, 1984), run on
// the grid's moves as arcs in both directions, each priced at its plain move cost (surface and
// crossings, the same value the tree's cost counts per grid edge). Bends and the turns into the
// stubs are left out: they are never negative, so dropping them can only lower the optimum and
// the bound holds for the bend-priced tree.
//
// The ascent. The tree is rooted at one terminal. For another terminal t, W(t) is a set of grid
// nodes that reach t over arcs of zero reduced cost and does not hold the root; every tree has
// an arc entering W(t), so the least reduced cost on W(t)'s in-cut may be added to the bound and
// taken off every arc of that cut. W(t) is grown incrementally: a per-component membership bit
// set and a binary heap of the arcs entering it, keyed by (reduced cost when the arc entered the
// cut + the component's total raise at that time), so a raise is one heap pop and the reduced
// cost of every cut arc is key − total raise, without touching the cut. Only the component
// being grown holds such deferred reductions; when another one is chosen they are written back
// to the reduced costs and the next component re-keys its cut from them (an arc another
// component has saturated meanwhile comes out with a raise of zero and is absorbed).
// Choice: the active component with the smallest in-cut (counted exactly); the grown one keeps
// going until its cut exceeds the next smallest by SWITCH_RATIO, so the write-back is not paid
// on every step. A component stops when it takes in the root (finished) or another active
// terminal (its cut then holds that terminal's smaller one, as in Wong's root components).
// Effort: a work count (nodes taken in and arcs pushed or popped), no clock, so the same input
// gives the same bound; stopped early the bound is the sum of the raises so far, still valid.

import { ArcHeap } from '../arcHeap';
import { DX, DY, styleMask, type RoutingGrid } from './routingGrid';

export interface GridDualAscentResult {
  lowerBound: number;
  /** False when the work budget ended it (the bound is still valid, only weaker). */
  complete: boolean;
  work: number;
}

/** Grow the chosen component until its cut exceeds the next smallest by this factor. */
const SWITCH_RATIO = 1.05;
/** `stop()` is asked once per this many raises. */
const STOP_EVERY = 256;

/**
 * Dual ascent on the routing grid from `root` over the terminal nodes (duplicates and the root
 * are ignored). `scratch`, when given, must hold at least g.n·8 entries; it is overwritten (the
 * router lends the solver's state buffer, which is free once the tree is built). Stops after
 * about `maxWork` steps, or when `stop()` (asked every STOP_EVERY raises, e.g. a cancel signal)
 * says so; either way the bound is valid.
 */
export function gridDualAscent(g: RoutingGrid, terminalNodes: readonly number[], root: number, maxWork = Infinity, scratch?: Float64Array, stop: () => boolean = () => false): GridDualAscentResult {
  const n = g.n, nx = g.nx, moves = g.moves, cost = g.cost;
  const mask = styleMask(g.params.style);
  const off = new Int32Array(8);
  for (let d = 0; d < 8; d++) off[d] = DX[d] + DY[d] * nx;
  // rc[y*8+d]: reduced cost of the arc from y in direction d, starting at the grid edge's cost.
  const rc = scratch && scratch.length >= n * 8 ? scratch : new Float64Array(n * 8);
  let maxW = 0;
  for (let v = 0; v < n; v++) {
    const bits = moves[v] & mask;
    if (bits === 0) continue;
    for (let d = 0; d < 8; d++) {
      if (!((bits >> d) & 1)) continue;
      const c = d < 4 ? cost[v * 8 + d] : cost[(v + off[d]) * 8 + d - 4];
      rc[v * 8 + d] = c;
      if (c > maxW) maxW = c;
    }
  }
  const eps = maxW * 1e-12;
  const terms = [...new Set(terminalNodes)].filter((t) => t !== root).sort((a, b) => a - b);
  const k = terms.length;
  if (k === 0) return { lowerBound: 0, complete: true, work: 0 };
  const termOf = new Map<number, number>();
  terms.forEach((t, i) => termOf.set(t, i));
  const words = (n + 31) >>> 5;
  const member: (Uint32Array | null)[] = new Array(k).fill(null);
  const heaps: (ArcHeap | null)[] = new Array(k).fill(null);
  const raised = new Float64Array(k); // total raise per component
  const cut = new Int32Array(k);
  const status = new Uint8Array(k); // 0 active, 1 finished (holds the root), 2 stopped (holds another active terminal)
  const stack: number[] = [];
  const added: number[] = [];
  const fresh = new Uint32Array(words); // members taken in by the current absorb
  const absorbed: number[] = [];
  let work = 0;
  let lb = 0;

  /**
   * Takes x and everything reaching it over zero reduced cost into component i; true when the
   * root was taken in. While an arc is in the grown component's cut its rc entry holds its key
   * (reduced cost + total raise); it goes back to a plain reduced cost when it leaves the cut.
   * First the new members are found, then their arcs are sorted into the cut, so arcs between
   * new members never enter the heap.
   */
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
      const ti = termOf.get(x);
      if (ti !== undefined && ti !== i) absorbed.push(ti);
      const mv = moves[x] & mask;
      for (let e = 0; e < 8; e++) {
        if (!((mv >> e) & 1)) continue;
        const y = x + off[e];
        work++;
        if (!((bits[y >>> 5] >>> (y & 31)) & 1) && rc[y * 8 + ((e + 4) & 7)] <= eps) stack.push(y);
      }
    }
    for (const x of added) {
      const mv = moves[x] & mask;
      for (let e = 0; e < 8; e++) {
        if (!((mv >> e) & 1)) continue;
        const y = x + off[e];
        work++;
        if ((bits[y >>> 5] >>> (y & 31)) & 1) {
          if ((fresh[y >>> 5] >>> (y & 31)) & 1) continue; // both new: the arcs were never in the cut
          // The arc x→y leaves the cut: back to its reduced cost.
          c--;
          const r = rc[x * 8 + e] - base;
          rc[x * 8 + e] = r > 0 ? r : 0;
          continue;
        }
        c++;
        const a = y * 8 + ((e + 4) & 7); // arc y→x enters the cut
        const r = rc[a];
        rc[a] = r + base;
        heap.push(r + base, a);
      }
    }
    for (const x of added) fresh[x >>> 5] = 0;
    cut[i] = c;
    // Arcs whose tail joined through another arc stay in the heap until popped: drop them when
    // they outnumber the cut, so the heap stays within a few times the cut (memory and speed).
    if (heap.size > 2 * c + 64) {
      let w = 0;
      for (let j = 0; j < heap.size; j++) {
        const a = heap.arcs[j], y = a >>> 3;
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

  /** Writes component i's deferred reductions back into rc and drops arcs no longer in its cut. */
  const flush = (i: number): void => {
    const heap = heaps[i]!, bits = member[i]!, D = raised[i];
    let w = 0;
    for (let j = 0; j < heap.size; j++) {
      const a = heap.arcs[j], y = a >>> 3;
      if ((bits[y >>> 5] >>> (y & 31)) & 1) continue; // left the cut (already written back)
      const r = rc[a] - D;
      rc[a] = r > 0 ? r : 0;
      heap.arcs[w++] = a;
    }
    heap.size = w;
    work += heap.size;
  };

  /** Re-keys component i's cut from the current reduced costs. */
  const resume = (i: number): void => {
    const heap = heaps[i]!, D = raised[i];
    for (let j = 0; j < heap.size; j++) { const a = heap.arcs[j]; rc[a] += D; heap.keys[j] = rc[a]; }
    heap.heapify();
    work += heap.size;
  };

  const release = (i: number): void => { member[i] = null; heaps[i] = null; };

  /** After component i took in other terminals: it stops if one of them is still active. */
  const settleAbsorbed = (i: number): boolean => {
    let stop = false;
    for (const t of absorbed) if (t !== i && status[t] === 0) stop = true;
    absorbed.length = 0;
    return stop;
  };

  // Active components by cut size (lazy entries: [cut, id], re-checked when popped).
  const queue = new ArcHeap();
  for (let i = 0; i < k; i++) {
    member[i] = new Uint32Array(words);
    heaps[i] = new ArcHeap();
    absorbed.length = 0;
    if (absorb(i, terms[i])) { status[i] = 1; flush(i); release(i); continue; }
    absorbed.length = 0; // zero-cost ties at the start: every terminal starts active
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
    // Least reduced cost on the cut (stale entries, whose tail joined the component, are dropped).
    let y = -1, key = 0;
    while (heap.size > 0) {
      const a = heap.arcs[0];
      key = heap.keys[0];
      heap.pop();
      work++;
      const t = a >>> 3;
      if ((bits[t >>> 5] >>> (t & 31)) & 1) continue;
      y = t; // rc[a] = key: zero once the raise below is made (written back when y joins)
      break;
    }
    if (y < 0) throw new Error(`gridDualAscent: terminal node ${terms[i]} cannot be reached from the root ${root}`);
    lb += key - raised[i];
    raised[i] = key;
    if (absorb(i, y)) { absorbed.length = 0; status[i] = 1; flush(i); release(i); cur = -1; continue; }
    if (settleAbsorbed(i)) { status[i] = 2; flush(i); release(i); cur = -1; continue; }
    // Keep growing while this cut is not much larger than the next one waiting.
    while (queue.size > 0 && (status[queue.arcs[0]] !== 0 || queue.keys[0] !== cut[queue.arcs[0]])) queue.pop();
    if (queue.size > 0 && cut[i] > SWITCH_RATIO * queue.keys[0]) {
      flush(i);
      queue.push(cut[i], i);
      cur = -1;
    }
  }
  if (cur >= 0) flush(cur);
  return { lowerBound: lb, complete, work };
}
