// Furrow's own palette ("loam"): a dark soil ground so the APWA marking colours read clearly.
// Utility colours are NOT here: they come from the utility settings (APWA uniform colour code).

import type { LayerRole } from '../../core/site/site';

export const CANVAS_BACKGROUND = 0x1a1d17;

/** Line colour per layer role (tinted onto white strokes, so a role change is instant). */
export const ROLE_COLOR: Record<LayerRole, number> = {
  building: 0xe3d5b8, // sandstone
  'keep-out': 0xc8664f, // rust
  pavement: 0x8b95a1, // asphalt
  crossing: 0x9dbb8e, // sage
  boundary: 0xb9a06a, // brass
  ignore: 0x4b5045, // moss shadow
};

export const ROLE_LABEL: Record<LayerRole, string> = {
  building: 'Building (obstacle)',
  'keep-out': 'Keep-out area',
  pavement: 'Pavement area',
  crossing: 'Line to cross',
  boundary: 'Site boundary',
  ignore: 'Not used',
};

export const POINT_SERVICE = 0xf2efe6;
export const POINT_CONNECTION = 0xd9a520;
export const POINT_SELECTED = 0x5fd0c4;
export const SNAP_CUE = 0x5fd0c4;
export const PULL_BOX = 0xf2efe6;
export const BEND_MARK = 0xd2b48c;
export const CROSSING_MARK = 0xff5fa2;
/** Proposed excavation is white in the APWA code: the trench outline. */
export const TRENCH_OUTLINE = 0xffffff;

export function hexToNumber(hex: string): number {
  const m = /^#?([0-9a-f]{6})$/i.exec(hex.trim());
  return m ? parseInt(m[1], 16) : 0xffffff;
}
