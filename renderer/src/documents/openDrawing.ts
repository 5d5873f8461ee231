// Opening a drawing: DXF text → Drawing through the core reader, with a user-facing message on failure.
// The renderer never parses DXF itself.

import type { Drawing } from '../../../core/dxf/drawing';
import { readDxf } from '../../../core/dxf/readDxf';
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

/** The demo site shipped with the app (an invented business park), loaded lazily as a separate chunk. */
export async function loadDemo(): Promise<{ dxf: string; roles: string; services: string }> {
  const [dxf, roles, services] = await Promise.all([
    import('../../../assets/demo/site.dxf?raw'),
    import('../../../assets/demo/roles.json?raw'),
    import('../../../assets/demo/services.csv?raw'),
  ]);
  return { dxf: dxf.default, roles: roles.default, services: services.default };
}
