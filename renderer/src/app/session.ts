// The open document: the drawing (read by core), its site model and the undoable project store.
// Opening a drawing or a project replaces the session; edits go through the store only.

import type { Drawing } from '../../../core/dxf/drawing';
import { DEFAULT_ROUTE, type UtilitySetting } from '../../../core/settings';
import type { LayerRole, PointInput } from '../../../core/site/site';
import type { LengthUnit } from '../../../core/units';
import { createSiteModel, type SiteModel } from '../documents/siteModel';
import type { ProjectState } from '../state/edits';

export interface Session {
  readonly name: string;
  readonly text: string;
  readonly drawing: Drawing;
  readonly model: SiteModel;
}

export function newSession(name: string, text: string, drawing: Drawing): Session {
  return { name, text, drawing, model: createSiteModel(drawing) };
}

/** The first project state for a freshly opened drawing: given roles win over suggestions. */
export function initialState(session: Session, utilities: readonly UtilitySetting[], given: {
  roles?: Record<string, LayerRole>; points?: PointInput[]; units?: LengthUnit | null;
} = {}): ProjectState {
  const roles: Record<string, LayerRole> = { ...session.model.suggestedRoles(), ...(given.roles ?? {}) };
  return Object.freeze({
    roles: Object.freeze(roles),
    points: Object.freeze([...(given.points ?? [])]),
    route: Object.freeze({ ...DEFAULT_ROUTE }),
    utilitiesOn: Object.freeze(utilities.map((u) => u.key)),
    units: given.units ?? null,
  });
}
