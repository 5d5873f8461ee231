// The project file: the drawing (embedded, so a project opens anywhere) plus every edit the user
// made, with a schema version. Loading validates everything and explains what is wrong.

import { DEFAULT_ROUTE, type GeometryStyle, type RouteSettings } from '../../../core/settings';
import { LAYER_ROLES, type LayerRole, type PointInput } from '../../../core/site/site';
import { err, ok, type Result } from '../../../core/result';
import type { LengthUnit } from '../../../core/units';
import type { ProjectState } from './edits';

export const PROJECT_FORMAT = 'furrow-project';
export const PROJECT_SCHEMA_VERSION = 1;

export interface ProjectFile {
  format: typeof PROJECT_FORMAT;
  schemaVersion: number;
  savedBy: string;
  drawing: { name: string; text: string };
  units: LengthUnit | null;
  state: {
    roles: Record<string, LayerRole>;
    points: PointInput[];
    route: RouteSettings;
    utilitiesOn: string[];
  };
}

export function serializeProject(drawingName: string, drawingText: string, s: ProjectState): string {
  const file: ProjectFile = {
    format: PROJECT_FORMAT,
    schemaVersion: PROJECT_SCHEMA_VERSION,
    savedBy: 'Furrow 0.1.0',
    drawing: { name: drawingName, text: drawingText },
    units: s.units,
    state: {
      roles: { ...s.roles },
      points: s.points.map((p) => ({ id: p.id, x: p.x, y: p.y, role: p.role, utilities: [...p.utilities] })),
      route: { ...s.route },
      utilitiesOn: [...s.utilitiesOn],
    },
  };
  return JSON.stringify(file, null, 1);
}

export type ProjectLoadError = { kind: 'not-json' | 'not-a-project' | 'newer' | 'invalid'; message: string };

const STYLES: readonly GeometryStyle[] = ['orthogonal', 'octilinear', 'any-angle'];

export function parseProject(text: string, knownUtilities: readonly string[]): Result<ProjectFile, ProjectLoadError> {
  let data: unknown;
  try { data = JSON.parse(text); } catch (e) {
    return err({ kind: 'not-json', message: `This is not a Furrow project (not JSON: ${(e as Error).message}).` });
  }
  const o = data as Record<string, unknown>;
  if (typeof o !== 'object' || o === null || o.format !== PROJECT_FORMAT) {
    return err({ kind: 'not-a-project', message: 'This file is not a Furrow project (its "format" is not furrow-project).' });
  }
  if (typeof o.schemaVersion !== 'number' || !Number.isInteger(o.schemaVersion) || o.schemaVersion < 1) {
    return err({ kind: 'invalid', message: 'The project has no valid schemaVersion.' });
  }
  if (o.schemaVersion > PROJECT_SCHEMA_VERSION) {
    return err({ kind: 'newer', message: `This project was saved by a newer Furrow (schema ${o.schemaVersion}); this version reads schema ${PROJECT_SCHEMA_VERSION}. Update Furrow to open it.` });
  }
  const bad = (where: string, what: string): Result<never, ProjectLoadError> => err({ kind: 'invalid', message: `The project is damaged: ${where} ${what}.` });
  const d = o.drawing as Record<string, unknown> | undefined;
  if (!d || typeof d.name !== 'string' || typeof d.text !== 'string' || d.text.length === 0) return bad('drawing', 'must have a name and the DXF text');
  if (o.units !== null && o.units !== 'm' && o.units !== 'ft') return bad('units', 'must be "m", "ft" or null');
  const s = o.state as Record<string, unknown> | undefined;
  if (!s || typeof s !== 'object') return bad('state', 'is missing');
  const roles = s.roles as Record<string, unknown>;
  if (!roles || typeof roles !== 'object' || Array.isArray(roles)) return bad('state.roles', 'must be an object');
  for (const [layer, role] of Object.entries(roles)) {
    if (!(LAYER_ROLES as readonly unknown[]).includes(role)) return bad(`layer ${JSON.stringify(layer)}`, `has an unknown role ${JSON.stringify(role)}`);
  }
  if (!Array.isArray(s.points)) return bad('state.points', 'must be a list');
  const ids = new Set<string>();
  for (const [i, p] of (s.points as Record<string, unknown>[]).entries()) {
    const at = `point ${i + 1}`;
    if (!p || typeof p.id !== 'string' || !p.id) return bad(at, 'has no id');
    if (ids.has(p.id)) return bad(at, `repeats the id ${p.id}`);
    ids.add(p.id);
    if (!Number.isFinite(p.x) || !Number.isFinite(p.y)) return bad(at, 'has no numeric x, y');
    if (p.role !== 'service' && p.role !== 'connection') return bad(at, 'has a role other than service/connection');
    if (!Array.isArray(p.utilities) || p.utilities.some((u) => typeof u !== 'string' || !knownUtilities.includes(u))) {
      return bad(at, `lists utilities other than ${knownUtilities.join(', ')}`);
    }
  }
  const r = s.route as Record<string, unknown>;
  if (!r || typeof r !== 'object') return bad('state.route', 'is missing');
  for (const [k, v] of Object.entries(DEFAULT_ROUTE)) {
    if (k === 'style') { if (!STYLES.includes(r.style as GeometryStyle)) return bad('route style', `must be one of ${STYLES.join(', ')}`); continue; }
    if (typeof v === 'number' && (typeof r[k] !== 'number' || !Number.isFinite(r[k] as number) || (r[k] as number) < 0)) {
      return bad(`route ${k}`, 'must be a number ≥ 0');
    }
  }
  if (!Array.isArray(s.utilitiesOn) || s.utilitiesOn.some((u) => !knownUtilities.includes(u as string))) return bad('state.utilitiesOn', 'lists unknown utilities');
  return ok(o as unknown as ProjectFile);
}
