// Recombination of good trees: the union of the edges of a few elite trees is a small graph
// that holds the good parts of each; the shortest-path heuristic from several roots plus the
// local search on that small graph often finds a tree better than any parent. (The idea of
// solving the problem on the union of elite solutions is common practice in Steiner heuristics;
// the procedure here is our own.)

import { buildGraph, type Graph } from './graph';
import { LocalSearch } from './localSearch';
import { shortestPathHeuristic, SphWorkspace } from './sph';
import { mstPrune, TreeScratch, treeVertices } from './tree';

/** Best tree found on the union of `parents` (edge ids of g), in edge ids of g. */
export function recombine(
  g: Graph,
  parents: Int32Array[],
  terms: number[],
  roots: number[],
  stop: () => boolean,
): Int32Array | null {
  const local = new Map<number, number>();
  const back: number[] = [];
  const seenEdge = new Set<number>();
  const eu: number[] = [];
  const ev: number[] = [];
  const ew: number[] = [];
  const edgeBack: number[] = [];
  const id = (x: number) => {
    let i = local.get(x);
    if (i === undefined) {
      i = back.length;
      local.set(x, i);
      back.push(x);
    }
    return i;
  };
  for (const t of terms) id(t);
  for (const p of parents)
    for (const e of p) {
      if (seenEdge.has(e)) continue;
      seenEdge.add(e);
      eu.push(id(g.edgeU[e]));
      ev.push(id(g.edgeV[e]));
      ew.push(g.weight[e]);
      edgeBack.push(e);
    }
  const sub = buildGraph(back.length, eu, ev, ew);
  const subTerms = terms.map((t) => local.get(t)!);
  const isT = new Uint8Array(sub.n);
  for (const t of subTerms) isT[t] = 1;
  const ws = new SphWorkspace(sub.n);
  const scratch = new TreeScratch(sub);
  const ls = new LocalSearch(sub);
  let best: Int32Array | null = null;
  let bestCost = Infinity;
  for (const r of roots) {
    if (best && stop()) break;
    const raw = shortestPathHeuristic(sub, subTerms, isT, local.get(r)!, ws);
    if (!raw) return null;
    let tree = mstPrune(sub, treeVertices(sub, raw, scratch), isT, scratch);
    tree = ls.improve(tree, isT, stop);
    let c = 0;
    for (const e of tree) c += sub.weight[e];
    if (c < bestCost) {
      bestCost = c;
      best = tree;
    }
  }
  if (!best) return null;
  const out = new Int32Array(best.length);
  for (let i = 0; i < best.length; i++) out[i] = edgeBack[best[i]];
  return out;
}
