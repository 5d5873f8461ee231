// Join open pieces (LINE, ARC, open polylines) whose ends meet within a tolerance into closed
// rings. Greedy chaining from each unused piece: extend the tail, then the head, with the nearest
// unused end within the tolerance (ends bucketed on a grid of cell = tolerance).

export interface OpenChain {
  points: Float64Array;
  /** The gap between the chain's two ends (where the ring fails to close). */
  gap: { x0: number; y0: number; x1: number; y1: number; length: number };
}

export interface StitchResult { rings: Float64Array[]; open: OpenChain[] }

export function stitchRings(pieces: Float64Array[], tol: number): StitchResult {
  const n = pieces.length;
  const used = new Uint8Array(n);
  const cell = tol > 0 ? tol : 1e-9;
  const grid = new Map<number, number[]>(); // key → end ids (2*piece + 0 start / 1 end)
  const key = (cx: number, cy: number): number => cx * 67108864 + cy; // exact for |cx|,|cy| < 2^26
  const endX = (id: number): number => { const p = pieces[id >> 1]; return id & 1 ? p[p.length - 2] : p[0]; };
  const endY = (id: number): number => { const p = pieces[id >> 1]; return id & 1 ? p[p.length - 1] : p[1]; };
  for (let id = 0; id < 2 * n; id++) {
    const k = key(Math.floor(endX(id) / cell), Math.floor(endY(id) / cell));
    const b = grid.get(k);
    if (b) b.push(id); else grid.set(k, [id]);
  }
  const nearest = (x: number, y: number): number => {
    const cx = Math.floor(x / cell), cy = Math.floor(y / cell);
    let best = -1, bestD = tol;
    for (let dx = -1; dx <= 1; dx++) {
      for (let dy = -1; dy <= 1; dy++) {
        const b = grid.get(key(cx + dx, cy + dy));
        if (!b) continue;
        for (const id of b) {
          if (used[id >> 1]) continue;
          const d = Math.hypot(endX(id) - x, endY(id) - y);
          if (d <= bestD && (best < 0 || d < bestD || id < best)) { best = id; bestD = d; }
        }
      }
    }
    return best;
  };

  const rings: Float64Array[] = [];
  const open: OpenChain[] = [];
  for (let s = 0; s < n; s++) {
    if (used[s]) continue;
    used[s] = 1;
    const chain: number[] = Array.from(pieces[s]);
    const closes = (): boolean => chain.length >= 6 && Math.hypot(chain[0] - chain[chain.length - 2], chain[1] - chain[chain.length - 1]) <= tol;
    // extend the tail
    while (!closes()) {
      const id = nearest(chain[chain.length - 2], chain[chain.length - 1]);
      if (id < 0) break;
      used[id >> 1] = 1;
      appendPiece(chain, pieces[id >> 1], (id & 1) === 1);
    }
    // extend the head (prepend), working on the reversed chain
    if (!closes()) {
      reverseInPlace(chain);
      while (!closes()) {
        const id = nearest(chain[chain.length - 2], chain[chain.length - 1]);
        if (id < 0) break;
        used[id >> 1] = 1;
        appendPiece(chain, pieces[id >> 1], (id & 1) === 1);
      }
    }
    if (closes()) {
      chain.length -= 2; // the ring does not repeat its first point
      rings.push(Float64Array.from(chain));
    } else {
      const m = chain.length;
      open.push({
        points: Float64Array.from(chain),
        gap: { x0: chain[m - 2], y0: chain[m - 1], x1: chain[0], y1: chain[1], length: Math.hypot(chain[0] - chain[m - 2], chain[1] - chain[m - 1]) },
      });
    }
  }
  return { rings, open };
}

/** Append piece p (reversed when `fromEnd`, i.e. its end point meets the chain) without repeating the joint. */
function appendPiece(chain: number[], p: Float64Array, fromEnd: boolean): void {
  const m = p.length / 2;
  for (let k = 1; k < m; k++) {
    const i = fromEnd ? m - 1 - k : k;
    chain.push(p[2 * i], p[2 * i + 1]);
  }
}

function reverseInPlace(a: number[]): void {
  const m = a.length / 2;
  for (let i = 0, j = m - 1; i < j; i++, j--) {
    const x = a[2 * i], y = a[2 * i + 1];
    a[2 * i] = a[2 * j];
    a[2 * i + 1] = a[2 * j + 1];
    a[2 * j] = x;
    a[2 * j + 1] = y;
  }
}
