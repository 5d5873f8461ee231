// The quantity take-off: per segment and in total, trench length by surface, section, earthwork,
// pavement cut and restoration, conduit by utility and size, elbows, tees, pull boxes, marking,
// crossings, priced from the unit-price table. Computed in metres, reported in m or ft units.

import type { Terminal } from '../site/site';
import type { Settings, UtilitySetting } from '../settings';
import type { TrenchNetwork } from '../network/trenchNetwork';
import type { LengthUnit } from '../units';
import { M_PER_FT, M3_PER_YD3, FT2_PER_YD2, fromMetres, inchesToMetres, toMetres, unitLabels } from '../units';
import { NOTICE_LINES, NOTICE_TITLE } from '../notice';
import { adjacency, computeFeeds, contentsFromFeeds, endDirection, orientedPoints, turnDeg, walkToRoot } from '../network/contents';
import type { Feeds, RootedTree, SegmentContents } from '../network/contents';
import { placePullBoxesWithWarnings } from '../network/pullBoxes';
import type { PullBox } from '../network/pullBoxes';
import { trenchSection } from './section';
import type { Surface } from './section';
import { EGRESS_DEPTH_M, ENGINEERED_DEPTH_M, excavationSection } from './excavation';
import type { Protection } from './excavation';
import { addElbows, elbowsForBend, zeroElbows } from './fittings';
import type { ElbowCount } from './fittings';
import { findPrice } from './prices';

export type LineGroup = 'Trench' | 'Earthwork' | 'Pavement' | 'Conduit and pipe' | 'Fittings' | 'Pull boxes' | 'Marking' | 'Crossings';
export const LINE_GROUPS: readonly LineGroup[] = ['Trench', 'Earthwork', 'Pavement', 'Conduit and pipe', 'Fittings', 'Pull boxes', 'Marking', 'Crossings'];

export interface TakeOffLine {
  key: string;
  group: LineGroup;
  description: string;
  utility?: string;
  /** In the schedule unit (`unit`), rounded to 0.001. */
  quantity: number;
  unit: string;
  /** Per `unit`, in the currency; 0 when no price was found. */
  unitPrice: number;
  cost: number;
  /** Key of the price used, or null (a warning names the line). */
  priceKey: string | null;
}

export interface SegmentRow {
  segmentId: number;
  from: number;
  to: number;
  stub: boolean;
  surface: 'soft' | 'pavement' | 'mixed';
  length: number;
  lengthSoft: number;
  lengthPavement: number;
  carries: { utility: string; conduits: number }[];
  /** e.g. "power 3, telecom 3, water 1". */
  carriesText: string;
  /** Widest / deepest of the sections used (schedule length unit). */
  width: number;
  depth: number;
  governing: string;
  protection: Protection;
  excavation: number;
  bedding: number;
  backfill: number;
  haul: number;
  sawCut: number;
  restoration: number;
  crossings: number;
  crossingsText: string;
}

export interface UtilityRow {
  utility: string;
  label: string;
  color: string;
  kind: UtilitySetting['kind'];
  sizeIn: number;
  services: number;
  trenchLength: number;
  conduitLength: number;
  elbows90: number;
  elbows45: number;
  elbows22: number;
  tees: number;
  pullBoxes: number;
  tracer: number;
  tape: number;
}

export interface TakeOffTotals {
  trenchLength: number;
  lengthSoft: number;
  lengthPavement: number;
  excavation: number;
  bedding: number;
  backfill: number;
  haul: number;
  sawCut: number;
  restoration: number;
  crossings: number;
  pullBoxes: number;
  cost: number;
}

export interface TakeOff {
  units: LengthUnit;
  /** The network's frame: drawing = local / scale + origin (for coordinates in schedules). */
  frame: TrenchNetwork['frame'];
  labels: { length: string; area: string; volume: string };
  currency: string;
  segments: SegmentRow[];
  utilities: UtilityRow[];
  lines: TakeOffLine[];
  totals: TakeOffTotals;
  pullBoxes: PullBox[];
  contents: SegmentContents[];
  warnings: string[];
  notice: { title: string; lines: readonly string[] };
}

const r3 = (v: number): number => Math.round(v * 1000) / 1000;
const r2 = (v: number): number => Math.round(v * 100) / 100;

