// Role suggestions for layers when the user gives none: first from words in the layer name
// (Furrow's own keyword lists for usual survey layer names), then from the geometry on the layer
// (closed shapes of building size). Every suggestion carries a reason the interface can show.

import type { Drawing } from '../dxf/drawing';
import type { LayerRole, RoleSuggestion } from './site';
import { metresPerInsUnit } from '../units';
import { signedArea } from './rings';

/** Keyword lists per role; the first list (annotation) is checked on its own first. */
const KEYWORDS: readonly { role: LayerRole; words: readonly string[] }[] = [
  { role: 'ignore', words: ['TEXT', 'TXT', 'ANNO', 'ANNOT', 'DIM', 'DIMS', 'TITLE', 'BORDER', 'SHEET', 'VPORT', 'VIEWPORT', 'DEFPOINTS', 'HATCH', 'PATT', 'NOTE', 'NOTES', 'LEGEND', 'LABEL', 'LBL', 'GRID', 'CONTOUR', 'CONT', 'TOPO', 'SPOT', 'ELEV', 'SYMBOL', 'SYMB', 'NORTH', 'PLANT', 'SHRUB', 'LANDSCAPE', 'XREF'] },
  { role: 'building', words: ['BLDG', 'BLD', 'BUILDING', 'BUILDINGS', 'FOOTPRINT', 'FTPRNT', 'STRUCTURE', 'STRUC', 'STRUCT', 'HOUSE', 'DWELLING', 'SHED', 'GARAGE', 'WAREHOUSE', 'ROOF'] },
  { role: 'keep-out', words: ['KEEPOUT', 'KEEP', 'NODIG', 'NO-DIG', 'EXCLUSION', 'TPZ', 'PROTECT', 'PROTECTION', 'POND', 'WETLAND', 'WETLANDS', 'POOL', 'BASIN', 'BIORET', 'BIORETENTION', 'GRAVE', 'CEMETERY', 'FOUNDATION'] },
  { role: 'pavement', words: ['PAVE', 'PAVEMENT', 'PAVING', 'PVMT', 'ASPH', 'ASPHALT', 'ROAD', 'ROADWAY', 'STREET', 'STR', 'DRIVE', 'DRIVEWAY', 'DRWY', 'PARKING', 'PARK', 'PKG', 'SIDEWALK', 'SDWK', 'WALK', 'CONC', 'CONCRETE', 'HARDSCAPE', 'PLAZA', 'APRON'] },
  { role: 'boundary', words: ['BOUNDARY', 'BNDY', 'BDRY', 'BDY', 'PROP', 'PROPERTY', 'PL', 'PARCEL', 'LIMIT', 'LIMITS', 'LOW', 'SITE', 'ROW'] },
  { role: 'crossing', words: ['CURB', 'KERB', 'GUTTER', 'FENCE', 'WALL', 'GUARDRAIL', 'RAIL', 'RAILWAY', 'TRACK', 'DITCH', 'SWALE', 'CHANNEL', 'CREEK', 'EX', 'EXIST', 'EXST', 'EXISTING', 'UTIL', 'UTILITY', 'UTILITIES', 'WATER', 'WTR', 'WM', 'SEWER', 'SAN', 'SANITARY', 'SS', 'STORM', 'STM', 'SD', 'GAS', 'ELEC', 'ELECTRIC', 'POWER', 'PWR', 'TEL', 'TELE', 'PHONE', 'COMM', 'FIBER', 'FIBRE', 'FO', 'CATV', 'CABLE', 'IRRIG', 'IRRIGATION', 'PIPE', 'MAIN', 'CULVERT', 'DUCT', 'CONDUIT'] },
];

/** Words that decide only when no other word does (PARKING-LOT is pavement; LOT-LINES are lot lines). */
const WEAK: readonly { role: LayerRole; words: readonly string[]; what: string }[] = [
  { role: 'ignore', words: ['LOT', 'LOTS'], what: 'lot lines' },
];

/** Words of a layer name: xref prefix dropped, split on separators and letter/digit changes. */
export function layerWords(name: string): string[] {
  const base = name.includes('|') ? name.slice(name.lastIndexOf('|') + 1) : name;
  return base
    .toUpperCase()
    .split(/[^A-Z0-9]+/)
    .flatMap((w) => w.split(/(?<=[A-Z])(?=[0-9])|(?<=[0-9])(?=[A-Z])/))
    .filter((w) => w.length > 0);
}

function matchWord(words: string[], keywords: readonly string[]): string | null {
  for (const w of words) if (keywords.includes(w)) return w;
  // longer keywords also match as a prefix (BUILDINGS, PAVED, FENCING); the longest wins
  let best: string | null = null;
  for (const w of words) {
    for (const k of keywords) {
      if (k.length >= 4 && w.startsWith(k) && (best === null || k.length > best.length)) best = k;
    }
  }
  return best;
}

/** A building-size closed shape: 10 m² to 100 000 m² (practice: sheds to large warehouses). */
const MIN_BUILDING_M2 = 10;
const MAX_BUILDING_M2 = 100_000;

