// The shortest-path heuristic against closed-form optima (rectilinear Steiner tree of a square,
// Manhattan distance, a weighted star) and structural checks (a tree spanning all terminals).
import { describe, expect, it } from 'vitest';
import { buildGraph } from '../../../core/route/graph';
import { solveSteiner } from '../../../core/route/steiner';

function gridGraph(w: number, h: number): { n: number; u: number[]; v: number[]; c: number[] } {
  const u: number[] = [];
  const v: number[] = [];
  const c: number[] = [];
  for (let y = 0; y < h; y++)
    for (let x = 0; x < w; x++) {
      const i = y * w + x;
      if (x + 1 < w) { u.push(i); v.push(i + 1); c.push(1); }
      if (y + 1 < h) { u.push(i); v.push(i + w); c.push(1); }
    }
  return { n: w * h, u, v, c };
}

function isTreeSpanning(n: number, eu: Int32Array, ev: Int32Array, edges: Int32Array, terms: number[]): boolean {
  const parent = Array.from({ length: n }, (_, i) => i);
  const f = (x: number): number => (parent[x] === x ? x : (parent[x] = f(parent[x])));
  for (const e of edges) {
    const a = f(eu[e]);
    const b = f(ev[e]);
    if (a === b) return false; // cycle
    parent[a] = b;
  }
  return terms.every((t) => f(t) === f(terms[0]));
}

describe('solveSteiner (shortest-path heuristic)', () => {
  it('connects the four corners of a 10x10 unit grid with the rectilinear optimum 3*9 = 27', () => {
    // closed form: the rectilinear Steiner minimum tree of a square's corners, side s, is 3s.
    const gg = gridGraph(10, 10);
    const g = buildGraph(gg.n, gg.u, gg.v, gg.c);
    const terms = [0, 9, 90, 99];
    const r = solveSteiner(g, terms);
    expect(isTreeSpanning(g.n, g.edgeU, g.edgeV, r.edges, terms)).toBe(true);
    expect(r.cost).toBe(27);
  });

  it('finds the shortest path for two terminals (Manhattan distance on a grid, closed form)', () => {
    const gg = gridGraph(7, 5);
    const g = buildGraph(gg.n, gg.u, gg.v, gg.c);
    const r = solveSteiner(g, [3, 4 * 7 + 6]);
    expect(r.cost).toBe(3 + 4);
  });

  it('uses the Steiner point of a star (weights make the hub cheaper than any terminal path)', () => {
    // star: hub 0 to leaves 1..3 with weight 1; leaf-leaf edges weight 3; optimum 3 (closed form).
    const g = buildGraph(4, [0, 0, 0, 1, 2, 1], [1, 2, 3, 2, 3, 3], [1, 1, 1, 3, 3, 3]);
    const r = solveSteiner(g, [1, 2, 3]);
    expect(r.cost).toBe(3);
    expect(Array.from(r.edges).sort()).toEqual([0, 1, 2]);
  });

  it('throws naming the terminals that are not connected', () => {
    const g = buildGraph(4, [0, 2], [1, 3], [1, 1]);
    expect(() => solveSteiner(g, [0, 1, 3])).toThrow(/3/);
  });
});
