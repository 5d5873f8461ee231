// Project edits as immutable records and change diffs: every edit becomes a Diff that can be
// applied and inverted, which is all undo/redo needs. No edit mutates a state it is given.

import type { LayerRole, PointInput } from '../../../core/site/site';
import type { RouteSettings } from '../../../core/settings';
import type { LengthUnit } from '../../../core/units';

export interface ProjectState {
  readonly roles: Readonly<Record<string, LayerRole>>;
  readonly points: readonly PointInput[];
  readonly route: Readonly<RouteSettings>;
  /** Utility keys switched on for routing (a subset of the settings' utilities). */
  readonly utilitiesOn: readonly string[];
  /** Routing unit chosen by the user (null: from the drawing's $INSUNITS). */
  readonly units: LengthUnit | null;
}

export type Edit =
  | { kind: 'set-role'; layer: string; role: LayerRole }
  | { kind: 'add-point'; point: PointInput }
  | { kind: 'update-point'; id: string; patch: Partial<Omit<PointInput, 'id'>> }
  | { kind: 'remove-point'; id: string }
  | { kind: 'replace-points'; points: PointInput[] }
  | { kind: 'set-route'; key: keyof RouteSettings; value: RouteSettings[keyof RouteSettings] }
  | { kind: 'set-utilities-on'; keys: string[] }
  | { kind: 'set-units'; units: LengthUnit | null };

export interface Diff {
  readonly label: string;
  readonly roles: readonly { layer: string; before: LayerRole | undefined; after: LayerRole | undefined }[];
  readonly points: {
    readonly added: readonly PointInput[];
    readonly removed: readonly PointInput[];
    readonly updated: readonly { before: PointInput; after: PointInput }[];
    /** Point ids in list order before and after, when the edit adds or removes points. */
    readonly order?: { before: readonly string[]; after: readonly string[] };
  };
  readonly route: readonly { key: keyof RouteSettings; before: unknown; after: unknown }[];
  readonly utilitiesOn: { before: readonly string[]; after: readonly string[] } | null;
  readonly units: { before: LengthUnit | null; after: LengthUnit | null } | null;
}

const emptyDiff = (label: string): Diff => ({
  label, roles: [], points: { added: [], removed: [], updated: [] }, route: [], utilitiesOn: null, units: null,
});

export function isEmptyDiff(d: Diff): boolean {
  return d.roles.length === 0 && d.points.added.length === 0 && d.points.removed.length === 0 &&
    d.points.updated.length === 0 && d.route.length === 0 && d.utilitiesOn === null && d.units === null;
}

/** The diff an edit would make to `state` (empty when it changes nothing). */
export function diffFor(state: ProjectState, edit: Edit): Diff {
  switch (edit.kind) {
    case 'set-role': {
      const before = state.roles[edit.layer];
      if (before === edit.role) return emptyDiff('');
      return { ...emptyDiff(`Layer ${edit.layer}: ${edit.role}`), roles: [{ layer: edit.layer, before, after: edit.role }] };
    }
    case 'add-point': {
      if (state.points.some((p) => p.id === edit.point.id)) throw new Error(`point id ${edit.point.id} already used`);
      const ids = state.points.map((p) => p.id);
      return { ...emptyDiff(`Add ${edit.point.role} ${edit.point.id}`), points: { added: [freezePoint(edit.point)], removed: [], updated: [], order: { before: ids, after: [...ids, edit.point.id] } } };
    }
    case 'update-point': {
      const before = state.points.find((p) => p.id === edit.id);
      if (!before) throw new Error(`no point ${edit.id}`);
      const after = freezePoint({ ...before, ...edit.patch, id: before.id });
      if (samePoint(before, after)) return emptyDiff('');
      return { ...emptyDiff(`Edit ${before.id}`), points: { added: [], removed: [], updated: [{ before, after }] } };
    }
    case 'remove-point': {
      const before = state.points.find((p) => p.id === edit.id);
      if (!before) throw new Error(`no point ${edit.id}`);
      const ids = state.points.map((p) => p.id);
      return { ...emptyDiff(`Delete ${before.id}`), points: { added: [], removed: [before], updated: [], order: { before: ids, after: ids.filter((i) => i !== before.id) } } };
    }
    case 'replace-points':
      return {
        ...emptyDiff(`Import ${edit.points.length} points`),
        points: { added: edit.points.map(freezePoint), removed: [...state.points], updated: [], order: { before: state.points.map((p) => p.id), after: edit.points.map((p) => p.id) } },
      };
    case 'set-route': {
      const before = state.route[edit.key];
      if (before === edit.value) return emptyDiff('');
      return { ...emptyDiff(`Route ${String(edit.key)}`), route: [{ key: edit.key, before, after: edit.value }] };
    }
    case 'set-utilities-on': {
      const after = [...edit.keys];
      if (after.join('\n') === state.utilitiesOn.join('\n')) return emptyDiff('');
      return { ...emptyDiff('Utilities'), utilitiesOn: { before: state.utilitiesOn, after } };
    }
    case 'set-units':
      if (state.units === edit.units) return emptyDiff('');
      return { ...emptyDiff(`Units ${edit.units ?? 'from drawing'}`), units: { before: state.units, after: edit.units } };
  }
}

