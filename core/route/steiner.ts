// Steiner tree in graphs: the engine's entry point.
//  - few terminals: the exact Dreyfus–Wagner program (exact.ts) when its table and work are small;
//  - otherwise an anytime search: shortest-path heuristic trees (Takahashi–Matsuyama, sph.ts)
//    from a few roots and then on randomly perturbed weights, each improved by the local search
//    of Uchoa & Werneck (2010) plus Steiner-vertex insertion/elimination (localSearch.ts), with
//    recombination of elite trees (recombine.ts), until the budget, a stall or a proven optimum;
//  - a lower bound by Wong's dual ascent (dualAscent.ts), reported with the gap.

import { Cancelled } from '../result';
import { componentOf, edgeCost, withWeights, type Graph } from './graph';
import { dualAscent } from './dualAscent';
import { EXACT_DEFAULT_MAX_STATES, exactFits, exactWork, steinerExact } from './exact';
import { LocalSearch } from './localSearch';
import { recombine } from './recombine';
import { makeRng } from './rng';
import { shortestPathHeuristic, SphWorkspace } from './sph';
import { mstPrune, TreeScratch, treeVertices } from './tree';

const DEFAULT_BUDGET_MS = 2000;
const DEFAULT_MAX_ITERATIONS = 200;
const DEFAULT_GAP_TOLERANCE = 0;
const FIRST_PLAIN_ROOTS = 4;
const STALL_MIN = 8;
const ELITE_SIZE = 8;
const RECOMBINE_EVERY = 3;
const RECOMBINE_ROOTS = 6;
const PERTURB_MIN = 0.05;
const PERTURB_MAX = 1.0;
const LB_BUDGET_SHARE = 0.25;
/** The exact solver may use this share of the budget; past it the heuristic takes over. */
const EXACT_BUDGET_SHARE = 0.75;
const HEURISTIC_MIN_SHARE = 0.25;
const DEFAULT_EXACT_MAX_TERMINALS = 10;
/** About 1 s of exact work on one core; beyond it the heuristic is the better use of time. */
const EXACT_MAX_WORK = 1.2e8;
const now = () => performance.now();

export interface SteinerOptions {
  /** Seed of the perturbations (default 1). */
  seed?: number;
  /**
   * Wall-clock budget in ms (default 2000). The exact solver may use up to 75 % of it; the
   * heuristic always keeps at least 25 % after the bound, so a run ends within 1.25x the budget.
   */
  timeBudgetMs?: number;
  /** Most heuristic iterations (default 200); a stall of max(8, terminals/2) iterations also ends it. */
  maxIterations?: number;
  onProgress?: (fraction: number, bestCost: number) => void;
  signal?: { readonly aborted: boolean };
  /**
   * Use the exact solver (Dreyfus–Wagner) when terminals <= this, 2^(terminals-1) * nodes
   * <= 4,194,304 table entries and its estimated work (exactWork) <= 1.2e8. Default 10; 0 = off.
   */
  exactMaxTerminals?: number;
  /** Compute a lower bound (default true). */
  lowerBound?: boolean;
  /**
   * Stop once (cost - lowerBound) / cost <= this. Default 0: search on until the tree is proven
   * optimal or the budget, the iteration limit or a stall ends it.
   */
  gapTolerance?: number;
}

export interface SteinerResult {
  /** Edge ids of the tree. */
  edges: Int32Array;
  cost: number;
  lowerBound: number;
  /** (cost - lowerBound) / cost; 0 when cost is 0. */
  gap: number;
  optimal: boolean;
  iterations: number;
}

/** Distinct terminals in first-seen order; throws on an id out of range. */
export function normalizeTerminals(g: Graph, terminals: ArrayLike<number>): number[] {
  const seen = new Set<number>();
  const out: number[] = [];
  for (let i = 0; i < terminals.length; i++) {
    const t = terminals[i];
    if (!Number.isInteger(t) || t < 0 || t >= g.n) throw new Error(`solveSteiner: terminal ${t} is not a node of the graph (n=${g.n})`);
    if (!seen.has(t)) {
      seen.add(t);
      out.push(t);
    }
  }
  return out;
}

