// Steiner tree in graphs: the engine's entry point. Builds trees with the shortest-path
// heuristic (sph.ts), cleans them with MST + leaf pruning (tree.ts) and reports cost,
// a lower bound and the gap.

import { Cancelled } from '../result';
import { componentOf, edgeCost, withWeights, type Graph } from './graph';
import { dualAscent } from './dualAscent';
import { EXACT_DEFAULT_MAX_STATES, exactFits, steinerExact } from './exact';
import { LocalSearch } from './localSearch';
import { makeRng } from './rng';
import { shortestPathHeuristic, SphWorkspace } from './sph';
import { mstPrune, TreeScratch, treeVertices } from './tree';

const DEFAULT_BUDGET_MS = 2000;
const DEFAULT_MAX_ITERATIONS = 200;
const FIRST_PLAIN_ROOTS = 4;
const STALL_MIN = 16;
const PERTURB_MIN = 0.05;
const PERTURB_MAX = 0.3;
const LB_BUDGET_SHARE = 0.25;
const DEFAULT_EXACT_MAX_TERMINALS = 8;
const now = () => performance.now();

export interface SteinerOptions {
  seed?: number;
  timeBudgetMs?: number;
  maxIterations?: number;
  onProgress?: (fraction: number, bestCost: number) => void;
  signal?: { readonly aborted: boolean };
  /**
   * Use the exact solver (Dreyfus–Wagner) when terminals <= this and 2^(terminals-1) * nodes
   * <= 4,194,304 table entries. Default 8; 0 turns it off.
   */
  exactMaxTerminals?: number;
  /** Compute a lower bound (default true). */
  lowerBound?: boolean;
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
 * returns the best tree found so far; throws Cancelled (core/result.ts) only if no tree exists
 * yet, which cannot happen after the first shortest-path tree (a few ms). Deterministic for a
 * given seed and budget as long as the time budget is not what ends the search (set
 * maxIterations and a generous timeBudgetMs for byte-identical runs across machines).
 */
export function solveSteiner(g: Graph, terminals: ArrayLike<number>, opts: SteinerOptions = {}): SteinerResult {
  const terms = normalizeTerminals(g, terminals);
  if (terms.length <= 1) return { edges: new Int32Array(0), cost: 0, lowerBound: 0, gap: 0, optimal: true, iterations: 0 };
  const comp = componentOf(g);
  const cut = terms.filter((t) => comp[t] !== comp[terms[0]]);
  if (cut.length > 0) throw new Error(`solveSteiner: terminals not connected to terminal ${terms[0]}: ${cut.join(', ')}`);

  const t0 = now();
  const exactMax = opts.exactMaxTerminals ?? DEFAULT_EXACT_MAX_TERMINALS;
  if (terms.length <= exactMax && exactFits(g.n, terms.length, EXACT_DEFAULT_MAX_STATES)) {
    const ex = steinerExact(g, terms, { signal: opts.signal });
    if (ex) {
      opts.onProgress?.(1, ex.cost);
      return { edges: ex.edges, cost: ex.cost, lowerBound: ex.cost, gap: 0, optimal: true, iterations: 1 };
    }
  }
  const isTerminal = new Uint8Array(g.n);
  for (const t of terms) isTerminal[t] = 1;
  const budgetMs = opts.timeBudgetMs ?? DEFAULT_BUDGET_MS;
  const maxIter = opts.maxIterations ?? DEFAULT_MAX_ITERATIONS;
  const stop = () => opts.signal?.aborted === true || now() - t0 > budgetMs;
  // lower bound first: a proven-optimal tree ends the search early
  let lowerBound = 0;
  if (opts.lowerBound !== false) {
    const da = dualAscent(g, terms, terms[0], () => opts.signal?.aborted === true || now() - t0 > budgetMs * LB_BUDGET_SHARE);
    lowerBound = da.lowerBound;
  }
  const ws = new SphWorkspace(g.n);
  const scratch = new TreeScratch(g);
  const ls = new LocalSearch(g);
  const rng = makeRng(opts.seed ?? 1);
  let best: Int32Array | null = null;
  let bestCost = Infinity;
  let iterations = 0;
  let stall = 0;
  const consider = (tree: Int32Array) => {
    const c = edgeCost(g, tree);
    if (c < bestCost - 1e-9) {
      bestCost = c;
      best = tree;
      stall = 0;
    } else stall++;
  };
  const pert = new Float64Array(g.m);
  const pg = withWeights(g, pert);
  const stallLimit = Math.max(STALL_MIN, terms.length);
  for (let it = 0; it < maxIter; it++) {
    if (best && (stop() || stall >= stallLimit || bestCost <= lowerBound + 1e-9 * bestCost)) break;
    let tree: Int32Array | null;
    if (it < Math.min(terms.length, FIRST_PLAIN_ROOTS)) {
      // plain SPH from the first few terminals
      tree = shortestPathHeuristic(g, terms, isTerminal, terms[it], ws);
      if (!tree) throw new Error('solveSteiner: internal error, a connected terminal was not reached');
      tree = mstPrune(g, treeVertices(g, tree, scratch), isTerminal, scratch);
    } else {
      // SPH on randomly perturbed weights from a random terminal, to leave the local optimum
      const amp = PERTURB_MIN + (PERTURB_MAX - PERTURB_MIN) * rng();
      for (let e = 0; e < g.m; e++) pert[e] = g.weight[e] * (1 + amp * rng());
      tree = shortestPathHeuristic(pg, terms, isTerminal, terms[Math.floor(rng() * terms.length)], ws);
      if (!tree) throw new Error('solveSteiner: internal error, a connected terminal was not reached');
      tree = mstPrune(pg, treeVertices(g, tree, scratch), isTerminal, scratch);
      tree = ls.improve(tree, isTerminal, () => opts.signal?.aborted === true, pg);
    }
    tree = ls.improve(tree, isTerminal, () => opts.signal?.aborted === true, g);
    iterations++;
    consider(tree);
    opts.onProgress?.(Math.min(1, Math.max((now() - t0) / budgetMs, (it + 1) / maxIter, stall / stallLimit)), bestCost);
  }
  if (!best) throw new Cancelled();
  const edges: Int32Array = best;
  const lb = Math.min(lowerBound, bestCost);
  const gap = bestCost > 0 ? (bestCost - lb) / bestCost : 0;
  return { edges, cost: bestCost, lowerBound: lb, gap, optimal: gap <= 1e-9, iterations };
}
