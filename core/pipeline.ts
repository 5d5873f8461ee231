// The whole job as one pure function, shared by the CLI and the app's worker: bytes and text in,
// bytes, text and a summary out. Stages report progress, check for cancellation between (and,
// in the router, during) their steps, and are timed.

import { readDxfBytes } from './dxf/readDxf';
import type { Drawing } from './dxf/drawing';
import { writeLayerOnlyDxf, writeMergedDxf, type TrenchDrawingInput } from './dxf/writeDxf';
import { layerNames } from './dxf/trenchEntities';
import { writeTakeOffCsv } from './export/csv';
import { writeTakeOffXlsx } from './export/xlsx';
import { writeReportPdf } from './export/pdf';
import type { TrenchNetwork } from './network/trenchNetwork';
import { NOTICE_LINES, NOTICE_TITLE } from './notice';
import { Cancelled, err, ok, type Progress, type Result } from './result';
import { routeSite } from './route/site/routeSite';
import { checkRouteSize } from './limits';
import type { DxfLayerNames, Settings } from './settings';
import { defaultSettings } from './settings';
import { parseSettingsFile } from './settingsFile';
import { buildSite } from './site/buildSite';
import { placeTerminals } from './site/placeTerminals';
import { parsePointsCsv } from './site/pointsCsv';
import { parseRolesFile } from './site/rolesFile';
import type { LayerRole, Site, Terminal } from './site/site';
import { computeTakeOff, type TakeOff } from './takeoff/takeoff';
import { convertLength, fromMetres, type LengthUnit } from './units';

export const STAGES = ['read', 'site', 'place', 'route', 'takeoff', 'write'] as const;
export type Stage = (typeof STAGES)[number];

export interface NamedText { name: string; text: string }

export interface PipelineInput {
  drawing: { name: string; bytes: Uint8Array };
  services: NamedText;
  roles?: NamedText;
  settings?: NamedText;
  /** Routing unit; needed when the drawing does not state its units. */
  units?: LengthUnit;
  /** For the schedules' title block; the date is passed in (never read from the clock) for repeatable output. */
  meta: { project: string; site: string; date: string };
}

export interface PipelineOptions {
  onProgress?: Progress;
  signal?: { readonly aborted: boolean };
  /** Milliseconds clock for stage timings (default performance.now). */
  now?: () => number;
}

/** Bad input: which stage and file, and a message that says what to do. */
export interface PipelineError {
  kind: 'input';
  stage: Stage;
  file: string;
  message: string;
}

/** Output file names, relative to the output folder. */
export const OUTPUT_FILES = {
  routedDxf: 'routed.dxf',
  trenchDxf: 'trench-layers.dxf',
  takeoffXlsx: 'takeoff.xlsx',
  takeoffCsv: 'takeoff.csv',
  reportPdf: 'report.pdf',
} as const;
export type OutputKey = keyof typeof OUTPUT_FILES;

export interface Summary {
  units: LengthUnit;
  drawing: string;
  /** 'done', or 'partial' when some points could not be reached. */
  status: 'done' | 'partial';
  services: { total: number; connected: number; unreachable: { id: string; reason: string }[] };
  connections: number;
  trench: { length: number; lengthUnderPavement: number; crossings: number; bends: number; segments: number };
  cost: { route: number; lowerBound: number; gap: number; takeoffTotal: number; currency: string };
  pullBoxes: number;
  runtimeMs: Record<Stage | 'total', number>;
  /** The router's own steps (grid, attach, solve, bound, shape), when it reports them. */
  routeStepsMs?: Record<string, number>;
  files: Record<OutputKey, string>;
  layers: DxfLayerNames;
  /** Layer roles used; `rolesSuggested` when they were guessed from layer names and geometry. */
  roles: Record<string, LayerRole>;
  rolesSuggested: boolean;
  warnings: string[];
  notice: string[];
}

export interface PipelineOutput {
  summary: Summary;
  files: { routedDxf: Uint8Array; trenchDxf: Uint8Array; takeoffXlsx: Uint8Array; takeoffCsv: string; reportPdf: Uint8Array };
  drawing: Drawing;
  site: Site;
  terminals: Terminal[];
  net: TrenchNetwork;
  takeOff: TakeOff;
  settings: Settings;
}

/** Share of the route stage taken by each of the router's steps (for the progress bar). */
const ROUTE_STEPS: Record<string, [number, number]> = { grid: [0, 0.05], attach: [0.05, 0.1], route: [0.1, 0.9], bound: [0.9, 0.95], shape: [0.95, 1] };

const round = (v: number, d = 3): number => Math.round(v * 10 ** d) / 10 ** d;

/**
 * Run every stage. Bad input returns an error value naming the file; cancellation throws
 * `Cancelled` (from core/result.ts) once `signal.aborted` is seen.
 */
