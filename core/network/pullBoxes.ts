// Pull boxes (handholes) along conduit runs, placed so that between two pull points the total bend,
// the pull length and — with cable data — the pulling tension stay within each utility's limits.
// Tension by the capstan (Euler–Eytelwein) equation through bends, T_out = T_in·e^(f·θ), and
// T_out = T_in + f·W·L on horizontal straights (ICEA / IEEE 1185 practice, as quoted in DOMAIN.md).
// Bend limit: NEC 2023 352.26 (360° for PVC); telecom 180° (ANSI/TIA-758-A as quoted by BICSI).
// Greedy, walking out from each point of connection: a box goes at the last candidate point
// (tree node, polyline vertex, or a point a straight is split at) before a limit would be passed.
// Runs of one utility share its boxes because the walk covers the utility's subtree once.

import type { UtilitySetting } from '../settings';
import { M_PER_FT, toMetres } from '../units';
import type { TrenchNetwork } from './trenchNetwork';
import type { SegmentContents } from './contents';
import { adjacency, endDirection, orientedPoints, polylineLength, turnDeg } from './contents';

export type PullReason = 'bend' | 'length' | 'tension';

export interface PullBox {
  x: number;
  y: number;
  /** Tree node the box sits on, or -1 when it splits a segment. */
  nodeId: number;
  /** Segment split by the box (nodeId -1), else -1. */
  segmentId: number;
  /** Distance from the segment's `from` end, routing units (when splitting a segment). */
  at: number;
  /** One box per utility at this place (owners rarely share a handhole: common practice). */
  utilities: string[];
  /** Why, per utility, e.g. "power: bend 450° > 360°". */
  reason: string;
  reasons: { utility: string; kind: PullReason; detail: string }[];
}

export interface PullOptions {
  /** Count the riser sweep (90°) at each end of a run toward the bend limit and tension (default true). */
  countRisers?: boolean;
}

const EPS = 1e-9;
/** Angles come from coordinates; a millionth of a degree absorbs their rounding. */
const BEND_EPS_DEG = 1e-6;
const DEG = Math.PI / 180;

interface State { bend: number; lenM: number; tensionLb: number; fresh: boolean }

interface Limits {
  bendDeg: number; // 0: none
  pullM: number; // 0: none
  cable: UtilitySetting['cable'];
  riserDeg: number;
}

function isPulled(u: UtilitySetting): boolean {
  return u.bendLimitDeg > 0 || u.maxPullM > 0 || u.cable !== undefined;
}

/** State after a turn θ (degrees), a straight of lenM, and an end sweep riser (degrees). */
function advance(s: State, lim: Limits, thetaDeg: number, lenM: number, riserDeg: number): State {
  let t = s.tensionLb;
  const c = lim.cable;
  if (c) {
    t = t * Math.exp(c.friction * thetaDeg * DEG) + c.friction * c.weightLbPerFt * (lenM / M_PER_FT);
    t = t * Math.exp(c.friction * riserDeg * DEG);
  }
  return { bend: s.bend + thetaDeg + riserDeg, lenM: s.lenM + lenM, tensionLb: t, fresh: false };
}

function violation(s: State, lim: Limits): { kind: PullReason; detail: string } | null {
  if (lim.bendDeg > 0 && s.bend > lim.bendDeg + BEND_EPS_DEG) return { kind: 'bend', detail: `bend ${round(s.bend)}° > ${lim.bendDeg}°` };
  if (lim.pullM > 0 && s.lenM > lim.pullM + EPS) return { kind: 'length', detail: `pull ${round(s.lenM)} m > ${round(lim.pullM)} m` };
  if (lim.cable && s.tensionLb > lim.cable.maxTensionLb + EPS) {
    return { kind: 'tension', detail: `tension ${round(s.tensionLb)} lb > ${lim.cable.maxTensionLb} lb` };
  }
  return null;
}

const round = (v: number): number => Math.round(v * 10) / 10;
const FRESH: State = { bend: 0, lenM: 0, tensionLb: 0, fresh: true };

