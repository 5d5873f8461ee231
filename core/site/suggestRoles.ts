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
  const stats = new Map<string, { closed: number; buildingSize: number; open: number; text: number; areas: number[] }>();
  for (const l of drawing.layers) stats.set(l.name, { closed: 0, buildingSize: 0, open: 0, text: 0, areas: [] });
  for (const e of drawing.entities) {
    let s = stats.get(e.layer);
    if (!s) { s = { closed: 0, buildingSize: 0, open: 0, text: 0, areas: [] }; stats.set(e.layer, s); }
    if (e.kind === 'text') { s.text++; continue; }
    if (!e.closed) { s.open++; continue; }
    s.closed++;
    const a = Math.abs(signedArea(e.points));
    if (scales.some((k) => a * k * k >= MIN_BUILDING_M2 && a * k * k <= MAX_BUILDING_M2)) {
      s.buildingSize++;
      s.areas.push(a * scales[0] * scales[0]);
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
    if (done) continue;
    const total = s.closed + s.open + s.text;
    if (total === 0) {
      out.push({ layer, role: 'ignore', reason: 'layer is empty' });
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
