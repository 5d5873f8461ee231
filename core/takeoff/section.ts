// Trench cross-section from what a segment carries: each utility's conduits form a duct block
// (rows of up to `ductsPerRow`), blocks sit side by side with a separation, the trench bottom is
// flat under the deepest block plus bedding. Cover per surface from the utility settings
// (NEC 2023 Table 300.5, 49 CFR 192.327 / 192.361, local frost depth; see settings.ts).

import type { TrenchSettings, UtilitySetting } from '../settings';
import { inchesToMetres } from '../units';

export type Surface = 'soft' | 'pavement';

export interface DuctBlock {
  utility: string;
  conduits: number;
  cols: number;
  rows: number;
  odM: number;
  widthM: number;
  heightM: number;
  coverM: number;
  /** Depth below grade of the block's bottom. */
  bottomM: number;
}

export interface TrenchSection {
  widthM: number;
  /** Depth to the trench bottom (deepest cover + duct block + bedding). */
  depthM: number;
  /** Cross-section area of all conduits/pipes (outside diameter). */
  ductAreaM2: number;
  beddingM: number;
  blocks: DuctBlock[];
  /** Utility whose cover and block set the depth. */
  governing: string;
}

export const DEFAULT_UTILITY_SEPARATION_IN = 12;
export const DEFAULT_DUCTS_PER_ROW = 4;

/** Section for the loads carried (utility → conduit count) under the given surface. */
export function trenchSection(
  loads: readonly { utility: string; conduits: number }[],
  utilities: readonly UtilitySetting[],
  trench: TrenchSettings,
  surface: Surface,
): TrenchSection {
  const perRow = Math.max(1, Math.floor(trench.ductsPerRow ?? DEFAULT_DUCTS_PER_ROW));
  const spacingM = inchesToMetres(trench.ductSpacingIn);
  const blocks: DuctBlock[] = [];
  for (const u of utilities) {
    const l = loads.find((x) => x.utility === u.key);
    if (!l || l.conduits <= 0) continue;
    const odM = inchesToMetres(u.diameterIn);
    const cols = Math.min(l.conduits, perRow);
    const rows = Math.ceil(l.conduits / perRow);
    const widthM = cols * odM + (cols - 1) * spacingM;
    const heightM = rows * odM + (rows - 1) * spacingM;
    const coverM = inchesToMetres(surface === 'pavement' ? u.coverIn.pavement : u.coverIn.soft);
    blocks.push({ utility: u.key, conduits: l.conduits, cols, rows, odM, widthM, heightM, coverM, bottomM: coverM + heightM });
  }
  const sepM = inchesToMetres(trench.utilitySeparationIn ?? DEFAULT_UTILITY_SEPARATION_IN);
  const ductsWidth = blocks.reduce((a, b) => a + b.widthM, 0) + Math.max(0, blocks.length - 1) * sepM;
  const widthM = Math.max(inchesToMetres(trench.minWidthIn), ductsWidth + 2 * inchesToMetres(trench.sideClearanceIn));
  let deepest = 0;
  let governing = '';
  for (const b of blocks) {
    if (b.bottomM > deepest) {
      deepest = b.bottomM;
      governing = b.utility;
    }
  }
  const beddingM = inchesToMetres(trench.beddingIn);
  const ductAreaM2 = blocks.reduce((a, b) => a + (b.conduits * Math.PI * b.odM * b.odM) / 4, 0);
  return { widthM, depthM: deepest + beddingM, ductAreaM2, beddingM, blocks, governing };
}
