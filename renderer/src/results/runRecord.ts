// A finished run as the interface keeps it: the pipeline output, the figures compared between
// runs, and the network prepared for drawing (in drawing units).

import type { PipelineOutput } from '../../../core/pipeline';
import type { RouteSettings } from '../../../core/settings';
import { localToDrawing, type NetworkView } from '../canvas/networkOverlay';

export interface RunFigures {
  length: number;
  lengthUnderPavement: number;
  bends: number;
  crossings: number;
  pullBoxes: number;
  routeCost: number;
  lowerBound: number;
  gap: number;
  takeoffTotal: number;
  servicesConnected: number;
  servicesTotal: number;
  runtimeMs: number;
}

export interface RunRecord {
  readonly id: number;
  readonly label: string;
  readonly route: Readonly<RouteSettings>;
  readonly output: PipelineOutput;
  readonly figures: RunFigures;
  readonly view: NetworkView;
}

export function figuresOf(o: PipelineOutput): RunFigures {
  const s = o.summary;
  return {
    length: s.trench.length,
    lengthUnderPavement: s.trench.lengthUnderPavement,
    bends: s.trench.bends,
    crossings: s.trench.crossings,
    pullBoxes: s.pullBoxes,
    routeCost: s.cost.route,
    lowerBound: s.cost.lowerBound,
    gap: s.cost.gap,
    takeoffTotal: s.cost.takeoffTotal,
    servicesConnected: s.services.connected,
    servicesTotal: s.services.total,
    runtimeMs: s.runtimeMs.total,
  };
}

export function networkViewOf(o: PipelineOutput): NetworkView {
  const frame = o.net.frame;
  const contents = new Map(o.takeOff.contents.map((c) => [c.segmentId, c.loads.map((l) => l.utility)]));
  const toD = (x: number, y: number): { x: number; y: number } => {
    const p = localToDrawing(frame, [x, y]);
    return { x: p[0], y: p[1] };
  };
  const bends: NetworkView['bends'] = [];
  for (const seg of o.net.segments) {
    seg.bendsDeg.forEach((deg, i) => {
      if (deg > 0.5) bends.push({ ...toD(seg.points[2 * (i + 1)], seg.points[2 * (i + 1) + 1]), deg });
    });
  }
  for (const n of o.net.nodes) if (n.kind === 'bend') bends.push({ ...toD(n.x, n.y), deg: 0 });
  return {
    segments: o.net.segments.map((s) => ({
      id: s.id,
      points: localToDrawing(frame, s.points),
      utilities: contents.get(s.id) ?? [],
      stub: s.stub,
    })),
    pullBoxes: o.takeOff.pullBoxes.map((b) => ({ ...toD(b.x, b.y), label: `Pull box (${b.utilities.join(', ')}): ${b.reason}` })),
    bends,
    crossings: o.net.segments.flatMap((s) => s.crossings.map((c) => ({ ...toD(c.x, c.y), layer: c.layer }))),
    colors: Object.fromEntries(o.settings.utilities.map((u) => [u.key, u.color])),
  };
}