/** Apply a diff; points keep their order (removed ones drop out, added ones go to the end). */
export function applyDiff(state: ProjectState, d: Diff): ProjectState {
  let roles = state.roles;
  if (d.roles.length) {
    const next: Record<string, LayerRole> = { ...state.roles };
    for (const r of d.roles) {
      if (r.after === undefined) delete next[r.layer];
      else next[r.layer] = r.after;
    }
    roles = Object.freeze(next);
  }
  let points = state.points;
  if (d.points.added.length || d.points.removed.length || d.points.updated.length) {
    const removed = new Set(d.points.removed.map((p) => p.id));
    const updated = new Map(d.points.updated.map((u) => [u.after.id, u.after]));
    const next = [
      ...state.points.filter((p) => !removed.has(p.id)).map((p) => updated.get(p.id) ?? p),
      ...d.points.added,
    ];
    const order = d.points.order?.after;
    if (order) {
      const rank = new Map(order.map((id, i) => [id, i]));
      next.sort((a, b) => (rank.get(a.id) ?? 1e9) - (rank.get(b.id) ?? 1e9));
    }
    points = Object.freeze(next);
  }
  let route = state.route;
  if (d.route.length) {
    const next = { ...state.route } as Record<string, unknown>;
    for (const r of d.route) next[r.key] = r.after;
    route = Object.freeze(next) as unknown as RouteSettings;
  }
  const utilitiesOn = d.utilitiesOn ? Object.freeze([...d.utilitiesOn.after]) : state.utilitiesOn;
  const units = d.units ? d.units.after : state.units;
  return Object.freeze({ roles, points, route, utilitiesOn, units });
}

export function invertDiff(d: Diff): Diff {
  return {
    label: d.label,
    roles: d.roles.map((r) => ({ layer: r.layer, before: r.after, after: r.before })),
    points: {
      added: d.points.removed,
      removed: d.points.added,
      updated: d.points.updated.map((u) => ({ before: u.after, after: u.before })),
      order: d.points.order ? { before: d.points.order.after, after: d.points.order.before } : undefined,
    },
    route: d.route.map((r) => ({ key: r.key, before: r.after, after: r.before })),
    utilitiesOn: d.utilitiesOn ? { before: d.utilitiesOn.after, after: d.utilitiesOn.before } : null,
    units: d.units ? { before: d.units.after, after: d.units.before } : null,
  };
}

function freezePoint(p: PointInput): PointInput {
  return Object.freeze({ id: p.id, x: p.x, y: p.y, role: p.role, utilities: Object.freeze([...p.utilities]) as string[] });
}

function samePoint(a: PointInput, b: PointInput): boolean {
  return a.x === b.x && a.y === b.y && a.role === b.role && a.utilities.join(';') === b.utilities.join(';');
}
