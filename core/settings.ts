// Settings with defaults and the source of each default (see DOMAIN.md for the sources).
// Lengths are in the routing unit of the job unless the key says otherwise (…M, …In).

import type { LengthUnit } from './units';

export type GeometryStyle = 'orthogonal' | 'octilinear' | 'any-angle';
export type SoilType = 'A' | 'B' | 'C' | 'rock' | 'unclassified';
export type ProtectiveSystem = 'shoring' | 'sloping';
export type UtilityKind = 'radial' | 'main';

export interface RouteSettings {
  style: GeometryStyle;
  /** Grid cell size in metres (0.5 m default; practice). */
  cellM: number;
  /** Clearance from buildings and keep-outs, metres (1.0 m default; practice). */
  clearanceM: number;
  /** Cost factor per metre under pavement relative to soft ground (practice). */
  pavementFactor: number;
  /** Penalty per crossing of a crossing line or pavement edge, metres of trench equivalent. */
  crossingPenaltyM: number;
  /** Penalty per 90° of turning, metres of trench equivalent; scaled by the true angle. */
  bendPenaltyM: number;
  /** Snap tolerance for service points onto walls, metres. */
  snapToleranceM: number;
  /** Solver time budget, milliseconds. */
  timeBudgetMs: number;
  seed: number;
}

export interface UtilitySetting {
  key: string;
  label: string;
  /** APWA uniform colour code, as hex. */
  color: string;
  kind: UtilityKind;
  /** Conduit or pipe outside diameter, inches. */
  diameterIn: number;
  /** Conduits per service (radial) — mains carry one pipe. */
  perService: number;
  /** Minimum cover, inches: soft ground / under pavement. */
  coverIn: { soft: number; pavement: number };
  /** Total bend allowed between pull points, degrees (0: not pulled, no pull boxes). */
  bendLimitDeg: number;
  /** Maximum pull length between pull points, metres (0: no limit). */
  maxPullM: number;
  /** Needs a tracer wire (non-metallic pipe/conduit). */
  tracer: boolean;
  /** Optional pulling-tension check. */
  cable?: { weightLbPerFt: number; friction: number; maxTensionLb: number };
  source: string;
}

export interface TrenchSettings {
  /** Side clearance each side of the duct arrangement, inches (practice: OD + 12 in total). */
  sideClearanceIn: number;
  /** Minimum trench width, inches (practice). */
  minWidthIn: number;
  /** Spacing between ducts, inches (practice). */
  ductSpacingIn: number;
  /** Bedding below the lowest duct, inches (4–6 in practice). */
  beddingIn: number;
  soil: SoilType;
  /** When depth reaches 5 ft (OSHA 1926.652(a)(1)): shore/box or slope. */
  protective: ProtectiveSystem;
  /** Swell, bank → loose (practice: common earth 25 %). */
  swell: number;
  /** Pavement overcut beyond each trench edge, inches (county detail: ≥ 6 in + 1 ft T-patch). */
  pavementOvercutIn: number;
  /** Conduit stub-up allowance at each end of a conduit run, metres. */
  stubUpM: number;
  /** Count the 90° riser sweep at each end of a pulled run toward its bend limit (default true; NEC counts every bend). */
  countRiserBends?: boolean;
  /** Clear separation between the duct blocks of different utilities, inches (default 12; CGA 2.12 / NESC, practice). */
  utilitySeparationIn?: number;
  /** Conduits side by side in one row of a utility's duct block before a new row starts (default 4; practice). */
  ductsPerRow?: number;
  /** Backfill brought in instead of reusing the spoil (default false: spoil reused, only the surplus hauled). */
  importBackfill?: boolean;
}

export interface PriceItem {
  key: string;
  description: string;
  unit: string;
  price: number;
}

export interface Settings {
  units?: LengthUnit;
  route: RouteSettings;
  utilities: UtilitySetting[];
  trench: TrenchSettings;
  currency: string;
  /** Unit prices: placeholders until the estimator replaces them. */
  prices: PriceItem[];
  /** DXF layer names for the written layers (DEFAULT_DXF_LAYERS when absent). */
  dxfLayers?: DxfLayerNames;
}

export const DEFAULT_ROUTE: RouteSettings = {
  style: 'octilinear',
  cellM: 0.5,
  clearanceM: 1.0,
  pavementFactor: 3,
  crossingPenaltyM: 10,
  bendPenaltyM: 2,
  snapToleranceM: 2.0,
  timeBudgetMs: 2000,
  seed: 1,
};

