// Small seed drawings for the fuzz tests: a few kilobytes each, so that ten thousand mutated
// copies run in seconds. Both DXF dialects the reader accepts (R12 / AC1009 with POLYLINE +
// VERTEX, R2000 / AC1015 with LWPOLYLINE, ELLIPSE, SPLINE, MTEXT), blocks nested two deep, an
// INSERT array, courtyards, pavement and a boundary. The place (Harrowmere Yard) is invented.
// Group codes: DXF reference (HEADER, TABLES, BLOCKS, ENTITIES sections).

/** Group code / value pairs written one per line, as an ASCII DXF has them. */
export function dxfLines(pairs: readonly (readonly [number, string | number])[]): string {
  const out: string[] = [];
  for (const [c, v] of pairs) out.push(String(c).padStart(3), String(v));
  return out.join('\n') + '\n';
}

type Pair = readonly [number, string | number];

const header = (ver: string, insUnits: number): Pair[] => [
  [0, 'SECTION'], [2, 'HEADER'], [9, '$ACADVER'], [1, ver], [9, '$INSUNITS'], [70, insUnits],
  [9, '$EXTMIN'], [10, 0], [20, 0], [9, '$EXTMAX'], [10, 120], [20, 90], [0, 'ENDSEC'],
];

const layerTable = (names: readonly [string, number][]): Pair[] => [
  [0, 'SECTION'], [2, 'TABLES'], [0, 'TABLE'], [2, 'LAYER'], [70, names.length],
  ...names.flatMap(([n, c]): Pair[] => [[0, 'LAYER'], [2, n], [70, 0], [62, c], [6, 'CONTINUOUS']]),
  [0, 'ENDTAB'], [0, 'ENDSEC'],
];

const block = (name: string, body: Pair[]): Pair[] => [
  [0, 'BLOCK'], [8, '0'], [2, name], [70, 0], [10, 0], [20, 0], [30, 0], [3, name], ...body, [0, 'ENDBLK'], [8, '0'],
];

const lw = (layer: string, pts: number[], closed: boolean, bulges: Record<number, number> = {}): Pair[] => {
  const out: Pair[] = [[0, 'LWPOLYLINE'], [8, layer], [90, pts.length / 2], [70, closed ? 1 : 0]];
  for (let i = 0; i < pts.length; i += 2) {
    out.push([10, pts[i]], [20, pts[i + 1]]);
    if (bulges[i / 2] !== undefined) out.push([42, bulges[i / 2]]);
  }
  return out;
};

const r12poly = (layer: string, pts: number[], closed: boolean, bulges: Record<number, number> = {}): Pair[] => {
  const out: Pair[] = [[0, 'POLYLINE'], [8, layer], [66, 1], [10, 0], [20, 0], [30, 0], [70, closed ? 1 : 0]];
  for (let i = 0; i < pts.length; i += 2) {
    out.push([0, 'VERTEX'], [8, layer], [10, pts[i]], [20, pts[i + 1]], [30, 0]);
    if (bulges[i / 2] !== undefined) out.push([42, bulges[i / 2]]);
  }
  out.push([0, 'SEQEND'], [8, layer]);
  return out;
};

const line = (layer: string, x0: number, y0: number, x1: number, y1: number): Pair[] => [
  [0, 'LINE'], [8, layer], [10, x0], [20, y0], [30, 0], [11, x1], [21, y1], [31, 0],
];

const insert = (layer: string, name: string, x: number, y: number, extra: Pair[] = []): Pair[] => [
  [0, 'INSERT'], [8, layer], [2, name], [10, x], [20, y], [30, 0], ...extra,
];

/** R2000 seed: two buildings (one with a courtyard), pavement, a curb, blocks, curves and text. */
export function seedR2000(): string {
  return dxfLines([
    ...header('AC1015', 6),
    ...layerTable([['0', 7], ['BLDG', 1], ['PAVE', 8], ['CURB', 3], ['SITE-LIMIT', 5], ['NOTE', 2], ['TREE', 3]]),
    [0, 'SECTION'], [2, 'BLOCKS'],
    ...block('TREE-A', [
      [0, 'CIRCLE'], [8, '0'], [10, 0], [20, 0], [30, 0], [40, 1.5],
      ...line('0', -1, 0, 1, 0),
    ]),
    ...block('GROVE', [...insert('0', 'TREE-A', 0, 0), ...insert('0', 'TREE-A', 4, 0, [[41, 2], [42, 2], [50, 30]])]),
    [0, 'ENDSEC'],
    [0, 'SECTION'], [2, 'ENTITIES'],
    ...lw('BLDG', [10, 10, 40, 10, 40, 40, 10, 40], true),
    ...lw('BLDG', [20, 20, 30, 20, 30, 30, 20, 30], true),
    ...lw('BLDG', [60, 15, 85, 15, 85, 35, 60, 35], true, { 1: 0.2 }),
    ...lw('PAVE', [0, 50, 120, 50, 120, 60, 0, 60], true),
    ...lw('CURB', [0, 48, 120, 48], false),
    ...lw('SITE-LIMIT', [-5, -5, 125, -5, 125, 95, -5, 95], true),
    [0, 'ELLIPSE'], [8, 'TREE'], [10, 100], [20, 80], [30, 0], [11, 4], [21, 0], [31, 0], [40, 0.5], [41, 0], [42, 6.283185307179586],
    [0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, 3], [72, 8], [73, 4], [74, 0],
    [40, 0], [40, 0], [40, 0], [40, 0], [40, 1], [40, 1], [40, 1], [40, 1],
    [10, 0], [20, 70], [30, 0], [10, 30], [20, 75], [30, 0], [10, 60], [20, 65], [30, 0], [10, 90], [20, 70], [30, 0],
    [0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, 3], [74, 3], [11, 0], [21, 80], [31, 0], [11, 20], [21, 85], [31, 0], [11, 40], [21, 80], [31, 0],
    [0, 'ARC'], [8, 'CURB'], [10, 50], [20, 5], [30, 0], [40, 3], [50, 0], [51, 180],
    [0, 'MTEXT'], [8, 'NOTE'], [10, 12], [20, 45], [30, 0], [40, 1.2], [1, '{\\fArial|b1;Harrowmere Yard}\\PBlock B'],
    [0, 'TEXT'], [8, 'NOTE'], [10, 62], [20, 38], [30, 0], [40, 1], [1, 'Unit 2'],
    ...insert('TREE', 'GROVE', 95, 20),
    ...insert('TREE', 'TREE-A', 5, 75, [[70, 3], [71, 2], [44, 5], [45, 5]]),
    [0, 'ENDSEC'],
    [0, 'EOF'],
  ]);
}

