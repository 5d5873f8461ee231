// The site as core builds it from the drawing and the current roles/units, rebuilt only when
// those change. Role suggestions are computed once per drawing.

import type { Drawing } from '../../../core/dxf/drawing';
import { buildSite, type SiteError } from '../../../core/site/buildSite';
import { suggestRoles } from '../../../core/site/suggestRoles';
import type { LayerRole, RoleSuggestion, Site } from '../../../core/site/site';
import type { Result } from '../../../core/result';
import type { LengthUnit } from '../../../core/units';

export interface SiteModel {
  suggestions(): ReadonlyMap<string, RoleSuggestion>;
  /** The suggested role of every layer, for a drawing opened without roles. */
  suggestedRoles(): Record<string, LayerRole>;
  site(roles: Readonly<Record<string, LayerRole>>, units: LengthUnit | null): Result<Site, SiteError>;
}

export function createSiteModel(drawing: Drawing): SiteModel {
  const suggestions = new Map(suggestRoles(drawing).map((s) => [s.layer, s]));
  let lastKey = '';
  let last: Result<Site, SiteError> | null = null;
  return {
    suggestions: () => suggestions,
    suggestedRoles: () => Object.fromEntries([...suggestions].map(([k, v]) => [k, v.role])),
    site(roles, units) {
      const key = JSON.stringify([Object.entries(roles).sort(), units]);
      if (last && key === lastKey) return last;
      lastKey = key;
      last = buildSite(drawing, { roles: { ...roles }, units: units ?? undefined });
      return last;
    },
  };
}
