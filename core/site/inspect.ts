// What `furrow inspect` reports about a drawing (the app shows the same object): units, extents,
// layers with their entity counts and roles (given or suggested, with the reason), buildings
// found and warnings. Pure: takes the stage outputs, reads no files.

import type { Drawing, Extents } from '../dxf/drawing';
import type { LayerRole, Site } from './site';
import type { LengthUnit } from '../units';
import type { SiteError } from './buildSite';
import { polygonArea } from './polygonSet';
import { suggestRoles } from './suggestRoles';

export interface InspectLayer { name: string; entities: number; role: LayerRole; reason: string }

export interface InspectReport {
  /** Routing unit (null when the site could not be built, e.g. a unitless drawing without --units). */
  units: LengthUnit | null;
  /** Drawing extents in drawing units. */
  extents: Extents;
  layers: InspectLayer[];
  /** Footprint count and total area net of courtyards, in units² (m² or ft²). */
  buildings: { count: number; area: number };
  warnings: string[];
  /** DXF version and $INSUNITS code of the file. */
  version: string;
  insUnits: number;
  /** Present when the site model could not be built. */
  error?: { kind: string; message: string };
}

const isSite = (s: Site | SiteError): s is Site => (s as Site).frame !== undefined;

export function inspectDrawing(drawing: Drawing, site: Site | SiteError, givenRoles?: Record<string, LayerRole>): InspectReport {
  const counts = new Map<string, number>();
  for (const e of drawing.entities) counts.set(e.layer, (counts.get(e.layer) ?? 0) + 1);
  const suggested = new Map(suggestRoles(drawing).map((s) => [s.layer, s]));
  // layer names are case-insensitive in DXF
  const givenUpper = new Map(Object.entries(givenRoles ?? {}).map(([k, v]) => [k.toUpperCase(), v]));
  const layers: InspectLayer[] = drawing.layers.map((l) => {
    let role: LayerRole;
    let reason: string;
    if (givenRoles) {
      const g = givenUpper.get(l.name.toUpperCase());
      role = g ?? 'ignore';
      reason = g !== undefined ? 'given in the roles file' : 'not named in the roles file';
    } else {
      const s = suggested.get(l.name);
      role = s?.role ?? 'ignore';
      reason = `suggested: ${s?.reason ?? 'no suggestion'}`;
    }
    return { name: l.name, entities: counts.get(l.name) ?? 0, role, reason };
  });
  layers.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  if (!isSite(site)) {
    return {
      units: null, extents: drawing.header.extents, layers, buildings: { count: 0, area: 0 },
      warnings: [...drawing.warnings], version: drawing.header.version, insUnits: drawing.header.insUnits,
      error: { kind: site.kind, message: site.message },
    };
  }
  let area = 0;
  for (const b of site.buildings) area += polygonArea(b);
  return {
    units: site.units, extents: drawing.header.extents, layers,
    buildings: { count: site.buildings.length, area },
    warnings: site.warnings, version: drawing.header.version, insUnits: drawing.header.insUnits,
  };
}

/** The report as plain text lines for a terminal. */
export function inspectText(r: InspectReport): string {
  const f = (v: number): string => (Math.abs(v) >= 1000 ? v.toFixed(2) : v.toFixed(3));
  const e = r.extents;
  const w = Math.max(5, ...r.layers.map((l) => l.name.length));
  const lines = [
    `version   ${r.version} ($INSUNITS ${r.insUnits})`,
    `units     ${r.units ?? 'unknown'}`,
    `extents   (${f(e.minX)}, ${f(e.minY)}) – (${f(e.maxX)}, ${f(e.maxY)}) drawing units`,
    '',
    `${'layer'.padEnd(w)}  entities  role      reason`,
    ...r.layers.map((l) => `${l.name.padEnd(w)}  ${String(l.entities).padStart(8)}  ${l.role.padEnd(8)}  ${l.reason}`),
    '',
    `buildings ${r.buildings.count}, footprint area ${r.buildings.area.toFixed(2)} ${r.units ? `${r.units}²` : ''} (net of courtyards)`,
  ];
  if (r.error) lines.push(`error     ${r.error.message}`);
  if (r.warnings.length) lines.push('', 'warnings:', ...r.warnings.map((x) => `  - ${x}`));
  return lines.join('\n');
}