/** Pull boxes for every pulled utility, plus warnings for limits no box can satisfy. */
export function placePullBoxesWithWarnings(
  net: TrenchNetwork,
  contents: SegmentContents[],
  utilities: UtilitySetting[],
  options: PullOptions = {},
): { boxes: PullBox[]; warnings: string[] } {
  const countRisers = options.countRisers ?? true;
  const adj = adjacency(net);
  const nodeById = new Map(net.nodes.map((n) => [n.id, n]));
  const toM = (v: number): number => toMetres(v, net.units);
  const boxes = new Map<string, PullBox>();
  const warnings: string[] = [];

  for (const u of utilities) {
    if (!isPulled(u)) continue;
    const lim: Limits = { bendDeg: u.bendLimitDeg, pullM: u.maxPullM, cable: u.cable, riserDeg: countRisers ? 90 : 0 };
    const loadOf = (si: number) => contents[si]?.loads.find((l) => l.utility === u.key);
    const connIds = new Set<string>();
    for (const c of contents) for (const l of c.loads) if (l.utility === u.key) l.connections.forEach((x) => connIds.add(x));

    const addBox = (key: string, x: number, y: number, nodeId: number, segmentId: number, at: number, why: { kind: PullReason; detail: string }) => {
      let b = boxes.get(key);
      if (!b) {
        b = { x, y, nodeId, segmentId, at, utilities: [], reason: '', reasons: [] };
        boxes.set(key, b);
      }
      if (!b.utilities.includes(u.key)) {
        b.utilities.push(u.key);
        b.reasons.push({ utility: u.key, kind: why.kind, detail: why.detail });
        b.reason = b.reasons.map((r) => `${r.utility}: ${r.detail}`).join('; ');
      }
    };

    for (const cid of [...connIds].sort()) {
      const root = net.nodes.find((n) => n.terminalId === cid);
      if (!root) continue;
      const carries = (si: number) => loadOf(si)?.connections.includes(cid) ?? false;
      // Explicit stack: (node, arrival state, incoming direction, segment arrived by).
      const stack: { v: number; s: State; dir: [number, number] | null; via: number }[] = [
        { v: root.id, s: { ...FRESH, bend: lim.riserDeg, tensionLb: 0 }, dir: null, via: -1 },
      ];
      while (stack.length) {
        const { v, s: arrival, dir, via } = stack.pop() as (typeof stack)[number];
        const kids = (adj.get(v) ?? []).filter((si) => si !== via && carries(si));
        const node = nodeById.get(v);
        let cur = arrival;
        // Would the first piece of any child break a limit? Then the box goes on this node.
        const firstSteps = kids.map((si) => firstPiece(si, v));
        const needs = cur.fresh ? null : firstSteps.map((f) => violation(advance(cur, lim, dir ? turnDeg(dir[0], dir[1], f.dx, f.dy) : 0, f.lenM, f.riser), lim)).find((x) => x !== null) ?? null;
        if (needs && node) {
          addBox(`n${v}`, node.x, node.y, v, -1, 0, needs);
          cur = FRESH;
        }
        for (const si of kids) walkSegment(si, v, cur, cur.fresh ? null : dir);
      }

      // --- helpers bound to this utility and connection -------------------------------------
      function firstPiece(si: number, v: number): { dx: number; dy: number; lenM: number; riser: number } {
        const seg = net.segments[si];
        const pts = orientedPoints(seg, seg.from === v);
        const [dx, dy] = endDirection(pts, false);
        const len = toM(Math.hypot(pts[2] - pts[0], pts[3] - pts[1]));
        const last = pts.length === 4;
        return { dx, dy, lenM: len, riser: last && endsHere(si, seg.from === v ? seg.to : seg.from) ? lim.riserDeg : 0 };
      }
      // A run ends where the utility's subtree ends: a leaf carrying it is a service's node.
      function endsHere(si: number, w: number): boolean {
        if (!loadOf(si)) return false;
        return !(adj.get(w) ?? []).some((sj) => sj !== si && carries(sj));
      }
      function walkSegment(si: number, v: number, start: State, dirIn: [number, number] | null): void {
        const seg = net.segments[si];
        const forward = seg.from === v;
        const pts = orientedPoints(seg, forward);
        const w = forward ? seg.to : seg.from;
        const n = pts.length / 2;
        const end = endsHere(si, w);
        let s = start;
        let dir = dirIn;
        let along = 0; // routing units from v
        for (let i = 0; i + 1 < n; i++) {
          const ax = pts[2 * i], ay = pts[2 * i + 1];
          const bx = pts[2 * i + 2], by = pts[2 * i + 3];
          const dx = bx - ax, dy = by - ay;
          const pieceLen = Math.hypot(dx, dy);
          if (pieceLen === 0) continue;
          const riser = end && i + 2 === n ? lim.riserDeg : 0;
          let theta = dir ? turnDeg(dir[0], dir[1], dx, dy) : 0;
          // Box at this vertex (i > 0; the node itself was decided by the caller).
          let why = violation(advance(s, lim, theta, toM(pieceLen), riser), lim);
          if (why && !s.fresh && i > 0) {
            boxAlong(si, forward, along, ax, ay, why);
            s = FRESH;
            theta = 0;
            why = violation(advance(s, lim, 0, toM(pieceLen), riser), lim);
          }
          // Still too much from a fresh start: split the straight itself.
          let remaining = pieceLen;
          let px = ax, py = ay;
          let guard = 0;
          while (why && guard++ < 10000) {
            const base = s.fresh ? s : advance(s, lim, theta, 0, 0);
            const maxStraightM = straightAllowanceM(base, lim);
            let cutM: number;
            if (toM(remaining) > maxStraightM + EPS) cutM = maxStraightM;
            else {
              const tail = tailAllowanceM(lim, riser);
              if (tail === null) {
                warnings.push(`${u.key}: ${why.detail} at (${round(bx)}, ${round(by)}) even right after a pull point; check the limits`);
                break;
              }
              cutM = toM(remaining) - tail;
              // Leaving the connection with its sweep already counted: a box midway clears it.
              if (cutM <= EPS && s.bend > 0) cutM = toM(remaining) / 2;
            }
            if (cutM <= EPS) {
              warnings.push(`${u.key}: ${why.detail} near (${round(px)}, ${round(py)}); no pull point can fix it`);
              break;
            }
            const cut = cutM / toM(1);
            px += (dx / pieceLen) * cut;
            py += (dy / pieceLen) * cut;
            remaining -= cut;
            boxAlong(si, forward, along + (pieceLen - remaining), px, py, why);
            s = FRESH;
            theta = 0;
            why = violation(advance(s, lim, 0, toM(remaining), riser), lim);
          }
          s = advance(s, lim, theta, toM(remaining), riser);
          along += pieceLen;
          dir = [dx, dy];
        }
        if (!end) {
          stack.push({ v: w, s, dir: dir ?? endDirection(pts, true), via: si });
        }
      }
      function boxAlong(si: number, forward: boolean, alongFromV: number, x: number, y: number, why: { kind: PullReason; detail: string }): void {
        const seg = net.segments[si];
        const at = forward ? alongFromV : polylineLength(seg.points) - alongFromV;
        addBox(`s${seg.id}@${at.toFixed(4)}`, x, y, -1, seg.id, at, why);
      }
    }
  }
  const list = [...boxes.values()];
  const segOrder = new Map(net.segments.map((s, i) => [s.id, i]));
  list.sort((a, b) => {
    if ((a.nodeId >= 0) !== (b.nodeId >= 0)) return a.nodeId >= 0 ? -1 : 1;
    if (a.nodeId >= 0) return a.nodeId - b.nodeId;
    return (segOrder.get(a.segmentId) as number) - (segOrder.get(b.segmentId) as number) || a.at - b.at;
  });
  return { boxes: list, warnings };
}

