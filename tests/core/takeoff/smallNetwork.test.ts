// One connection, one junction, two services: the whole take-off computed by hand and matched
// line by line. Settings are the defaults (DOMAIN.md sources; see core/settings.ts).
import { describe, expect, it } from 'vitest';
import { computeTakeOff } from '../../../core/takeoff/takeoff';
import { defaultSettings } from '../../../core/settings';
import { handNetwork, terminal } from './handNetwork';

const IN = 0.0254; // exact (NIST)
const U = ['power', 'telecom', 'water'];
//   C (0,0) ──40 m, 10 m of it under pavement, 2 pavement edges, 1 existing water line── J (40,0)
//   J ── 30 m north ── S1 (40,30);  J ── 20 m east, then 45° ── S2 (70,10)
const net = handNetwork(
  [
    { id: 0, kind: 'connection', x: 0, y: 0, terminalId: 'C' },
    { id: 1, kind: 'junction', x: 40, y: 0 },
    { id: 2, kind: 'service', x: 40, y: 30, terminalId: 'S1' },
    { id: 3, kind: 'service', x: 70, y: 10, terminalId: 'S2' },
  ],
  [
    {
      from: 0, to: 1, pts: [0, 0, 40, 0], pave: 10,
      crossings: [
        { x: 15, y: 0, layer: 'PAVE', kind: 'pavement-edge' },
        { x: 25, y: 0, layer: 'PAVE', kind: 'pavement-edge' },
        { x: 30, y: 0, layer: 'EXIST-WATER', kind: 'line' },
      ],
    },
    { from: 1, to: 2, pts: [40, 0, 40, 30] },
    { from: 1, to: 3, pts: [40, 0, 60, 0, 70, 10] },
  ],
);
const terms = [terminal('C', 'connection', U, 0, 0), terminal('S1', 'service', U, 40, 30), terminal('S2', 'service', U, 70, 10)];

// --- by hand --------------------------------------------------------------------------------
const L2 = 20 + Math.hypot(10, 10); // 34.142 m
// Sections (defaults: 6 in side clearance, 3 in duct spacing, 12 in between utilities, 6 in bedding):
//  seg 0: power 2 + telecom 2 conduits (2 × 2.375 + 3 = 7.75 in each), water 1 (2.375 in)
//         width = 7.75 + 7.75 + 2.375 + 2 × 12 + 2 × 6 = 53.875 in
//  seg 1, 2: one of each: width = 3 × 2.375 + 24 + 12 = 43.125 in
//  depth everywhere: water governs, 36 in cover + 2.375 + 6 = 44.375 in (< 60 in: vertical sides, OSHA 1926.652(a)(1))
const W0 = 53.875 * IN, W1 = 43.125 * IN, D = 44.375 * IN, BED = 6 * IN;
const ductA = Math.PI * (2.375 * IN) ** 2 / 4;
const exc = W0 * D * 40 + W1 * D * (30 + L2);
const bed = W0 * BED * 40 + W1 * BED * (30 + L2);
const duct = ductA * (5 * 40 + 3 * (30 + L2));
const cutW = W0 + 2 * 18 * IN; // 18 in overcut each side (default)
const expected: Record<string, number> = {
  'trench.soft': 30 + 30 + L2,
  'trench.pavement': 10,
  excavation: exc,
  bedding: bed,
  backfill: exc - bed - duct,
  haul: (bed + duct) * 1.25, // spoil reused, surplus hauled loose, 25 % swell
  sawcut: 2 * 10 + 2 * cutW, // two long cuts + one across at each pavement edge
  'pavement.restore': 10 * cutW,
  // conduit: per segment × conduits, plus a 1.5 m stub-up at both ends of each conduit (2 runs × 2 ends)
  'conduit.power.2.375in': 40 * 2 + 30 + L2 + 4 * 1.5,
  'conduit.telecom.2.375in': 40 * 2 + 30 + L2 + 4 * 1.5,
  // the main: one pipe, a stub-up at C, S1, S2
  'conduit.water.2.375in': 40 + 30 + L2 + 3 * 1.5,
  // power: 90° at J toward S1, 45° toward S2, plus a riser sweep at each end of both conduits
  'elbow.power.90': 1 + 4,
  'elbow.power.45': 1,
  // telecom: its pull box sits at J (riser 90 + turn 90 + riser 90 = 270° > 180°), so no elbow at J
  'elbow.telecom.90': 4,
  'elbow.telecom.45': 1,
  // water main: tee at J, 45° bend toward S2, a riser at C, S1, S2
  'elbow.water.90': 3,
  'elbow.water.45': 1,
  'tee.water': 1,
  'pullbox.telecom': 1,
  'tape.power': 40 + 30 + L2,
  'tape.telecom': 40 + 30 + L2,
  'tape.water': 40 + 30 + L2,
  // tracer on non-metallic utilities (telecom conduit, water pipe) over the trench plus stub-ups
  'tracer.telecom': 40 + 30 + L2 + 4 * 1.5,
  'tracer.water': 40 + 30 + L2 + 3 * 1.5,
  'crossing.EXIST-WATER': 1,
  'crossing.pavement-edge': 2,
};