/** R12 seed: POLYLINE + VERTEX with a bulge, a building drawn as loose LINEs, a block, text. */
export function seedR12(): string {
  return dxfLines([
    ...header('AC1009', 6),
    ...layerTable([['0', 7], ['BUILDING', 1], ['PAVING', 8], ['FENCE', 3]]),
    [0, 'SECTION'], [2, 'BLOCKS'],
    ...block('POST', [[0, 'CIRCLE'], [8, '0'], [10, 0], [20, 0], [30, 0], [40, 0.2]]),
    [0, 'ENDSEC'],
    [0, 'SECTION'], [2, 'ENTITIES'],
    ...r12poly('BUILDING', [5, 5, 30, 5, 30, 25, 5, 25], true, { 2: -0.3 }),
    ...line('BUILDING', 50, 5, 70, 5), ...line('BUILDING', 70, 5, 70, 20),
    ...line('BUILDING', 70, 20, 50, 20), ...line('BUILDING', 50, 20, 50, 5),
    ...r12poly('PAVING', [0, 30, 80, 30, 80, 38, 0, 38], true),
    ...r12poly('FENCE', [0, 45, 40, 45, 80, 45], false),
    [0, 'CIRCLE'], [8, 'FENCE'], [10, 40], [20, 50], [30, 0], [40, 2],
    [0, 'TEXT'], [8, 'BUILDING'], [10, 10], [20, 15], [30, 0], [40, 1], [1, 'Harrowmere Stores'],
    ...insert('FENCE', 'POST', 0, 45, [[70, 9], [44, 10]]),
    [0, 'ENDSEC'],
    [0, 'EOF'],
  ]);
}

/** A chain of `depth` blocks, each inserting the next; the last holds a square. */
export function nestedBlocks(depth: number, cycleBack = -1): string {
  const blocks: Pair[] = [];
  for (let i = 0; i < depth; i++) {
    const body: Pair[] = i + 1 < depth
      ? insert('0', `N${i + 1}`, 1, 0)
      : cycleBack >= 0 ? insert('0', `N${cycleBack}`, 1, 0) : lw('0', [0, 0, 10, 0, 10, 10, 0, 10], true);
    blocks.push(...block(`N${i}`, body));
  }
  return dxfLines([
    ...header('AC1015', 6),
    [0, 'SECTION'], [2, 'BLOCKS'], ...blocks, [0, 'ENDSEC'],
    [0, 'SECTION'], [2, 'ENTITIES'], ...insert('BLDG', 'N0', 0, 0), ...lw('BLDG', [20, 0, 30, 0, 30, 10, 20, 10], true), [0, 'ENDSEC'],
    [0, 'EOF'],
  ]);
}

/** One LWPOLYLINE with `n` vertices (a zig-zag strip), plus a building so the site stage has work. */
export function hugePolyline(n: number, layer = 'CURB'): string {
  const head = dxfLines([
    ...header('AC1015', 6),
    [0, 'SECTION'], [2, 'ENTITIES'], ...lw('BLDG', [0, 0, 10, 0, 10, 10, 0, 10], true),
    [0, 'LWPOLYLINE'], [8, layer], [90, n], [70, 0],
  ]);
  const parts: string[] = [head];
  const chunk: string[] = [];
  for (let i = 0; i < n; i++) {
    chunk.push(' 10', String(i * 0.01), ' 20', String((i & 1) * 0.5 + 20));
    if (chunk.length >= 40_000) { parts.push(chunk.join('\n') + '\n'); chunk.length = 0; }
  }
  if (chunk.length) parts.push(chunk.join('\n') + '\n');
  parts.push(dxfLines([[0, 'ENDSEC'], [0, 'EOF']]));
  return parts.join('');
}

/** Wrap entity pairs into a minimal R2000 drawing with one building. */
export function withEntities(extra: Pair[], blocks: Pair[] = []): string {
  return dxfLines([
    ...header('AC1015', 6),
    ...(blocks.length ? [[0, 'SECTION'], [2, 'BLOCKS'], ...blocks, [0, 'ENDSEC']] as Pair[] : []),
    [0, 'SECTION'], [2, 'ENTITIES'], ...lw('BLDG', [0, 0, 10, 0, 10, 10, 0, 10], true), ...extra, [0, 'ENDSEC'],
    [0, 'EOF'],
  ]);
}

export const pairsOf = { block, lw, line, insert, r12poly };
export type { Pair };