/** Longest straight (metres) that can follow state s without passing the length or tension limit. */
function straightAllowanceM(s: State, lim: Limits): number {
  let m = Infinity;
  if (lim.pullM > 0) m = Math.min(m, lim.pullM - s.lenM);
  if (lim.cable) m = Math.min(m, ((lim.cable.maxTensionLb - s.tensionLb) / (lim.cable.friction * lim.cable.weightLbPerFt)) * M_PER_FT);
  return m;
}

/** Longest final straight (metres) from a pull point into the end sweep; null if the sweep alone fails. */
function tailAllowanceM(lim: Limits, riserDeg: number): number | null {
  if (violation(advance(FRESH, lim, 0, 0, riserDeg), lim)) return null;
  let m = Infinity;
  if (lim.pullM > 0) m = lim.pullM;
  if (lim.cable) {
    const c = lim.cable;
    m = Math.min(m, ((c.maxTensionLb / Math.exp(c.friction * riserDeg * DEG)) / (c.friction * c.weightLbPerFt)) * M_PER_FT);
  }
  return m;
}

/** Pull boxes (handholes) for every pulled utility; see placePullBoxesWithWarnings. */
export function placePullBoxes(net: TrenchNetwork, contents: SegmentContents[], utilities: UtilitySetting[], options: PullOptions = {}): PullBox[] {
  return placePullBoxesWithWarnings(net, contents, utilities, options).boxes;
}
