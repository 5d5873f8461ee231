// Take-off benchmark: a comb-shaped network (a trunk with a bend every 10 junctions, one 15 m
// branch per service) for growing service counts. One JSON line per case: take-off and schedule
// times, and as a peer measured in the same process the least any take-off must do — walking
// every service's path back to the connection once per utility and summing lengths. Times are CPU ms.
//   npx tsx tests/bench/takeoff.ts [--max 2000]
import { computeTakeOff } from '../../core/takeoff/takeoff';
import { writeTakeOffCsv } from '../../core/export/csv';
import { writeTakeOffXlsx } from '../../core/export/xlsx';
import { writeReportPdf } from '../../core/export/pdf';
import { defaultSettings } from '../../core/settings';
import type { TrenchNetwork } from '../../core/network/trenchNetwork';
import { handNetwork, terminal } from '../core/takeoff/handNetwork';
import type { HandSegment } from '../core/takeoff/handNetwork';

const args = process.argv.slice(2);
const max = args.includes('--max') ? Number(args[args.indexOf('--max') + 1]) : 2000;
const U = ['power', 'telecom', 'water', 'gas'];

function comb(n: number): { net: TrenchNetwork; terms: ReturnType<typeof terminal>[] } {
  const nodes: Parameters<typeof handNetwork>[0] = [{ id: 0, kind: 'connection', x: 0, y: 0, terminalId: 'P' }];
  const segs: HandSegment[] = [];
  const terms = [terminal('P', 'connection', U, 0, 0)];
  let prev = 0, x = 0, y = 0;
  for (let i = 0; i < n; i++) {
    const j = nodes.length;
    const bend = i % 10 === 9; // a 45° jog on the trunk every tenth junction
    const nx = x + 10, ny = bend ? y + 10 : y;
    nodes.push({ id: j, kind: 'junction', x: nx, y: ny });
    segs.push({ from: prev, to: j, pts: [x, y, nx, ny], pave: i % 4 === 0 ? 5 : 0, crossings: i % 7 === 0 ? [{ x: nx - 5, y: ny, layer: 'EXIST-WATER', kind: 'line' }] : [] });
    const s = nodes.length;
    nodes.push({ id: s, kind: 'service', x: nx, y: ny + 15, terminalId: `S${i}` });
    segs.push({ from: j, to: s, pts: [nx, ny, nx, ny + 15] });
    terms.push(terminal(`S${i}`, 'service', i % 3 === 0 ? U : ['power', 'telecom'], nx, ny + 15));
    prev = j; x = nx; y = ny;
  }
  return { net: handNetwork(nodes, segs), terms };
}

// CPU time of this process (user + system), steadier than wall time on a shared machine.
const time = async (f: () => unknown): Promise<number> => { const c = process.cpuUsage(); await f(); const d = process.cpuUsage(c); return (d.user + d.system) / 1000; };

for (const n of [50, 200, max].filter((v, i, a) => a.indexOf(v) === i)) {
  const { net, terms } = comb(n);
  const settings = defaultSettings();
  let t!: ReturnType<typeof computeTakeOff>;
  const takeoffMs = await time(() => { t = computeTakeOff(net, terms, settings); });
  const csvMs = await time(() => writeTakeOffCsv(t));
  const meta = { project: 'bench', site: 'comb', date: '2026-01-15' };
  const xlsxMs = await time(() => writeTakeOffXlsx(t, meta));
  const pdfMs = await time(() => writeReportPdf(t, net, meta));
  // Peer: parent pointers once, then every service's path walked per utility.
  const peerMs = await time(() => {
    const parent = new Map<number, [number, number]>();
    for (const s of net.segments) parent.set(s.to, [s.from, s.length]);
    let total = 0;
    for (const term of terms) {
      if (term.role !== 'service') continue;
      const start = net.nodes.find((x) => x.terminalId === term.id)?.id as number;
      for (let k = 0; k < term.utilities.length; k++) {
        let v = start;
        for (let p = parent.get(v); p; p = parent.get(v)) { total += p[1]; v = p[0]; }
      }
    }
    return total;
  });
  process.stdout.write(JSON.stringify({
    bench: 'takeoff', services: n, segments: net.segments.length, lines: t.lines.length, pullBoxes: t.totals.pullBoxes,
    takeoffMs: +takeoffMs.toFixed(1), csvMs: +csvMs.toFixed(1), xlsxMs: +xlsxMs.toFixed(1), pdfMs: +pdfMs.toFixed(1),
    peerPathWalkMs: +peerMs.toFixed(1), takeoffVsPeer: +(takeoffMs / Math.max(peerMs, 0.01)).toFixed(2),
  }) + '\n');
}
