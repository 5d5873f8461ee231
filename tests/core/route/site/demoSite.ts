// Loads the demo site (assets/demo: Brackenrise Business Park, an invented place) through the
// project's own reader and site builder, and places its services — the end-to-end fixture.

import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { readDxf } from '../../../../core/dxf/readDxf';
import { buildSite } from '../../../../core/site/buildSite';
import { placeTerminals } from '../../../../core/site/placeTerminals';
import type { LayerRole, PointInput, Site, Terminal } from '../../../../core/site/site';

const demo = (f: string): string => fileURLToPath(new URL(`../../../../assets/demo/${f}`, import.meta.url));

export function loadDemo(): { site: Site; terminals: Terminal[]; problems: { id: string; message: string }[] } {
  const drawing = readDxf(readFileSync(demo('site.dxf'), 'utf8'));
  if (!drawing.ok) throw new Error(`demo DXF: ${JSON.stringify(drawing.error)}`);
  const roles = JSON.parse(readFileSync(demo('roles.json'), 'utf8')) as Record<string, LayerRole>;
  const site = buildSite(drawing.value, { roles });
  if (!site.ok) throw new Error(`demo site: ${site.error.message}`);
  const lines = readFileSync(demo('services.csv'), 'utf8').trim().split(/\r?\n/).slice(1);
  const points: PointInput[] = lines.map((l) => {
    const [id, x, y, role, utilities] = l.split(',');
    return { id, x: Number(x), y: Number(y), role: role as PointInput['role'], utilities: utilities.split(';') };
  });
  const placed = placeTerminals(site.value, points, { snapTolerance: 2 });
  return { site: site.value, terminals: placed.terminals, problems: placed.problems };
}
