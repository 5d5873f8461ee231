// Expansion bombs at the default limits, each in a worker with a wall-clock bound and a 1 GB
// heap: a polyline of a million vertices, a small file whose bulges tessellate to tens of
// millions of points, a million-cell INSERT array, arrays nested in arrays, and a block chain
// one level past the depth limit. Each must end in a drawing or a limit error, never a
// timeout or an out-of-memory death.
import { describe, expect, it } from 'vitest';
import { runInWorker } from './inWorker';
import { dxfLines, pairsOf, withEntities, type Pair } from './seedDrawings';
import { DEFAULT_MAX_BLOCK_DEPTH } from '../../core/dxf/readDxf';

const HEAP_MB = 1024;

/** 10 000 vertices 1000 km apart, each segment a half circle: 4096 chords each (the per-curve cap) at 1 cm. */
function bulgeBomb(n: number): string {
  const pairs: Pair[] = [[0, 'LWPOLYLINE'], [8, 'CURB'], [90, n], [70, 0]];
  for (let i = 0; i < n; i++) pairs.push([10, i * 1e6], [20, 0], [42, 1]);
  return withEntities(pairs);
}

const tree = pairsOf.block('T', [[0, 'CIRCLE'], [8, '0'], [10, 0], [20, 0], [30, 0], [40, 1]]);

describe('expansion bombs at the default limits', () => {
  it('a 1 000 000-vertex polyline on a crossing layer reads and builds a site within 60 s', async () => {
    const o = await runInWorker({ kind: 'hugePolyline', vertices: 1_000_000 }, 60_000, HEAP_MB);
    console.log(JSON.stringify({ bomb: 'polyline-1M', ...o }));
    expect(o.type, JSON.stringify(o)).toBe('done');
    if (o.type === 'done') expect(o.label).toBe('site');
  });

  // found here: the repair of a self-intersecting footprint is quadratic in its crossings (40 000 vertices: 32 s)
  it('a 1 000 000-vertex closed zig-zag on the building layer ends within 60 s (the outline is skipped, not repaired)', async () => {
    const o = await runInWorker({ kind: 'hugePolyline', vertices: 1_000_000, layer: 'BLDG', closed: true }, 60_000, HEAP_MB);
    console.log(JSON.stringify({ bomb: 'building-1M', ...o }));
    expect(o.type, JSON.stringify(o)).toBe('done');
  });

  it('a 20 000-vertex closed zig-zag footprint is skipped with a warning within 10 s', async () => {
    const o = await runInWorker({ kind: 'hugePolyline', vertices: 20_000, layer: 'BLDG', closed: true }, 10_000, HEAP_MB);
    expect(o.type, JSON.stringify(o)).toBe('done');
  });

  it('a 300 kB polyline whose bulges tessellate to 41 M points is refused by the vertex limit within 60 s', async () => {
    const o = await runInWorker({ kind: 'text', text: bulgeBomb(10_000) }, 60_000, HEAP_MB);
    console.log(JSON.stringify({ bomb: 'bulges-41M', ...o }));
    expect(o).toMatchObject({ type: 'done', label: 'read:limit' });
  });

  it('a 1000 × 1000 INSERT array (a million 1 m circles: within the 2 M entity limit, over the 20 M vertex limit) is refused within 30 s', async () => {
    const text = withEntities([...pairsOf.insert('TREE', 'T', 0, 0, [[70, 1000], [71, 1000], [44, 3], [45, 3]])], tree);
    const o = await runInWorker({ kind: 'text', text }, 30_000, HEAP_MB);
    console.log(JSON.stringify({ bomb: 'insert-array-1M', ...o }));
    expect(o).toMatchObject({ type: 'done', label: 'read:limit' });
  });

  // found here: the entity limit was reached only after 2 M entities (8–25 s, 600 MB of heap); now refused before expanding
  it('a 100 × 100 array of 100 × 100 arrays (10⁸ circles) is refused by the entity limit within 5 s', async () => {
    const blocks = [...tree, ...pairsOf.block('ROW', pairsOf.insert('0', 'T', 0, 0, [[70, 100], [71, 100], [44, 3], [45, 3]]))];
    const text = withEntities(pairsOf.insert('TREE', 'ROW', 0, 0, [[70, 100], [71, 100], [44, 400], [45, 400]]), blocks);
    const o = await runInWorker({ kind: 'text', text }, 5_000, HEAP_MB);
    console.log(JSON.stringify({ bomb: 'nested-arrays-1e8', ...o }));
    expect(o).toMatchObject({ type: 'done', label: 'read:limit' });
  });

  it(`a block chain one past the depth limit (${DEFAULT_MAX_BLOCK_DEPTH + 1}) is refused`, async () => {
    const o = await runInWorker({ kind: 'nested', depth: DEFAULT_MAX_BLOCK_DEPTH + 2 }, 10_000, HEAP_MB);
    expect(o).toMatchObject({ type: 'done', label: 'read:limit' });
  });
});
void dxfLines;
