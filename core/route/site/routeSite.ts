// Routes the shared trench on a site: routing grid → terminals joined by stubs → Steiner tree
// on the bend-priced grid (siteSteiner.ts) → lower bound (the larger of lowerBound.ts and
// dualAscentGrid.ts) → shaped network (network/shape.ts). Terminals that cannot be joined are reported one by one; the rest are
// routed. Deterministic for the same input while the time budget is not reached.

import type { Progress } from '../../result';
import { Cancelled } from '../../result';
import type { RouteSettings } from '../../settings';
import type { Site, Terminal } from '../../site/site';
import type { TrenchNetwork } from '../../network/trenchNetwork';
import { fromMetres } from '../../units';
import { graphFromTree, shapeGraph, toNetwork } from '../../network/shape';
import { attachTerminal, type Anchor } from './attach';
import { voronoiBound } from './lowerBound';
import { gridDualAscent } from './dualAscentGrid';
import { buildRoutingGrid, DX, DY, styleMask, type GridParams, type RoutingGrid } from './routingGrid';
import { SiteSteiner, type SiteTree } from './siteSteiner';

/** Dual ascent's work budget (nodes taken in, arcs scanned, pushed or popped; about 25 M per second
 *  of CPU): at most 60 per grid node, and 8,000 per millisecond of the route's time budget (about a
 *  third of it), so a large site keeps its time and falls back to the Voronoi bound if that is larger. */
const DA_WORK_PER_NODE = 60;
const DA_WORK_PER_BUDGET_MS = 8_000;
/** Above this many terminals the per-terminal bit sets (n/8 bytes each) would pass 32 bytes per node: Voronoi bound only. */
const DA_MAX_TERMINALS = 256;

export interface RouteOptions {
  onProgress?: Progress;
  signal?: { readonly aborted: boolean };
}

/** Router parameters in the site's units from the metre settings. */
export function gridParams(site: Site, route: RouteSettings): GridParams {
  return {
    cell: fromMetres(route.cellM, site.units),
    clearance: fromMetres(route.clearanceM, site.units),
    pavementFactor: route.pavementFactor,
    crossingPenalty: fromMetres(route.crossingPenaltyM, site.units),
    bendPenalty: fromMetres(route.bendPenaltyM, site.units),
    style: route.style,
  };
}

/** Grid component label per node reached from the given start nodes (-1 elsewhere). */
function labelComponents(g: RoutingGrid, starts: readonly number[]): Int32Array {
  const comp = new Int32Array(g.n).fill(-1);
  const mask = styleMask(g.params.style);
  const off = new Int32Array(8);
  for (let d = 0; d < 8; d++) off[d] = DX[d] + DY[d] * g.nx;
  const stack: number[] = [];
  let label = 0;
  for (const s of starts) {
    if (comp[s] >= 0) continue;
    comp[s] = label;
    stack.push(s);
    while (stack.length) {
      const v = stack.pop()!;
      const bits = g.moves[v] & mask;
      for (let d = 0; d < 8; d++) {
        if (!((bits >> d) & 1)) continue;
        const u = v + off[d];
        if (comp[u] < 0) { comp[u] = label; stack.push(u); }
      }
    }
    label++;
  }
  return comp;
}

/** The network with the intermediate results (grid, anchors, grid tree) for inspection and benchmarks. */
export interface RouteDetail {
  network: TrenchNetwork;
  grid: RoutingGrid;
  anchors: Anchor[];
  tree: SiteTree;
}

export function routeSite(site: Site, terminals: Terminal[], route: RouteSettings, opts: RouteOptions = {}): TrenchNetwork {
  return routeSiteDetailed(site, terminals, route, opts).network;
}

