// Opening a drawing: DXF text → Drawing through the core reader, with a user-facing message on failure.
// The renderer never parses DXF itself.

import type { Drawing } from '../../../core/dxf/drawing';
import { readDxf } from '../../../core/dxf/readDxf';
import type { LayerRole } from '../../../core/site/site';
import { LAYER_ROLES } from '../../../core/site/site';
import { err, ok, type Result } from '../../../core/result';

export interface OpenedDrawing {
  name: string;
  text: string;
  drawing: Drawing;
}

export function openDrawingText(name: string, text: string): Result<OpenedDrawing, string> {
  const r = readDxf(text);
  if (!r.ok) return err(`Could not read ${name}: ${r.error.message} (${r.error.kind}).`);
  return ok({ name, text, drawing: r.value });
}

/** Parse a roles.json object ({ layer: role }), keeping only known roles. */
export function parseRolesJson(text: string): Result<Record<string, LayerRole>, string> {
  let data: unknown;
  try { data = JSON.parse(text); } catch (e) { return err(`roles file is not JSON: ${(e as Error).message}`); }
  if (typeof data !== 'object' || data === null || Array.isArray(data)) return err('roles file must be an object { "layer": "role" }');
  const out: Record<string, LayerRole> = {};
  for (const [layer, role] of Object.entries(data as Record<string, unknown>)) {
    if (typeof role !== 'string' || !(LAYER_ROLES as readonly string[]).includes(role)) {
      return err(`layer ${JSON.stringify(layer)}: unknown role ${JSON.stringify(role)} (use ${LAYER_ROLES.join(', ')})`);
    }
    out[layer] = role as LayerRole;
  }
  return ok(out);
}

/** The demo site shipped with the app (an invented business park), loaded lazily as a separate chunk. */
export async function loadDemo(): Promise<{ dxf: string; roles: string; services: string }> {
  const [dxf, roles, services] = await Promise.all([
    import('../../../assets/demo/site.dxf?raw'),
    import('../../../assets/demo/roles.json?raw'),
    import('../../../assets/demo/services.csv?raw'),
  ]);
  return { dxf: dxf.default, roles: roles.default, services: services.default };
}
