// Value formatting for the DXF writer: reals, text, handles and ACI colours.
// Deterministic by construction: the same number always prints the same characters.

/** A real as plain decimal text (no exponent), at most 9 decimals, trailing zeros dropped. */
export function dxfReal(x: number): string {
  if (!Number.isFinite(x)) throw new Error(`DXF writer got a non-finite number: ${x}`);
  if (Math.abs(x) < 5e-10) return '0.0';
  let s = x.toFixed(9);
  if (s.includes('.')) s = s.replace(/0+$/, '').replace(/\.$/, '.0');
  return s === '-0.0' ? '0.0' : s;
}

/** How text values are encoded: UTF-8 (AC1021+), Windows-1252 (the usual $DWGCODEPAGE ANSI_1252), or ASCII. */
export type TextEncoding = 'utf8' | 'cp1252' | 'ascii';

// Windows-1252 bytes 0x80–0x9F that are not Latin-1 (WHATWG encoding index, from memory).
const CP1252_HIGH: Record<number, number> = {
  0x20ac: 0x80, 0x201a: 0x82, 0x0192: 0x83, 0x201e: 0x84, 0x2026: 0x85, 0x2020: 0x86, 0x2021: 0x87, 0x02c6: 0x88,
  0x2030: 0x89, 0x0160: 0x8a, 0x2039: 0x8b, 0x0152: 0x8c, 0x017d: 0x8e, 0x2018: 0x91, 0x2019: 0x92, 0x201c: 0x93,
  0x201d: 0x94, 0x2022: 0x95, 0x2013: 0x96, 0x2014: 0x97, 0x02dc: 0x98, 0x2122: 0x99, 0x0161: 0x9a, 0x203a: 0x9b,
  0x0153: 0x9c, 0x017e: 0x9e, 0x0178: 0x9f,
};

/**
 * Text value for a DXF group, as a byte string (one char per byte): one line, control characters
 * removed, non-ASCII encoded for the file (`\U+XXXX` escapes where the encoding has no byte for it).
 */
export function dxfText(s: string, enc: TextEncoding): string {
  let out = '';
  for (const ch of s.replace(/[\r\n\t]+/g, ' ')) {
    const cp = ch.codePointAt(0)!;
    if (cp < 0x20 || cp === 0x7f) continue;
    if (cp < 0x80) { out += ch; continue; }
    if (enc === 'utf8') {
      for (const b of new TextEncoder().encode(ch)) out += String.fromCharCode(b);
    } else if (enc === 'cp1252' && cp >= 0xa0 && cp <= 0xff) {
      out += String.fromCharCode(cp);
    } else if (enc === 'cp1252' && CP1252_HIGH[cp] !== undefined) {
      out += String.fromCharCode(CP1252_HIGH[cp]);
    } else if (cp <= 0xffff) {
      out += '\\U+' + cp.toString(16).toUpperCase().padStart(4, '0');
    } else {
      out += '?';
    }
  }
  return out;
}

/** A handle as upper-case hex. */
export const handleHex = (h: bigint): string => h.toString(16).toUpperCase();

/** Parse a handle's hex text; null when it is not hex. */
export function parseHandle(text: string): bigint | null {
  const t = text.trim();
  if (!/^[0-9A-Fa-f]{1,16}$/.test(t)) return null;
  return BigInt('0x' + t);
}

// ACI indices whose RGB values are fixed in the standard palette: 1–7 the primaries and white,
// 8/9 the greys, and hue steps 30 (orange), 190 (violet), 230 (rose) (from memory).
const ACI_RGB: readonly [number, number, number, number][] = [
  [1, 255, 0, 0], [2, 255, 255, 0], [3, 0, 255, 0], [4, 0, 255, 255], [5, 0, 0, 255],
  [6, 255, 0, 255], [7, 255, 255, 255], [8, 128, 128, 128], [9, 192, 192, 192],
  [30, 255, 127, 0], [190, 127, 0, 255], [230, 255, 0, 127],
];

/** Parse '#RRGGBB' (or 'RRGGBB'); null when malformed. */
export function parseHexColor(hex: string): [number, number, number] | null {
  const m = /^#?([0-9a-fA-F]{6})$/.exec(hex.trim());
  if (!m) return null;
  const v = parseInt(m[1], 16);
  return [(v >> 16) & 255, (v >> 8) & 255, v & 255];
}

/** Nearest of the fixed ACI colours to an RGB hex colour (7 when the hex is malformed). */
export function aciForHex(hex: string): number {
  const rgb = parseHexColor(hex);
  if (!rgb) return 7;
  let best = 7;
  let bestD = Infinity;
  for (const [aci, r, g, b] of ACI_RGB) {
    const d = (r - rgb[0]) ** 2 + (g - rgb[1]) ** 2 + (b - rgb[2]) ** 2;
    if (d < bestD) { bestD = d; best = aci; }
  }
  return best;
}

/** 24-bit true colour value for group 420 (AC1018 and later). */
export function trueColor(hex: string): number | null {
  const rgb = parseHexColor(hex);
  return rgb ? (rgb[0] << 16) | (rgb[1] << 8) | rgb[2] : null;
}

/** DXF version string → ordinal (AC1009 → 1009); 0 when unknown. */
export function versionNumber(acadver: string): number {
  const m = /^AC(\d{4})$/i.exec(acadver.trim());
  return m ? Number(m[1]) : 0;
}