/** Take-off of a trench network for its terminals and settings. */
export function computeTakeOff(net: TrenchNetwork, terminals: Terminal[], settings: Settings): TakeOff {
  const units: LengthUnit = settings.units ?? net.units;
  const tr = settings.trench;
  const utils = settings.utilities;
  const warnings: string[] = [...net.warnings];
  const toM = (v: number): number => toMetres(v, net.units);
  const len = (m: number): number => fromMetres(m, units);
  const area = (m2: number): number => (units === 'm' ? m2 : m2 / (M_PER_FT * M_PER_FT * FT2_PER_YD2));
  const vol = (m3: number): number => (units === 'm' ? m3 : m3 / M3_PER_YD3);
  const lab = unitLabels(units);

  const feeds = computeFeeds(net, terminals, utils);
  warnings.push(...feeds.warnings);
  const contents = contentsFromFeeds(net, feeds, utils);
  const pulled = placePullBoxesWithWarnings(net, contents, utils, { countRisers: tr.countRiserBends ?? true });
  warnings.push(...pulled.warnings);
  const boxes = pulled.boxes;

  // --- per segment: sections, earthwork, pavement ------------------------------------------
  const overcutM = inchesToMetres(tr.pavementOvercutIn);
  const segRows: SegmentRow[] = [];
  let protectiveLenM = 0;
  const crossingCounts = new Map<string, { kind: 'line' | 'pavement-edge'; layer: string; count: number }>();
  const sum = { soft: 0, pave: 0, exc: 0, bed: 0, back: 0, haul: 0, saw: 0, rest: 0, crossings: 0 };
  let maxDepthM = 0;
  net.segments.forEach((seg, i) => {
    const loads = contents[i].loads;
    const lenM = toM(seg.length);
    const paveM = Math.min(lenM, toM(seg.lengthUnderPavement));
    const softM = lenM - paveM;
    let widthM = 0, depthM = 0, governing = '';
    let protection: Protection = 'none';
    let exc = 0, bed = 0, back = 0, haul = 0, saw = 0, rest = 0;
    const edgeCrossings = seg.crossings.filter((c) => c.kind === 'pavement-edge').length;
    for (const [surface, portionM] of [['soft', softM], ['pavement', paveM]] as [Surface, number][]) {
      if (portionM <= 0 || loads.length === 0) continue;
      const sec = trenchSection(loads, utils, tr, surface);
      const ex = excavationSection(sec.widthM, sec.depthM, tr);
      const excV = ex.areaM2 * portionM;
      const bedV = sec.widthM * sec.beddingM * portionM;
      const ductV = sec.ductAreaM2 * portionM;
      const backV = excV - bedV - ductV;
      exc += excV;
      bed += bedV;
      back += backV;
      haul += (tr.importBackfill ? excV : excV - backV) * (1 + tr.swell);
      if (sec.depthM > depthM) {
        depthM = sec.depthM;
        governing = sec.governing;
      }
      widthM = Math.max(widthM, sec.widthM);
      if (ex.protection !== 'none') {
        protection = ex.protection;
        if (ex.protection === 'shoring') protectiveLenM += portionM;
      }
      if (surface === 'pavement') {
        const cutWidthM = ex.topWidthM + 2 * overcutM;
        saw += 2 * portionM + edgeCrossings * cutWidthM;
        rest += portionM * cutWidthM;
      }
    }
    maxDepthM = Math.max(maxDepthM, depthM);
    for (const c of seg.crossings) {
      const key = c.kind === 'pavement-edge' ? 'crossing.pavement-edge' : `crossing.${c.layer}`;
      const e = crossingCounts.get(key) ?? { kind: c.kind, layer: c.layer, count: 0 };
      e.count++;
      crossingCounts.set(key, e);
    }
    sum.soft += softM; sum.pave += paveM; sum.exc += exc; sum.bed += bed; sum.back += back;
    sum.haul += haul; sum.saw += saw; sum.rest += rest; sum.crossings += seg.crossings.length;
    const byLayer = new Map<string, number>();
    for (const c of seg.crossings) {
      const name = c.kind === 'pavement-edge' ? 'pavement edge' : c.layer;
      byLayer.set(name, (byLayer.get(name) ?? 0) + 1);
    }
    segRows.push({
      segmentId: seg.id, from: seg.from, to: seg.to, stub: seg.stub,
      surface: paveM <= 0 ? 'soft' : softM <= 1e-9 ? 'pavement' : 'mixed',
      length: r3(len(lenM)), lengthSoft: r3(len(softM)), lengthPavement: r3(len(paveM)),
      carries: loads.map((l) => ({ utility: l.utility, conduits: l.conduits })),
      carriesText: loads.map((l) => `${l.utility} ${l.conduits}`).join(', '),
      width: r3(len(widthM)), depth: r3(len(depthM)), governing, protection,
      excavation: r3(vol(exc)), bedding: r3(vol(bed)), backfill: r3(vol(back)), haul: r3(vol(haul)),
      sawCut: r3(len(saw)), restoration: r3(area(rest)),
      crossings: seg.crossings.length,
      crossingsText: [...byLayer.entries()].map(([k, v]) => `${k} ${v}`).join(', '),
    });
  });
  if (maxDepthM >= EGRESS_DEPTH_M) warnings.push(`Trench depth reaches ${maxDepthM.toFixed(2)} m: a ladder, stairway or ramp within 25 ft (7.6 m) of travel is needed from 4 ft (1.22 m) (OSHA 1926.651(c)(2)).`);
  if (protectiveLenM > 0) warnings.push(`${protectiveLenM.toFixed(1)} m of trench is 5 ft (1.52 m) deep or more: shoring or a trench box is priced (OSHA 1926.652).`);
  if (maxDepthM > ENGINEERED_DEPTH_M) warnings.push('Trench deeper than 20 ft (6.1 m): the protective system must be designed by a registered professional engineer (OSHA 1926 Subpart P App. B).');

  // --- per utility: conduit, fittings, boxes, marking ---------------------------------------
  const adj = adjacency(net);
  const stubM = tr.stubUpM;
  const utilRows: UtilityRow[] = [];
  const elbowsByUtility = new Map<string, ElbowCount>();
  const teesByUtility = new Map<string, number>();
  for (const u of utils) {
    const segIdx = contents.map((c, i) => (c.loads.some((l) => l.utility === u.key) ? i : -1)).filter((i) => i >= 0);
    const fed = feeds.byUtility.get(u.key) ?? [];
    if (fed.length === 0) continue;
    let trenchM = 0, conduitM = 0;
    for (const i of segIdx) {
      const l = contents[i].loads.find((x) => x.utility === u.key);
      const m = toM(net.segments[i].length);
      trenchM += m;
      conduitM += m * (l?.conduits ?? 0);
    }
    const elbows = zeroElbows();
    let tees = 0;
    let ends: number;
    if (u.kind === 'radial') {
      ends = 2 * fed.length * u.perService;
      conduitM += ends * stubM;
      addElbows(elbows, radialElbows(net, feeds, fed, boxLookup(boxes, u.key)), u.perService);
      addElbows(elbows, { e90: 1, e45: 0, e22: 0 }, ends); // riser sweep at each end of each conduit
    } else {
      const endNodes = new Set<number>();
      for (const f of fed) { endNodes.add(f.node); endNodes.add((feeds.trees.get(f.connectionId) as RootedTree).root); }
      ends = endNodes.size;
      conduitM += ends * stubM;
      const inSub = new Set(segIdx);
      for (const i of segIdx) addElbows(elbows, interiorElbows(net.segments[i].points));
      for (const n of net.nodes) {
        const inc = (adj.get(n.id) ?? []).filter((si) => inSub.has(si));
        if (inc.length >= 3) tees += inc.length - 2;
        else if (inc.length === 2) {
          const [a, b] = inc.map((si) => net.segments[si]);
          const da = endDirection(orientedPoints(a, a.to === n.id), true);
          const db = endDirection(orientedPoints(b, b.from === n.id), false);
          addElbows(elbows, elbowsForBend(turnDeg(da[0], da[1], db[0], db[1])));
        }
      }
      addElbows(elbows, { e90: 1, e45: 0, e22: 0 }, ends); // riser at each service and connection
    }
    elbowsByUtility.set(u.key, elbows);
    teesByUtility.set(u.key, tees);
    const nBoxes = boxes.filter((b) => b.utilities.includes(u.key)).length;
    const tracerM = u.tracer ? trenchM + ends * stubM : 0;
    utilRows.push({
      utility: u.key, label: u.label, color: u.color, kind: u.kind, sizeIn: u.diameterIn,
      services: fed.length, trenchLength: r3(len(trenchM)), conduitLength: r3(len(conduitM)),
      elbows90: elbows.e90, elbows45: elbows.e45, elbows22: elbows.e22, tees, pullBoxes: nBoxes,
      tracer: r3(len(tracerM)), tape: r3(len(trenchM)),
    });
  }

  // --- line items ------------------------------------------------------------------------------
  const lines: TakeOffLine[] = [];
  const add = (group: LineGroup, key: string, description: string, quantity: number, unit: string, candidates: string[], utility?: string) => {
    if (!(quantity > 0)) return;
    const q = r3(quantity);
    const m = findPrice(settings.prices, candidates, unit);
    if (!m) warnings.push(`No unit price for '${key}' (${unit}); priced at 0.`);
    const unitPrice = m ? Math.round(m.unitPrice * 10000) / 10000 : 0;
    lines.push({ key, group, description, utility, quantity: q, unit, unitPrice, cost: r2(q * unitPrice), priceKey: m ? m.item.key : null });
  };
  add('Trench', 'trench.soft', 'Trench in soft ground', len(sum.soft), lab.length, ['trench.soft', 'trench']);
  add('Trench', 'trench.pavement', 'Trench under pavement', len(sum.pave), lab.length, ['trench.pavement', 'trench']);
  add('Earthwork', 'excavation', `Excavation, bank measure (${protectionText(tr)})`, vol(sum.exc), lab.volume, ['excavation']);
  add('Earthwork', 'protective', 'Protective system (shoring / trench box), trench 5 ft (1.52 m) deep or more', len(protectiveLenM), lab.length, ['protective']);
  add('Earthwork', 'bedding', 'Bedding below the ducts', vol(sum.bed), lab.volume, ['bedding']);
  add('Earthwork', 'backfill', 'Backfill (excavation − bedding − conduit)', vol(sum.back), lab.volume, ['backfill']);
  add('Earthwork', 'haul', `Surplus spoil to haul, loose (swell ${Math.round(tr.swell * 100)} %)`, vol(sum.haul), lab.volume, ['haul']);
  add('Pavement', 'sawcut', 'Pavement saw-cut', len(sum.saw), lab.length, ['sawcut']);
  add('Pavement', 'pavement.restore', 'Pavement restoration (trench top width + overcut each side)', area(sum.rest), lab.area, ['pavement.restore']);
  for (const row of utilRows) {
    const u = utils.find((x) => x.key === row.utility) as UtilitySetting;
    const size = `${u.diameterIn}in`;
    const what = u.kind === 'radial' ? 'Conduit' : 'Pipe';
    add('Conduit and pipe', `conduit.${u.key}.${size}`, `${what} ${u.diameterIn} in OD — ${u.label} (incl. stub-ups)`, row.conduitLength, lab.length, [`conduit.${u.key}.${size}`, `conduit.${u.key}`, 'conduit'], u.key);
  }
  for (const row of utilRows) {
    const e = elbowsByUtility.get(row.utility) as ElbowCount;
    for (const [ang, n] of [['90', e.e90], ['45', e.e45], ['22.5', e.e22]] as [string, number][]) {
      add('Fittings', `elbow.${row.utility}.${ang}`, `Elbow ${ang}° — ${row.label}`, n, 'ea', [`elbow.${row.utility}.${ang}`, `elbow.${ang}`, `elbow.${row.utility}`, 'elbow'], row.utility);
    }
    add('Fittings', `tee.${row.utility}`, `Tee — ${row.label}`, teesByUtility.get(row.utility) ?? 0, 'ea', [`tee.${row.utility}`, 'tee'], row.utility);
  }
  for (const row of utilRows) {
    add('Pull boxes', `pullbox.${row.utility}`, `Pull box / handhole — ${row.label}`, row.pullBoxes, 'ea', [`pullbox.${row.utility}`, 'pullbox'], row.utility);
  }
  for (const row of utilRows) {
    add('Marking', `tape.${row.utility}`, `Warning tape — ${row.label}`, row.tape, lab.length, [`tape.${row.utility}`, 'tape'], row.utility);
    add('Marking', `tracer.${row.utility}`, `Tracer wire — ${row.label}`, row.tracer, lab.length, [`tracer.${row.utility}`, 'tracer'], row.utility);
  }
  for (const [key, c] of [...crossingCounts.entries()].sort((a, b) => a[0].localeCompare(b[0]))) {
    const d = c.kind === 'pavement-edge' ? 'Crossing — pavement edge / curb line' : `Crossing — ${c.layer}`;
    add('Crossings', key, d, c.count, 'ea', [key, 'crossing']);
  }

  const totals: TakeOffTotals = {
    trenchLength: r3(len(sum.soft + sum.pave)), lengthSoft: r3(len(sum.soft)), lengthPavement: r3(len(sum.pave)),
    excavation: r3(vol(sum.exc)), bedding: r3(vol(sum.bed)), backfill: r3(vol(sum.back)), haul: r3(vol(sum.haul)),
    sawCut: r3(len(sum.saw)), restoration: r3(area(sum.rest)), crossings: sum.crossings,
    pullBoxes: utilRows.reduce((a, r) => a + r.pullBoxes, 0),
    cost: r2(lines.reduce((a, l) => a + l.cost, 0)),
  };
  if (lines.some((l) => l.priceKey !== null)) warnings.push('Unit prices marked PLACEHOLDER must be replaced before the costs are used.');
  return {
    units, frame: { ...net.frame }, labels: lab, currency: settings.currency, segments: segRows, utilities: utilRows, lines, totals,
    pullBoxes: boxes, contents, warnings, notice: { title: NOTICE_TITLE, lines: NOTICE_LINES },
  };
}