export function routeSiteDetailed(site: Site, terminals: Terminal[], route: RouteSettings, opts: RouteOptions = {}): RouteDetail {
  const timings: Record<string, number> = {};
  const t0 = performance.now();
  let tm = t0;
  const lap = (name: string): void => {
    const now = performance.now();
    timings[name] = now - tm;
    tm = now;
  };
  const check = (): void => { if (opts.signal?.aborted) throw new Cancelled(); };
  const progress = opts.onProgress ?? (() => undefined);
  const params = gridParams(site, route);
  progress('grid', 0);
  const gridLaps: Record<string, number> = {};
  const g = buildRoutingGrid(site, params, gridLaps, check);
  lap('grid');
  Object.assign(timings, gridLaps);
  check();

  const unreachable: { id: string; reason: string }[] = [];
  const warnings: string[] = [];
  const attached: Anchor[] = [];
  terminals.forEach((t, i) => {
    const r = attachTerminal(site, g, t, i);
    if (r.ok) attached.push(r.anchor);
    else unreachable.push({ id: t.id, reason: r.reason });
  });
  // Connections first, so the root is the first point of connection.
  attached.sort((a, b) => (terminals[a.term].role === terminals[b.term].role ? a.term - b.term : terminals[a.term].role === 'connection' ? -1 : 1));
  const comp = labelComponents(g, attached.map((a) => a.node));
  const counts = new Map<number, number>();
  for (const a of attached) counts.set(comp[a.node], (counts.get(comp[a.node]) ?? 0) + 1);
  let main = attached.length ? comp[attached[0].node] : -1;
  for (const [c, k] of counts) if (k > (counts.get(main) ?? 0)) main = c;
  const anchors: Anchor[] = [];
  for (const a of attached) {
    if (comp[a.node] === main) anchors.push(a);
    else unreachable.push({ id: terminals[a.term].id, reason: 'enclosed: no route around the obstacles (with their clearance) reaches the rest of the network' });
  }
  if (!anchors.some((a) => terminals[a.term].role === 'connection') && anchors.length > 0) {
    warnings.push('no point of connection is reachable; the network is rooted at the first service');
  }
  lap('attach');
  progress('attach', 1);
  check();

  const bound = voronoiBound(g, anchors.map((a) => a.node));
  lap('bound');
  progress('bound', 1);
  check();
  const solver = new SiteSteiner(g, anchors);
  const tree = solver.solve(anchors.map((_, i) => i), {
    seed: route.seed, timeBudgetMs: route.timeBudgetMs, onProgress: opts.onProgress, signal: opts.signal,
    terminalTree: bound.mstEdges,
  });
  lap('solve');
  check();
  // The stronger bound, when it fits the budget: dual ascent on the plain grid costs (it needs a
  // membership bit per node per terminal, so very many terminals keep the Voronoi bound alone).
  let lowerBound = bound.lowerBound;
  if (anchors.length > 1 && anchors.length <= DA_MAX_TERMINALS) {
    const da = gridDualAscent(g, anchors.map((a) => a.node), anchors[0].node, Math.min(DA_WORK_PER_BUDGET_MS * route.timeBudgetMs, DA_WORK_PER_NODE * g.n), solver.stateBuffer(), () => opts.signal?.aborted === true);
    if (da.lowerBound > lowerBound) lowerBound = da.lowerBound;
  }
  lap('bound.dualAscent');
  check();

  const sg = graphFromTree(g, tree.adj, tree.nodes, anchors, terminals);
  shapeGraph(sg, g, route.style);
  const rootId = anchors.length ? terminals[anchors[0].term].id : undefined;
  const { nodes, segments } = toNetwork(sg, g, rootId);
  lap('shape');
  progress('shape', 1);
  timings.total = performance.now() - t0;

  const cost = tree.cost;
  if (lowerBound > cost * (1 + 1e-9) + 1e-9) throw new Error(`routeSite: lower bound ${lowerBound} exceeds the route cost ${cost}`);
  const network: TrenchNetwork = {
    units: site.units,
    frame: site.frame,
    nodes,
    segments,
    quality: { cost, lowerBound, gap: cost > 0 ? (cost - lowerBound) / cost : 0 },
    unreachable,
    warnings,
    timingsMs: timings,
  };
  return { network, grid: g, anchors, tree };
}