export async function runPipeline(input: PipelineInput, opts: PipelineOptions = {}): Promise<Result<PipelineOutput, PipelineError>> {
  const now = opts.now ?? (() => globalThis.performance.now());
  const progress: Progress = opts.onProgress ?? (() => undefined);
  const check = (): void => { if (opts.signal?.aborted) throw new Cancelled(); };
  const runtimeMs = { read: 0, site: 0, place: 0, route: 0, takeoff: 0, write: 0, total: 0 };
  const t0 = now();
  let tStage = t0;
  const begin = (s: Stage): void => { check(); progress(s, 0); tStage = now(); };
  const end = (s: Stage): void => { runtimeMs[s] = round(now() - tStage, 1); progress(s, 1); };
  const fail = (stage: Stage, file: string, message: string): Result<PipelineOutput, PipelineError> => err({ kind: 'input', stage, file, message });

  // read: settings first (they name the utilities the services file may use), then the drawing
  begin('read');
  let settings = defaultSettings();
  if (input.settings) {
    const s = parseSettingsFile(input.settings.text, input.settings.name);
    if (!s.ok) return fail('read', input.settings.name, s.error.message);
    settings = s.value;
  }
  const d = readDxfBytes(input.drawing.bytes);
  if (!d.ok) return fail('read', input.drawing.name, `${input.drawing.name}: ${d.error.message}`);
  const drawing = d.value;
  const warnings: string[] = [...drawing.warnings];
  let roles: Record<string, LayerRole> | undefined;
  if (input.roles) {
    const r = parseRolesFile(input.roles.text, input.roles.name, drawing.layers.map((l) => l.name));
    if (!r.ok) return fail('read', input.roles.name, r.error.message);
    roles = r.value.roles;
    warnings.push(...r.value.warnings);
  }
  const pts = parsePointsCsv(input.services.text, settings.utilities.map((u) => u.key), input.services.name);
  if (!pts.ok) return fail('read', input.services.name, pts.error.message);
  end('read');

  begin('site');
  const siteR = buildSite(drawing, { roles, units: input.units ?? settings.units });
  if (!siteR.ok) return fail('site', input.roles?.name ?? input.drawing.name, `${input.drawing.name}: ${siteR.error.message}`);
  const site = siteR.value;
  warnings.push(...site.warnings);
  if (site.buildings.length === 0) {
    return fail('site', input.roles?.name ?? input.drawing.name, `${input.drawing.name}: no building footprints found; give the building layer the role 'building' in a roles file (--roles)`);
  }
  end('site');

  begin('place');
  const placed = placeTerminals(site, pts.value, { snapTolerance: fromMetres(settings.route.snapToleranceM, site.units) });
  for (const p of placed.problems) warnings.push(`${input.services.name}: ${p.message}`);
  const terminals = placed.terminals;
  const outside = terminals.filter((t) => !insideBox(site.boundary, t.x, t.y));
  const inside = (role: string): boolean => terminals.some((t) => t.role === role && !outside.includes(t));
  if (!inside('connection') || !inside('service')) {
    const ex = drawing.header.extents;
    return fail('place', input.services.name, `${input.services.name}: no ${inside('connection') ? 'service point' : 'point of connection'} lies on the site (drawing extents x ${ex.minX.toFixed(1)}…${ex.maxX.toFixed(1)}, y ${ex.minY.toFixed(1)}…${ex.maxY.toFixed(1)}); give the coordinates in the drawing's units and frame`);
  }
  for (const t of outside) warnings.push(`${input.services.name}: point ${t.id} lies outside the site; it cannot be connected`);
  end('place');

  begin('route');
  let routeDone = 0;
  const tooBig = checkRouteSize(site, settings.route);
  if (tooBig) return fail('route', input.settings?.name ?? input.drawing.name, `${input.drawing.name}: ${tooBig.message}`);
  const net = routeSite(site, terminals, settings.route, {
    onProgress: (sub, f) => {
      // the router's own steps, mapped onto one rising fraction of the route stage
      const span = ROUTE_STEPS[sub];
      if (span) routeDone = Math.max(routeDone, span[0] + (span[1] - span[0]) * Math.min(1, Math.max(0, f)));
      progress('route', Math.min(0.999, Math.max(0.001, routeDone)));
      check();
    },
    signal: opts.signal,
  });
  check();
  warnings.push(...net.warnings);
  end('route');

  begin('takeoff');
  const takeOff = computeTakeOff(net, terminals, settings);
  for (const w of takeOff.warnings) if (!warnings.includes(w)) warnings.push(w);
  end('takeoff');

  begin('write');
  const names = layerNames(settings.dxfLayers);
  const drawInput: TrenchDrawingInput = {
    net, terminals, utilities: settings.utilities, layers: names, extents: drawing.header.extents,
    segments: takeOff.segments.map((r) => ({
      segmentId: r.segmentId,
      width: convertLength(r.width, takeOff.units, net.units),
      carries: Object.fromEntries(r.carries.map((c) => [c.utility, c.conduits])),
    })),
    pullBoxes: takeOff.pullBoxes.map((b) => ({ x: b.x, y: b.y, utilities: b.utilities })),
  };
  const merged = writeMergedDxf(input.drawing.bytes, drawInput);
  let routedDxf: Uint8Array;
  const trenchDxf = writeLayerOnlyDxf(drawInput, { insUnits: drawing.header.insUnits });
  if (merged.ok) {
    routedDxf = merged.value.bytes;
    warnings.push(...merged.value.warnings);
  } else {
    // The original cannot take the layers (e.g. no LAYER table in an R2000 file): say so, give the layer-only file.
    warnings.push(`${input.drawing.name}: ${merged.error.message}; ${OUTPUT_FILES.routedDxf} holds the layer-only drawing`);
    routedDxf = trenchDxf;
  }
  progress('write', 0.3);
  const meta = { ...input.meta };
  const takeoffCsv = writeTakeOffCsv(takeOff);
  const takeoffXlsx = await writeTakeOffXlsx(takeOff, meta);
  check();
  progress('write', 0.6);
  const reportPdf = await writeReportPdf(takeOff, net, meta, { site });
  end('write');
  runtimeMs.total = round(now() - t0, 1);

  const services = terminals.filter((t) => t.role === 'service');
  const unreachable = net.unreachable.filter((u) => services.some((s) => s.id === u.id));
  const summary: Summary = {
    units: net.units,
    drawing: input.drawing.name,
    status: net.unreachable.length ? 'partial' : 'done',
    services: { total: pts.value.filter((p) => p.role === 'service').length, connected: services.length - unreachable.length, unreachable: net.unreachable },
    connections: terminals.filter((t) => t.role === 'connection').length,
    trench: {
      length: round(net.segments.reduce((a, s) => a + s.length, 0)),
      lengthUnderPavement: round(net.segments.reduce((a, s) => a + s.lengthUnderPavement, 0)),
      crossings: net.segments.reduce((a, s) => a + s.crossings.length, 0),
      bends: countBends(net),
      segments: net.segments.length,
    },
    cost: { route: round(net.quality.cost), lowerBound: round(net.quality.lowerBound), gap: round(net.quality.gap, 4), takeoffTotal: round(takeOff.totals.cost, 2), currency: takeOff.currency },
    pullBoxes: takeOff.pullBoxes.reduce((a, b) => a + b.utilities.length, 0),
    runtimeMs,
    ...(net.timingsMs ? { routeStepsMs: Object.fromEntries(Object.entries(net.timingsMs).map(([k, v]) => [k, round(v, 1)])) } : {}),
    files: { ...OUTPUT_FILES },
    layers: names,
    roles: site.roles,
    rolesSuggested: !input.roles,
    warnings,
    notice: [NOTICE_TITLE, ...NOTICE_LINES],
  };
  return ok({ summary, files: { routedDxf, trenchDxf, takeoffXlsx, takeoffCsv, reportPdf }, drawing, site, terminals, net, takeOff, settings });
}

