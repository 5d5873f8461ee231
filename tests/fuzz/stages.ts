// One fuzz case through the import stages the app and `furrow inspect` run: readDxf → buildSite
// (with the drawing's own units and with metres forced) → inspectDrawing. Anything thrown is a
// defect and propagates; a value is checked for the invariants a caller relies on.

import { readDxf, type ReadDxfOptions } from '../../core/dxf/readDxf';
import type { Drawing, DxfReadErrorKind } from '../../core/dxf/drawing';
import { buildSite } from '../../core/site/buildSite';
import { inspectDrawing } from '../../core/site/inspect';
import type { Site } from '../../core/site/site';

export const READ_ERROR_KINDS: readonly DxfReadErrorKind[] = ['binary', 'empty', 'garbage', 'truncated', 'too-large', 'limit', 'no-model-space'];

export interface StageOutcome {
  /** 'read:<kind>' for a reader error, 'site:<kind>' for a site error, 'site' when a site was built. */
  label: string;
  ms: number;
}

function fail(msg: string): never {
  throw new Error(`invariant broken: ${msg}`);
}

function checkDrawing(d: Drawing): void {
  if (d.entities.length === 0) fail('a drawing with no entities was returned as ok');
  for (const e of d.entities) {
    if (typeof e.layer !== 'string') fail('entity without a layer name');
    if (e.kind === 'polyline') {
      if (e.points.length < 4 || e.points.length % 2 !== 0) fail(`polyline with ${e.points.length} coordinates`);
      for (let i = 0; i < e.points.length; i++) if (!Number.isFinite(e.points[i])) fail(`non-finite coordinate ${e.points[i]} on layer ${e.layer}`);
    } else {
      if (!Number.isFinite(e.x) || !Number.isFinite(e.y)) fail(`non-finite text position on layer ${e.layer}`);
      if (typeof e.text !== 'string') fail('text entity without a string');
    }
  }
  const x = d.header.extents;
  if (![x.minX, x.minY, x.maxX, x.maxY].every(Number.isFinite)) fail(`non-finite extents ${JSON.stringify(x)}`);
  for (const w of d.warnings) if (typeof w !== 'string' || w.length === 0) fail('empty warning');
}

function checkSite(s: Site): void {
  if (s.boundary.length < 6) fail('boundary with fewer than 3 points');
  for (let i = 0; i < s.boundary.length; i++) if (!Number.isFinite(s.boundary[i])) fail('non-finite boundary coordinate');
  if (!Number.isFinite(s.frame.originX) || !Number.isFinite(s.frame.originY) || !(s.frame.scale > 0)) fail(`bad frame ${JSON.stringify(s.frame)}`);
  for (const b of s.buildings) for (let i = 0; i < b.outer.length; i++) if (!Number.isFinite(b.outer[i])) fail('non-finite building coordinate');
}

/** Runs every stage on one input; throws on a crash or a broken invariant. */
export function runStages(text: string, opts: ReadDxfOptions = {}): StageOutcome {
  const t0 = performance.now();
  const r = readDxf(text, opts);
  if (!r.ok) {
    if (!READ_ERROR_KINDS.includes(r.error.kind)) fail(`unknown error kind ${r.error.kind}`);
    if (r.error.message.length < 10) fail(`uninformative message '${r.error.message}'`);
    return { label: `read:${r.error.kind}`, ms: performance.now() - t0 };
  }
  checkDrawing(r.value);
  let label = '';
  for (const units of [undefined, 'm'] as const) {
    const s = buildSite(r.value, units ? { units } : {});
    const report = inspectDrawing(r.value, s.ok ? s.value : s.error);
    if (report.layers.length !== r.value.layers.length) fail('inspect lost a layer');
    if (s.ok) checkSite(s.value);
    else if (s.error.message.length < 10) fail(`uninformative site message '${s.error.message}'`);
    label = s.ok ? 'site' : `site:${s.error.kind}`;
  }
  return { label, ms: performance.now() - t0 };
}