describe('take-off of a small network, line by line', () => {
  const t = computeTakeOff(net, terms, defaultSettings());

  it('has exactly the hand-listed line items', () => {
    expect(t.lines.map((l) => l.key).sort()).toEqual(Object.keys(expected).sort());
  });

  for (const [key, q] of Object.entries(expected)) {
    it(`${key} = ${q.toFixed(3)}`, () => {
      const line = t.lines.find((l) => l.key === key);
      expect(line?.quantity).toBeCloseTo(q, 3);
    });
  }

  it('prices each line as quantity × unit price and totals them (placeholder prices per m, m², m³, ea)', () => {
    const price: Record<string, number> = Object.fromEntries(defaultSettings().prices.map((p) => [p.key, p.price]));
    const trench = t.lines.find((l) => l.key === 'trench.pavement');
    expect(trench?.unitPrice).toBe(price['trench.pavement']);
    expect(trench?.cost).toBeCloseTo(10 * price['trench.pavement'], 2);
    const box = t.lines.find((l) => l.key === 'pullbox.telecom');
    expect(box?.cost).toBe(price.pullbox);
    let total = 0;
    for (const [key, q] of Object.entries(expected)) {
      const line = t.lines.find((l) => l.key === key);
      total += Math.round(Math.round(q * 1000) / 1000 * (line?.unitPrice ?? NaN) * 100) / 100;
    }
    expect(t.totals.cost).toBeCloseTo(total, 2);
    expect(t.warnings.some((w) => w.includes('PLACEHOLDER'))).toBe(true);
  });

  it('per segment: contents, width, depth and surface', () => {
    expect(t.segments.map((s) => s.carriesText)).toEqual(['power 2, telecom 2, water 1', 'power 1, telecom 1, water 1', 'power 1, telecom 1, water 1']);
    expect(t.segments.map((s) => s.surface)).toEqual(['mixed', 'soft', 'soft']);
    expect(t.segments[0].width).toBeCloseTo(W0, 3);
    expect(t.segments[2].width).toBeCloseTo(W1, 3);
    expect(t.segments.every((s) => Math.abs(s.depth - D) < 5e-4)).toBe(true);
    expect(t.segments[0].governing).toBe('water');
  });

  it('per utility: services, boxes and fittings', () => {
    const row = (k: string) => t.utilities.find((u) => u.utility === k);
    expect(t.utilities.map((u) => u.utility)).toEqual(U); // gas has no services: no row
    expect(row('power')?.services).toBe(2);
    expect(row('telecom')?.pullBoxes).toBe(1);
    expect(t.pullBoxes.map((b) => [b.nodeId, b.utilities.join()])).toEqual([[1, 'telecom']]);
  });

  it('prices in feet convert the per-metre placeholders exactly (1 ft = 0.3048 m)', () => {
    const s = defaultSettings();
    s.units = 'ft';
    const us = computeTakeOff(net, terms, s);
    const line = us.lines.find((l) => l.key === 'trench.pavement');
    expect(line?.quantity).toBeCloseTo(10 / 0.3048, 3);
    expect(line?.unitPrice).toBeCloseTo(60 * 0.3048, 4);
    const rest = us.lines.find((l) => l.key === 'pavement.restore');
    expect(rest?.unit).toBe('yd²');
    expect(rest?.quantity).toBeCloseTo((10 * cutW) / 0.83612736, 3); // 1 yd² = 0.83612736 m² (NIST)
  });

  it('the same network drawn in feet gives the same metric take-off (1 ft = 0.3048 m exactly, NIST)', () => {
    const k = 1 / 0.3048;
    const ftNet = handNetwork(
      net.nodes.map((n) => ({ ...n, x: n.x * k, y: n.y * k })),
      net.segments.map((s) => ({
        from: s.from, to: s.to, pts: [...s.points].map((v) => v * k), pave: s.lengthUnderPavement * k,
        crossings: s.crossings.map((c) => ({ ...c, x: c.x * k, y: c.y * k })),
      })),
      'ft',
    );
    const ftTerms = terms.map((x) => terminal(x.id, x.role, x.utilities, x.x * k, x.y * k));
    const s = defaultSettings();
    s.units = 'm';
    const m = computeTakeOff(ftNet, ftTerms, s);
    for (const [key, q] of Object.entries(expected)) expect(m.lines.find((l) => l.key === key)?.quantity, key).toBeCloseTo(q, 3);
    expect(m.pullBoxes.map((b) => b.nodeId)).toEqual([1]);
  });
});