/** Changes of direction over 0.5°: inside segments, and at nodes where exactly two segments meet. */
export function countBends(net: TrenchNetwork): number {
  const MIN_DEG = 0.5;
  let n = 0;
  for (const s of net.segments) for (const b of s.bendsDeg) if (b > MIN_DEG) n++;
  const ends = new Map<number, { dx: number; dy: number }[]>();
  for (const s of net.segments) {
    const p = s.points;
    const k = p.length;
    if (k < 4) continue;
    // direction leaving each end node, pointing into the segment
    const add = (node: number, dx: number, dy: number): void => {
      const l = Math.hypot(dx, dy);
      if (l > 0) (ends.get(node) ?? ends.set(node, []).get(node)!).push({ dx: dx / l, dy: dy / l });
    };
    add(s.from, p[2] - p[0], p[3] - p[1]);
    add(s.to, p[k - 4] - p[k - 2], p[k - 3] - p[k - 1]);
  }
  for (const dirs of ends.values()) {
    if (dirs.length !== 2) continue;
    // straight through when the two leaving directions are opposite
    const dot = -(dirs[0].dx * dirs[1].dx + dirs[0].dy * dirs[1].dy);
    const deg = (Math.acos(Math.max(-1, Math.min(1, dot))) * 180) / Math.PI;
    if (deg > MIN_DEG) n++;
  }
  return n;
}

/** Inside the bounding box of a ring (flat x,y pairs). */
function insideBox(ring: Float64Array, x: number, y: number): boolean {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (let i = 0; i < ring.length; i += 2) {
    minX = Math.min(minX, ring[i]); maxX = Math.max(maxX, ring[i]);
    minY = Math.min(minY, ring[i + 1]); maxY = Math.max(maxY, ring[i + 1]);
  }
  return x >= minX && x <= maxX && y >= minY && y <= maxY;
}