export function suggestRoles(drawing: Drawing): RoleSuggestion[] {
  // metres per drawing unit; unitless drawings are judged as metres and as feet, either passing
  const mpu = metresPerInsUnit(drawing.header.insUnits);
  const scales = mpu === null ? [1, 0.3048] : [mpu];
  type Stats = { closed: number; buildingSize: number; open: number; text: number; circles: number; areas: number[]; corners: Map<string, number>; shapes: Float64Array[] };
  const blank = (): Stats => ({ closed: 0, buildingSize: 0, open: 0, text: 0, circles: 0, areas: [], corners: new Map(), shapes: [] });
  const stats = new Map<string, Stats>();
  for (const l of drawing.layers) stats.set(l.name, blank());
  // geometry is looked at only on layers whose name says nothing
  const named = new Map<string, boolean>();
  const isNamed = (layer: string): boolean => {
    let v = named.get(layer);
    if (v === undefined) {
      const words = layerWords(layer);
      v = KEYWORDS.some((k) => matchWord(words, k.words) !== null) || WEAK.some((k) => matchWord(words, k.words) !== null);
      named.set(layer, v);
    }
    return v;
  };
  for (const e of drawing.entities) {
    let s = stats.get(e.layer);
    if (!s) { s = blank(); stats.set(e.layer, s); }
    if (e.kind === 'text') { s.text++; continue; }
    if (isNamed(e.layer)) { if (e.closed) s.closed++; else s.open++; continue; }
    if (!e.closed) { s.open++; continue; }
    s.closed++;
    // circles are symbols (trees, manholes) far more often than footprints
    if (e.source === 'CIRCLE') { s.circles++; continue; }
    const a = Math.abs(signedArea(e.points));
    if (scales.some((k) => a * k * k >= MIN_BUILDING_M2 && a * k * k <= MAX_BUILDING_M2)) {
      s.buildingSize++;
      s.areas.push(a * scales[0] * scales[0]);
      s.shapes.push(e.points);
      for (let i = 0; i < e.points.length; i += 2) {
        const key = `${e.points[i]},${e.points[i + 1]}`;
        s.corners.set(key, (s.corners.get(key) ?? 0) + 1);
      }
    }
  }
  const out: RoleSuggestion[] = [];
  for (const [layer, s] of stats) {
    const words = layerWords(layer);
    // annotation words win anywhere in the name; otherwise the last word with a meaning decides
    // (STREET-CURB is a curb, EX-BLDG a building)
    let done = false;
    const ann = matchWord(words, KEYWORDS[0].words);
    if (ann) {
      out.push({ layer, role: 'ignore', reason: `layer name contains '${ann}'` });
      done = true;
    }
    for (let w = words.length - 1; w >= 0 && !done; w--) {
      for (const { role, words: kw } of KEYWORDS) {
        const hit = matchWord([words[w]], kw);
        if (hit) {
          out.push({ layer, role, reason: `layer name contains '${hit}'` });
          done = true;
          break;
        }
      }
    }
    for (const { role, words: kw, what } of WEAK) {
      if (done) break;
      const hit = matchWord(words, kw);
      if (hit) {
        out.push({ layer, role, reason: `layer name contains '${hit}' (${what})` });
        done = true;
      }
    }
    if (done) continue;
    const total = s.closed + s.open + s.text;
    if (total === 0) {
      out.push({ layer, role: 'ignore', reason: 'layer is empty' });
    } else if (s.buildingSize > 0 && s.buildingSize >= 0.5 * (s.closed + s.open) && tiles(s.shapes, s.corners)) {
      out.push({ layer, role: 'ignore', reason: `${s.buildingSize} closed shapes that share corners like parcels or lots, not footprints` });
    } else if (s.buildingSize > 0 && s.buildingSize >= 0.5 * (s.closed + s.open)) {
      const med = s.areas.sort((a, b) => a - b)[Math.floor(s.areas.length / 2)];
      const unit = mpu === null ? 'drawing units² (unitless drawing)' : 'm²';
      out.push({ layer, role: 'building', reason: `${s.buildingSize} closed shape(s) of building size (median ${med.toFixed(0)} ${unit})` });
    } else if (s.text === total) {
      out.push({ layer, role: 'ignore', reason: 'layer holds only text' });
    } else {
      out.push({ layer, role: 'ignore', reason: 'no known word in the layer name and no building-size closed shapes' });
    }
  }
  return out;
}

/** Most shapes share a corner with another shape: a parcel or lot pattern rather than buildings. */
function tiles(shapes: Float64Array[], corners: Map<string, number>): boolean {
  if (shapes.length < 4) return false;
  let sharing = 0;
  for (const p of shapes) {
    for (let i = 0; i < p.length; i += 2) {
      if ((corners.get(`${p[i]},${p[i + 1]}`) ?? 0) > 1) { sharing++; break; }
    }
  }
  return sharing > 0.5 * shapes.length;
}
