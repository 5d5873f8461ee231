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

/**
 * Text value for a DXF group: one line, control characters removed. Non-ASCII characters are
 * written as `\U+XXXX` escapes (understood by DXF readers for every version) unless `utf8` is
 * set, in which case they are returned UTF-8 encoded as one char per byte (files from AC1021 on
 * are UTF-8; the caller splices bytes).
 */
export function dxfText(s: string, utf8: boolean): string {
  let out = '';
  for (const ch of s.replace(/[\r\n\t]+/g, ' ')) {
    const cp = ch.codePointAt(0)!;
    if (cp < 0x20 || cp === 0x7f) continue;
    if (cp < 0x80) { out += ch; continue; }
    if (utf8) {
      for (const b of new TextEncoder().encode(ch)) out += String.fromCharCode(b);
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
