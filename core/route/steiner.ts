// Steiner tree in graphs: the engine's entry point. Builds trees with the shortest-path
// heuristic (sph.ts), cleans them with MST + leaf pruning (tree.ts) and reports cost,
// a lower bound and the gap.

import { Cancelled } from '../result';
import { componentOf, edgeCost, type Graph } from './graph';
import { shortestPathHeuristic, SphWorkspace } from './sph';
import { mstPrune, TreeScratch, treeVertices } from './tree';

export interface SteinerOptions {
  seed?: number;
  timeBudgetMs?: number;
  maxIterations?: number;
  onProgress?: (fraction: number, bestCost: number) => void;
  signal?: { readonly aborted: boolean };
  /** Use the exact solver when terminals <= this and the graph is small enough. */
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
 * splitReachableTerminals in graph.ts to drop them first). On cancellation returns the best
 * tree found so far; throws Cancelled only if no tree exists yet.
 */
export function solveSteiner(g: Graph, terminals: ArrayLike<number>, opts: SteinerOptions = {}): SteinerResult {
  const terms = normalizeTerminals(g, terminals);
  if (terms.length <= 1) return { edges: new Int32Array(0), cost: 0, lowerBound: 0, gap: 0, optimal: true, iterations: 0 };
  const comp = componentOf(g);
  const cut = terms.filter((t) => comp[t] !== comp[terms[0]]);
  if (cut.length > 0) throw new Error(`solveSteiner: terminals not connected to terminal ${terms[0]}: ${cut.join(', ')}`);

  const isTerminal = new Uint8Array(g.n);
  for (const t of terms) isTerminal[t] = 1;
  const ws = new SphWorkspace(g.n);
  const scratch = new TreeScratch(g);
  const maxRoots = Math.min(terms.length, opts.maxIterations ?? 8);
  let best: Int32Array | null = null;
  let bestCost = Infinity;
  let iterations = 0;
  for (let r = 0; r < maxRoots; r++) {
    if (opts.signal?.aborted) break;
    const raw = shortestPathHeuristic(g, terms, isTerminal, terms[r], ws);
    if (!raw) throw new Error('solveSteiner: internal error, a connected terminal was not reached');
    const tree = mstPrune(g, treeVertices(g, raw, scratch), isTerminal, scratch);
    const c = edgeCost(g, tree);
    iterations++;
    if (c < bestCost) {
      bestCost = c;
      best = tree;
    }
    opts.onProgress?.((r + 1) / maxRoots, bestCost);
  }
  if (!best) throw new Cancelled();
  return { edges: best, cost: bestCost, lowerBound: 0, gap: bestCost > 0 ? 1 : 0, optimal: false, iterations };
}