/**
 * Finds a Steiner tree connecting `terminals` in `g`.
 * Throws an Error naming the terminals that are not connected to the first one (use
 * splitReachableTerminals in graph.ts to drop them first). On cancellation (signal.aborted)
 * returns the best tree found so far, or throws Cancelled (core/result.ts) when no tree exists
 * yet (aborted before or during the exact solver or the first shortest-path tree). Deterministic for a
 * given seed and budget as long as the time budget is not what ends the search (set
 * maxIterations and a generous timeBudgetMs for byte-identical runs across machines).
 */
export function solveSteiner(g: Graph, terminals: ArrayLike<number>, opts: SteinerOptions = {}): SteinerResult {
  if (opts.signal?.aborted) throw new Cancelled();
  const terms = normalizeTerminals(g, terminals);
  if (terms.length <= 1) return { edges: new Int32Array(0), cost: 0, lowerBound: 0, gap: 0, optimal: true, iterations: 0 };
  const comp = componentOf(g);
  const cut = terms.filter((t) => comp[t] !== comp[terms[0]]);
  if (cut.length > 0) throw new Error(`solveSteiner: terminals not connected to terminal ${terms[0]}: ${cut.join(', ')}`);

  const t0 = now();
  const exactMax = opts.exactMaxTerminals ?? DEFAULT_EXACT_MAX_TERMINALS;
  if (terms.length <= exactMax && exactFits(g.n, terms.length, EXACT_DEFAULT_MAX_STATES) && exactWork(g.n, g.m, terms.length) <= EXACT_MAX_WORK) {
    const exactDeadline = (opts.timeBudgetMs ?? DEFAULT_BUDGET_MS) * EXACT_BUDGET_SHARE;
    const ex = steinerExact(g, terms, { signal: opts.signal, stop: () => now() - t0 > exactDeadline });
    if (ex) {
      opts.onProgress?.(1, ex.cost);
      return { edges: ex.edges, cost: ex.cost, lowerBound: ex.cost, gap: 0, optimal: true, iterations: 1 };
    }
  }
  if (opts.signal?.aborted) throw new Cancelled();
  const isTerminal = new Uint8Array(g.n);
  for (const t of terms) isTerminal[t] = 1;
  const budgetMs = opts.timeBudgetMs ?? DEFAULT_BUDGET_MS;
  const maxIter = opts.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  let deadline = t0 + budgetMs; // moved later if the exact solver used most of the budget
  const stop = () => opts.signal?.aborted === true || now() > deadline;
  const ws = new SphWorkspace(g.n);
  const scratch = new TreeScratch(g);
  const ls = new LocalSearch(g);
  const rng = makeRng(opts.seed ?? 1);
  let best: Int32Array | null = null;
  let bestCost = Infinity;
  let iterations = 0;
  let stall = 0;
  // elite pool of distinct trees, cheapest first, for recombination
  const elite: { edges: Int32Array; cost: number; key: string }[] = [];
  const consider = (tree: Int32Array) => {
    const c = edgeCost(g, tree);
    if (c < bestCost - 1e-9) {
      bestCost = c;
      best = tree;
      stall = 0;
    } else stall++;
    const key = Array.from(tree).sort((a, b) => a - b).join(',');
    if (elite.some((x) => x.key === key)) return;
    if (elite.length >= ELITE_SIZE && c >= elite[elite.length - 1].cost) return;
    elite.push({ edges: tree, cost: c, key });
    elite.sort((a, b) => a.cost - b.cost || (a.key < b.key ? -1 : a.key > b.key ? 1 : 0));
    if (elite.length > ELITE_SIZE) elite.pop();
  };
  // a first tree right away, so that cancellation always has something to return
  const first = shortestPathHeuristic(g, terms, isTerminal, terms[0], ws, () => opts.signal?.aborted === true);
  if (!first) throw new Error('solveSteiner: internal error, a connected terminal was not reached');
  consider(mstPrune(g, treeVertices(g, first, scratch), isTerminal, scratch));
  stall = 0;
  // lower bound next: a proven-optimal tree ends the search early
  let lowerBound = 0;
  if (opts.lowerBound !== false) {
    const daStart = now();
    const da = dualAscent(g, terms, terms[0], () => opts.signal?.aborted === true || now() - daStart > budgetMs * LB_BUDGET_SHARE);
    lowerBound = da.lowerBound;
    // with integer weights every tree costs an integer, so the bound rounds up
    let integral = true;
    for (let e = 0; e < g.m && integral; e++) integral = Number.isInteger(g.weight[e]);
    if (integral) lowerBound = Math.ceil(lowerBound - 1e-7 * Math.max(1, lowerBound));
  }
  // the heuristic keeps a quarter of the budget even when the exact solver used most of it
  deadline = Math.max(deadline, now() + budgetMs * HEURISTIC_MIN_SHARE);
  const pert = new Float64Array(g.m);
  const pg = withWeights(g, pert);
  const stallLimit = Math.max(STALL_MIN, Math.ceil(terms.length / 2));
  const gapTol = Math.max(opts.gapTolerance ?? DEFAULT_GAP_TOLERANCE, 1e-9);
  for (let it = 0; it < maxIter; it++) {
    if (!best && opts.signal?.aborted) throw new Cancelled();
    if (best && (stop() || stall >= stallLimit || bestCost - lowerBound <= gapTol * bestCost)) break;
    let tree: Int32Array | null;
    if (it >= FIRST_PLAIN_ROOTS && elite.length >= 2 && it % RECOMBINE_EVERY === 0) {
      // recombine the best tree with one or two other elite trees
      const parents = [elite[0].edges];
      const others = elite.slice(1);
      for (let k = 0; k < 2 && others.length > 0; k++) parents.push(others.splice(Math.floor(rng() * others.length), 1)[0].edges);
      const roots: number[] = [];
      for (let k = 0; k < Math.min(terms.length, RECOMBINE_ROOTS); k++) roots.push(terms[Math.floor(rng() * terms.length)]);
      tree = recombine(g, parents, terms, roots, stop);
      if (!tree) throw new Error('solveSteiner: internal error, recombination lost a terminal');
      tree = mstPrune(g, treeVertices(g, tree, scratch), isTerminal, scratch);
    } else if (it < Math.min(terms.length, FIRST_PLAIN_ROOTS)) {
      // plain SPH from the first few terminals (the first one is already built)
      if (it === 0) tree = best!;
      else {
        tree = shortestPathHeuristic(g, terms, isTerminal, terms[it], ws);
        if (!tree) throw new Error('solveSteiner: internal error, a connected terminal was not reached');
        tree = mstPrune(g, treeVertices(g, tree, scratch), isTerminal, scratch);
      }
    } else {
      // SPH on randomly perturbed weights from a random terminal, to leave the local optimum
      const amp = PERTURB_MIN + (PERTURB_MAX - PERTURB_MIN) * rng();
      for (let e = 0; e < g.m; e++) pert[e] = g.weight[e] * (1 + amp * rng());
      tree = shortestPathHeuristic(pg, terms, isTerminal, terms[Math.floor(rng() * terms.length)], ws);
      if (!tree) throw new Error('solveSteiner: internal error, a connected terminal was not reached');
      tree = mstPrune(pg, treeVertices(g, tree, scratch), isTerminal, scratch);
      tree = ls.improve(tree, isTerminal, stop, pg);
    }
    tree = ls.improve(tree, isTerminal, stop, g);
    iterations++;
    consider(tree);
    opts.onProgress?.(Math.min(1, Math.max((now() - t0) / (deadline - t0), (it + 1) / maxIter, stall / stallLimit)), bestCost);
  }
  if (!best) throw new Cancelled();
  const edges: Int32Array = best;
  const lb = Math.min(lowerBound, bestCost);
  const gap = bestCost > 0 ? (bestCost - lb) / bestCost : 0;
  return { edges, cost: bestCost, lowerBound: lb, gap, optimal: gap <= 1e-9, iterations };
}