export const DEFAULT_UTILITIES: UtilitySetting[] = [
  {
    key: 'power', label: 'Electric (secondary)', color: '#FF0000', kind: 'radial', diameterIn: 2.375, perService: 1,
    coverIn: { soft: 18, pavement: 24 }, bendLimitDeg: 360, maxPullM: 152.4, tracer: false,
    source: 'Cover: NEC 2023 Table 300.5 col. 3 (PVC) 18 in, roads/parking 24 in; bends: NEC 352.26 (360°); pull length 500 ft (practice); APWA red',
  },
  {
    key: 'telecom', label: 'Communications', color: '#FF8000', kind: 'radial', diameterIn: 2.375, perService: 1,
    coverIn: { soft: 18, pavement: 24 }, bendLimitDeg: 180, maxPullM: 182.88, tracer: true,
    source: 'Bends 180° and pull sections ≤ 600 ft: ANSI/TIA-758-A as quoted by BICSI; cover as power (practice); APWA orange',
  },
  {
    key: 'water', label: 'Potable water', color: '#0000FF', kind: 'main', diameterIn: 2.375, perService: 1,
    coverIn: { soft: 36, pavement: 36 }, bendLimitDeg: 0, maxPullM: 0, tracer: true,
    source: 'Cover: frost-depth setting, 36 in placeholder (local code); APWA blue',
  },
  {
    key: 'gas', label: 'Gas', color: '#FFFF00', kind: 'main', diameterIn: 1.315, perService: 1,
    coverIn: { soft: 24, pavement: 24 }, bendLimitDeg: 0, maxPullM: 0, tracer: true,
    source: 'Cover: 49 CFR 192.327(b) mains 24 in; 192.361(a) services 12 in private / 18 in streets; APWA yellow',
  },
];

export const DEFAULT_TRENCH: TrenchSettings = {
  sideClearanceIn: 6,
  minWidthIn: 12,
  ductSpacingIn: 3,
  beddingIn: 6,
  soil: 'B',
  protective: 'shoring',
  swell: 0.25,
  pavementOvercutIn: 18,
  stubUpM: 1.5,
};

/**
 * Unit prices. EVERY VALUE IS A PLACEHOLDER to be replaced by the estimator's own prices; they only
 * show the shape of the table. Keys match take-off line items; a line falls back from the most
 * specific key (e.g. 'conduit.power.2.375in') to shorter ones ('conduit.power', 'conduit').
 * Units: m, m2, m3, ft, yd2, yd3 or ea; prices are converted with exact factors to the schedule unit.
 */
export const DEFAULT_PRICES: PriceItem[] = [
  { key: 'trench.soft', description: 'PLACEHOLDER — trench in soft ground (open, lay, close)', unit: 'm', price: 40 },
  { key: 'trench.pavement', description: 'PLACEHOLDER — trench under pavement (open, lay, close)', unit: 'm', price: 60 },
  { key: 'excavation', description: 'PLACEHOLDER — excavation, bank measure', unit: 'm3', price: 30 },
  { key: 'protective', description: 'PLACEHOLDER — protective system (shoring / trench box), per length of trench', unit: 'm', price: 25 },
  { key: 'bedding', description: 'PLACEHOLDER — sand bedding, placed', unit: 'm3', price: 45 },
  { key: 'backfill', description: 'PLACEHOLDER — backfill, placed and compacted', unit: 'm3', price: 20 },
  { key: 'haul', description: 'PLACEHOLDER — load and haul surplus spoil, loose measure', unit: 'm3', price: 18 },
  { key: 'sawcut', description: 'PLACEHOLDER — saw-cut pavement', unit: 'm', price: 8 },
  { key: 'pavement.restore', description: 'PLACEHOLDER — pavement restoration (T-patch)', unit: 'm2', price: 90 },
  { key: 'tape', description: 'PLACEHOLDER — warning tape', unit: 'm', price: 0.5 },
  { key: 'tracer', description: 'PLACEHOLDER — tracer wire', unit: 'm', price: 1.2 },
  { key: 'conduit', description: 'PLACEHOLDER — conduit or pipe, supplied and laid', unit: 'm', price: 12 },
  { key: 'elbow', description: 'PLACEHOLDER — elbow / bend fitting', unit: 'ea', price: 15 },
  { key: 'tee', description: 'PLACEHOLDER — tee on a main', unit: 'ea', price: 35 },
  { key: 'pullbox', description: 'PLACEHOLDER — pull box / handhole, set', unit: 'ea', price: 850 },
  { key: 'crossing', description: 'PLACEHOLDER — crossing of an existing feature (locate, protect)', unit: 'ea', price: 250 },
  { key: 'crossing.pavement-edge', description: 'PLACEHOLDER — crossing a pavement edge / curb line', unit: 'ea', price: 120 },
];

export function defaultSettings(): Settings {
  return {
    route: { ...DEFAULT_ROUTE },
    utilities: DEFAULT_UTILITIES.map((u) => ({ ...u, coverIn: { ...u.coverIn } })),
    trench: { ...DEFAULT_TRENCH },
    currency: 'USD',
    prices: DEFAULT_PRICES.map((p) => ({ ...p })),
  };
}

/** DXF layer names Furrow writes (names configurable; defaults in DESIGN.md "Contracts"). */
export interface DxfLayerNames {
  centerline: string;
  outline: string;
  pullBox: string;
  service: string;
  label: string;
  notes: string;
}

export const DEFAULT_DXF_LAYERS: DxfLayerNames = {
  centerline: 'TRENCH-CENTERLINE',
  outline: 'TRENCH-OUTLINE',
  pullBox: 'TRENCH-PULLBOX',
  service: 'TRENCH-SERVICE',
  label: 'TRENCH-LABEL',
  notes: 'TRENCH-NOTES',
};