function protectionText(tr: Settings['trench']): string {
  return tr.protective === 'sloping' ? `sloped sides where 5 ft deep or more, OSHA soil type ${tr.soil}` : 'vertical sides';
}

/** Where this utility's conduits end in a pull box: node ids and exact vertex coordinates. */
function boxLookup(boxes: PullBox[], utility: string): { nodes: Set<number>; points: Set<string> } {
  const nodes = new Set<number>();
  const points = new Set<string>();
  for (const b of boxes) {
    if (!b.utilities.includes(utility)) continue;
    if (b.nodeId >= 0) nodes.add(b.nodeId);
    else points.add(`${b.x} ${b.y}`);
  }
  return { nodes, points };
}

/**
 * Elbows of all conduits of one radial utility (one conduit per run): per segment, its bends times
 * the runs through it, and at each node the turn from the segment toward the connection into it —
 * every run through a segment arrives by that segment in a tree. None where a pull box sits.
 */
function radialElbows(net: TrenchNetwork, f: Feeds, fed: { connectionId: string; node: number }[], boxAt: { nodes: Set<number>; points: Set<string> }): ElbowCount {
  const out = zeroElbows();
  const byConn = new Map<string, Int32Array>();
  for (const x of fed) {
    let cnt = byConn.get(x.connectionId);
    if (!cnt) byConn.set(x.connectionId, (cnt = new Int32Array(net.segments.length)));
    const c = cnt;
    walkToRoot(f, f.trees.get(x.connectionId) as RootedTree, x.node, (si) => { c[si]++; });
  }
  for (const [cid, cnt] of byConn) {
    const tree = f.trees.get(cid) as RootedTree;
    for (let si = 0; si < cnt.length; si++) {
      const k = cnt[si];
      if (k === 0) continue;
      const seg = net.segments[si];
      const forward = tree.parentSeg[f.segTo[si]] === si; // walked from → to, away from the connection
      const parent = forward ? f.segFrom[si] : f.segTo[si];
      const pts = orientedPoints(seg, forward);
      const n = pts.length / 2;
      let dir: [number, number] | null = null;
      for (let i = 0; i + 1 < n; i++) {
        const dx = pts[2 * i + 2] - pts[2 * i];
        const dy = pts[2 * i + 3] - pts[2 * i + 1];
        if (dx === 0 && dy === 0) continue;
        if (dir && !boxAt.points.has(`${pts[2 * i]} ${pts[2 * i + 1]}`)) addElbows(out, elbowsForBend(turnDeg(dir[0], dir[1], dx, dy)), k);
        dir = [dx, dy];
      }
      const inSeg = tree.parentSeg[parent];
      if (inSeg >= 0 && !boxAt.nodes.has(net.nodes[parent].id)) {
        const into = orientedPoints(net.segments[inSeg], tree.parentSeg[f.segTo[inSeg]] === inSeg);
        const a = endDirection(into, true);
        const b = endDirection(pts, false);
        addElbows(out, elbowsForBend(turnDeg(a[0], a[1], b[0], b[1])), k);
      }
    }
  }
  return out;
}

/** Elbows at the interior vertices of one polyline (one pipe). */
function interiorElbows(pts: Float64Array): ElbowCount {
  const out = zeroElbows();
  let dir: [number, number] | null = null;
  for (let i = 0; i + 2 < pts.length; i += 2) {
    const dx = pts[i + 2] - pts[i];
    const dy = pts[i + 3] - pts[i + 1];
    if (dx === 0 && dy === 0) continue;
    if (dir) addElbows(out, elbowsForBend(turnDeg(dir[0], dir[1], dx, dy)));
    dir = [dx, dy];
  }
  return out;
}
