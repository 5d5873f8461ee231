// CSR graph, components, indexed heap and the instance reader, checked against hand-worked
// small cases and against plain sorting (heap order) as the independent reference.
import { describe, expect, it } from 'vitest';
import { buildGraph, componentOf, splitReachableTerminals } from '../../../core/route/graph';
import { IndexedHeap } from '../../../core/route/heap';
import { makeRng } from '../../../core/route/rng';
import { parseStp } from '../../../core/route/stp';

describe('buildGraph', () => {
  it('stores both directions of each edge with its id, neighbours in edge-id order', () => {
    const g = buildGraph(4, [0, 1, 0], [1, 2, 3], [1.5, 2, 0]);
    expect(Array.from(g.offsets)).toEqual([0, 2, 4, 5, 6]);
    expect(Array.from(g.adj.subarray(0, 2))).toEqual([1, 3]);
    expect(Array.from(g.adjEdge.subarray(0, 2))).toEqual([0, 2]);
    expect(Array.from(g.adj.subarray(2, 4))).toEqual([0, 2]);
    expect(g.weight[0]).toBe(1.5);
  });

  it('rejects out-of-range endpoints and negative weights with the numbers in the message', () => {
    expect(() => buildGraph(2, [0], [2], [1])).toThrow(/\(0, 2\)/);
    expect(() => buildGraph(2, [0], [1], [-1])).toThrow(/-1/);
  });

  it('labels components and splits terminals into the biggest terminal group and the rest', () => {
    const g = buildGraph(6, [0, 1, 3], [1, 2, 4], [1, 1, 1]);
    expect(Array.from(componentOf(g))).toEqual([0, 0, 0, 1, 1, 2]);
    expect(splitReachableTerminals(g, [3, 0, 2, 5, 2])).toEqual({ reachable: [0, 2], unreachable: [3, 5] });
  });
});

describe('IndexedHeap', () => {
  it('pops in the order of a stable sort by (key, id) with decrease-key', () => {
    const rnd = makeRng(3);
    const n = 500;
    const h = new IndexedHeap(n);
    const key = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      key[i] = Math.floor(rnd() * 50);
      h.push(i, key[i]);
    }
    for (let i = 0; i < n; i += 3) {
      key[i] = Math.max(0, key[i] - Math.floor(rnd() * 20));
      h.push(i, key[i]);
    }
    const expected = Array.from({ length: n }, (_, i) => i).sort((a, b) => key[a] - key[b] || a - b);
    const got: number[] = [];
    while (h.size > 0) got.push(h.pop());
    expect(got).toEqual(expected);
  });
});

describe('parseStp', () => {
  it('reads nodes, edges and terminals 1-based to 0-based, skipping other sections', () => {
    const text = 'SECTION Comment\nName "x"\nEND\n\nSECTION Graph\nNodes 3\nEdges 2\nE 1 2 5\nE 2 3 7\nEND\n\nSECTION Terminals\nTerminals 2\nT 1\nT 3\nEND\n\nSECTION Tree Decomposition\ns td 1 1 3\nb 1 1 2 3\nEND\n\nEOF\n';
    const r = parseStp(text);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.value.graph.n).toBe(3);
    expect(Array.from(r.value.graph.edgeU)).toEqual([0, 1]);
    expect(Array.from(r.value.graph.weight)).toEqual([5, 7]);
    expect(Array.from(r.value.terminals)).toEqual([0, 2]);
  });

  it('reports the line of a malformed edge', () => {
    const r = parseStp('SECTION Graph\nNodes 2\nE 1 x 3\nEND\n');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.line).toBe(3);
  });
});
