// A hand-made trench network on the invented Quillby Yard site (see dxf_check.py make):
// one point of connection on the road edge, a junction, two services on building walls.
import type { TrenchNetwork, TrenchSegment } from '../../../core/network/trenchNetwork';
import type { Terminal } from '../../../core/site/site';
import type { LengthUnit } from '../../../core/units';
import { defaultSettings } from '../../../core/settings';
import type { TrenchDrawingInput } from '../../../core/dxf/writeDxf';

const ORIGIN = { x: 631200, y: 5402100 };

function seg(id: number, from: number, to: number, pts: number[], k: number): TrenchSegment {
  const p = Float64Array.from(pts.map((v) => v * k));
  let length = 0;
  for (let i = 2; i < p.length; i += 2) length += Math.hypot(p[i] - p[i - 2], p[i + 1] - p[i - 1]);
  const bendsDeg: number[] = [];
  for (let i = 2; i < p.length - 2; i += 2) {
    const a1 = Math.atan2(p[i + 1] - p[i - 1], p[i] - p[i - 2]);
    const a2 = Math.atan2(p[i + 3] - p[i + 1], p[i + 2] - p[i]);
    let d = Math.abs(a2 - a1) * 180 / Math.PI;
    if (d > 180) d = 360 - d;
    bendsDeg.push(d);
  }
  return { id, from, to, points: p, length, lengthUnderPavement: 0, crossings: [], bendsDeg, stub: false };
}

/** Local coordinates are metres × k (k = 1 for m, 1/0.3048 for ft); frame scale 1. */
export function sampleInput(units: LengthUnit): TrenchDrawingInput {
  const k = units === 'm' ? 1 : 1 / 0.3048;
  const frame = { originX: ORIGIN.x, originY: ORIGIN.y, scale: 1 };
  const segments = [
    seg(0, 0, 1, [50, 0.5, 50, 8], k),
    seg(1, 1, 2, [50, 8, 45, 8, 42, 11, 40, 11], k),
    seg(2, 1, 3, [50, 8, 60, 8, 62, 10, 62, 12], k),
  ];
  const net: TrenchNetwork = {
    units, frame,
    nodes: [
      { id: 0, kind: 'connection', x: 50 * k, y: 0.5 * k, terminalId: 'POC1' },
      { id: 1, kind: 'junction', x: 50 * k, y: 8 * k },
      { id: 2, kind: 'service', x: 40 * k, y: 11 * k, terminalId: 'B1' },
      { id: 3, kind: 'service', x: 62 * k, y: 12 * k, terminalId: 'B2' },
    ],
    segments,
    quality: { cost: 40 * k, lowerBound: 38 * k, gap: 0.05 },
    unreachable: [{ id: 'B3', reason: 'enclosed by a keep-out' }],
    warnings: [],
  };
  const term = (id: string, role: 'service' | 'connection', x: number, y: number, utilities: string[]): Terminal => ({
    id, role, utilities, given: { x: x * k, y: (y + 0.4) * k }, x: x * k, y: y * k, nx: 0, ny: 0, building: -1, snapDistance: role === 'service' ? 0.4 * k : 0,
  });
  const terminals = [
    term('POC1', 'connection', 50, 0.5, ['power', 'telecom', 'water', 'gas']),
    term('B1', 'service', 40, 11, ['power', 'telecom']),
    term('B2', 'service', 62, 12, ['power', 'water', 'gas']),
    term('B3', 'service', 80, 45, ['power']),
  ];
  return {
    net, terminals, utilities: defaultSettings().utilities,
    segments: [
      { segmentId: 0, width: 0.6 * k, carries: { power: 2, telecom: 1, water: 1, gas: 1 } },
      { segmentId: 1, width: 0.45 * k, carries: { power: 1, telecom: 1 } },
      { segmentId: 2, width: 0.5 * k, carries: { power: 1, water: 1, gas: 1 } },
    ],
    pullBoxes: [{ x: 50 * k, y: 8 * k, utilities: ['power', 'telecom'] }],
    extents: { minX: ORIGIN.x, minY: ORIGIN.y, maxX: ORIGIN.x + 100 * k, maxY: ORIGIN.y + 57 * k },
  };
}

/** Total centreline length of the sample, routing units. */
export function sampleLength(input: TrenchDrawingInput): number {
  return input.net.segments.reduce((a, s) => a + s.length, 0);
}
