// The roles file (DESIGN.md "Contracts"): JSON `{ "<layer name>": "<role>" }`.

import { err, ok, type Result } from '../result';
import { LAYER_ROLES, type LayerRole } from './site';

export interface RolesFileError { kind: 'roles'; message: string }

export interface RolesFile {
  roles: Record<string, LayerRole>;
  /** Layers named in the file but absent from the drawing (a typo, or a file made for another drawing). */
  warnings: string[];
}

/** Parse and check a roles file; `layers` (when given) are the drawing's layers, for warnings. */
export function parseRolesFile(text: string, source = 'roles.json', layers?: readonly string[]): Result<RolesFile, RolesFileError> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (x) {
    return err({ kind: 'roles', message: `${source}: not valid JSON (${x instanceof Error ? x.message : String(x)}); write { "<layer>": "<role>", ... }` });
  }
  if (typeof data !== 'object' || data === null || Array.isArray(data)) return err({ kind: 'roles', message: `${source}: expected an object { "<layer>": "<role>", ... }` });
  const problems: string[] = [];
  const warnings: string[] = [];
  const known = layers ? new Set(layers.map((l) => l.toUpperCase())) : null;
  for (const [layer, role] of Object.entries(data)) {
    if (!LAYER_ROLES.includes(role as LayerRole)) problems.push(`${source}: layer '${layer}' has role ${JSON.stringify(role)}; roles are ${LAYER_ROLES.join(', ')}`);
    else if (known && !known.has(layer.toUpperCase())) warnings.push(`${source}: layer '${layer}' is not in the drawing; check the spelling (the drawing's layers: ${layers!.slice(0, 20).join(', ')}${layers!.length > 20 ? ', ...' : ''})`);
  }
  if (problems.length) return err({ kind: 'roles', message: problems.join('\n') });
  return ok({ roles: data as Record<string, LayerRole>, warnings });
}
