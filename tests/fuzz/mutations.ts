// Mutations of a DXF text for the fuzz tests, as fast-check arbitraries: byte flips, truncation
// (with and without a fresh end-of-file marker, so cut files also reach the parser), duplicated,
// dropped and swapped group pairs, dropped single lines (codes and values out of step), hostile
// values (huge, tiny, NaN / Infinity text, very long strings, markup) and hostile entities.

import fc from 'fast-check';
import { dxfLines, type Pair } from './seedDrawings';

export const HOSTILE_VALUES = [
  '1e308', '-1e308', '1e309', '-1e309', '1e-320', 'NaN', 'nan', 'Infinity', '-Infinity', 'inf', '0', '-0',
  '99999999999999999999999', '2147483648', '-2147483649', '4294967296', '', ' ', '-', '.', '1e', '0x1F',
  '<script>alert(1)</script>', '\u0000', 'ÿþ', 'x'.repeat(5000), '3.4.5', '12abc', '  7  ', '-1', '360', '1000000',
] as const;

export const HOSTILE_CODES = [0, 1, 2, 5, 8, 9, 10, 11, 20, 21, 40, 41, 42, 43, 44, 45, 50, 51, 62, 66, 70, 71, 72, 73, 74, 90, 210, 230, 330, 999, 1001, -1, 100000] as const;

const e = (pairs: Pair[]): string => dxfLines(pairs);

/** Entities spliced into a drawing (cheap enough to run in-process ten thousand times). */
export const HOSTILE_ENTITIES: readonly string[] = [
  e([[0, 'CIRCLE'], [8, 'BLDG'], [10, 0], [20, 0], [40, '1e308']]),
  e([[0, 'CIRCLE'], [8, 'BLDG'], [10, '1e308'], [20, '-1e308'], [40, 1]]),
  e([[0, 'CIRCLE'], [8, 'BLDG'], [10, 0], [20, 0], [40, '1e-300']]),
  e([[0, 'CIRCLE'], [8, 'BLDG'], [10, 'NaN'], [20, 0], [40, 'Infinity']]),
  e([[0, 'ARC'], [8, 'CURB'], [10, 0], [20, 0], [40, 5], [50, 'Infinity'], [51, '-Infinity']]),
  e([[0, 'ARC'], [8, 'CURB'], [10, 0], [20, 0], [40, 5], [50, '1e308'], [51, 0]]),
  e([[0, 'ELLIPSE'], [8, 'BLDG'], [10, 0], [20, 0], [11, 0], [21, 0], [40, '1e300'], [41, 0], [42, 6.28]]),
  e([[0, 'ELLIPSE'], [8, 'BLDG'], [10, 0], [20, 0], [11, '1e308'], [21, '1e308'], [40, 1], [41, '-1e308'], [42, '1e308']]),
  e([[0, 'LWPOLYLINE'], [8, 'BLDG'], [90, '1000000000'], [70, 1], [10, 0], [20, 0], [42, '1e308'], [10, 5], [20, 0], [42, 'NaN'], [10, 5], [20, 5]]),
  e([[0, 'LWPOLYLINE'], [8, 'BLDG'], [90, 3], [70, 1], [10, 0], [20, 0], [42, 1], [10, '1e300'], [20, 0], [42, 1], [10, 0], [20, '1e300'], [42, -1]]),
  e([[0, 'LWPOLYLINE'], [8, 'BLDG'], [70, 1], [10, 0], [20, 0], [10, 0], [20, 0], [10, 0], [20, 0]]),
  e([[0, 'LWPOLYLINE'], [8, 'BLDG'], [70, 1], [10, 0], [20, 0], [10, 10], [20, 10], [10, 10], [20, 0], [10, 0], [20, 10]]),
  e([[0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, 1000], [72, 2], [73, 1], [40, 0], [40, 1], [10, 0], [20, 0]]),
  e([[0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, 0], [72, 2], [73, 2], [40, 0], [40, 1], [10, 0], [20, 0], [10, 1], [20, 1]]),
  e([[0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, -3], [73, 4], [10, 0], [20, 0], [10, 1], [20, 1], [10, 2], [20, 0], [10, 3], [20, 1]]),
  e([[0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, 3], [72, 8], [73, 4], [40, 0], [40, 0], [40, 0], [40, 0], [40, 'NaN'], [40, 1], [40, 1], [40, 1],
    [10, 0], [20, 0], [10, '1e308'], [20, 0], [10, 2], [20, '-1e308'], [10, 3], [20, 0]]),
  e([[0, 'SPLINE'], [8, 'CURB'], [70, 8], [71, 3], [74, 4], [11, 0], [21, 0], [11, 0], [21, 0], [11, 0], [21, 0], [11, 0], [21, 0]]),
  e([[0, 'TEXT'], [8, 'NOTE'], [10, 1], [20, 1], [40, '1e308'], [50, 'NaN'], [1, '<img src=x onerror=alert(1)>']]),
  e([[0, 'MTEXT'], [8, 'NOTE'], [10, 1], [20, 1], [40, 1], [1, '\\P'.repeat(2000) + '{\\H1e308x;<b>bold</b>}']]),
  e([[0, 'MTEXT'], [8, 'NOTE'], [10, 1], [20, 1], [40, 1], [3, 'a'.repeat(250)], [3, '{'.repeat(3000)], [1, '}']]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'TREE-A'], [10, 0], [20, 0], [41, 0], [42, 0]]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'TREE-A'], [10, 0], [20, 0], [41, '1e308'], [42, '-1e308'], [50, '1e308']]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'TREE-A'], [10, 0], [20, 0], [41, 'NaN']]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'TREE-A'], [10, 0], [20, 0], [70, '1000000'], [71, '1000000'], [44, 1], [45, 1]]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'TREE-A'], [10, 0], [20, 0], [70, 60], [71, 60], [44, '1e308'], [45, 'NaN']]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'TREE-A'], [10, 0], [20, 0], [70, -5], [71, '1e308']]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, 'NO-SUCH-BLOCK'], [10, 0], [20, 0]]),
  e([[0, 'INSERT'], [8, 'TREE'], [2, ''], [10, 0], [20, 0]]),
  e([[0, 'POLYLINE'], [8, 'BLDG'], [66, 1], [70, 1], [0, 'VERTEX'], [10, 0], [20, 0], [0, 'VERTEX'], [10, 4], [20, 0], [0, 'VERTEX'], [10, 4], [20, 4]]),
  e([[0, 'VERTEX'], [8, 'BLDG'], [10, 1], [20, 1], [0, 'SEQEND']]),
  e([[0, 'POLYLINE'], [8, 'BLDG'], [70, 8], [0, 'VERTEX'], [10, 'Infinity'], [20, 0], [0, 'VERTEX'], [10, 1], [20, 1], [0, 'SEQEND']]),
  e([[0, 'LINE'], [8, 'BLDG'], [10, 'NaN'], [20, 0], [11, 1], [21, 1]]),
  e([[0, 'LINE'], [8, ''], [10, 0], [20, 0]]),
  e([[0, 'SECTION'], [2, 'ENTITIES']]),
  e([[0, 'ENDSEC']]),
  e([[0, 'BLOCK'], [2, 'LOOSE'], [0, 'INSERT'], [2, 'LOOSE'], [0, 'ENDBLK']]),
  e([[0, 'DIMENSION'], [8, 'NOTE'], [2, 'TREE-A'], [10, 0], [20, 0]]),
  e([[0, 'HATCH'], [8, 'PAVE'], [91, '1000000000'], [92, 2], [93, '1000000000'], [10, 0], [20, 0]]),
];

export type Edit =
  | { op: 'flip'; at: number; byte: number }
  | { op: 'truncate'; at: number; eof: boolean }
  | { op: 'dupGroup' | 'dropGroup' | 'dropLine'; at: number }
  | { op: 'value'; at: number; v: string }
  | { op: 'code'; at: number; c: number }
  | { op: 'swap'; at: number; to: number }
  | { op: 'splice'; at: number; text: string };

export const editArb: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({ op: fc.constant('flip' as const), at: fc.nat(), byte: fc.integer({ min: 0, max: 255 }) }),
  fc.record({ op: fc.constant('truncate' as const), at: fc.nat(), eof: fc.boolean() }),
  fc.record({ op: fc.constantFrom('dupGroup' as const, 'dropGroup' as const, 'dropLine' as const), at: fc.nat() }),
  fc.record({ op: fc.constant('value' as const), at: fc.nat(), v: fc.constantFrom(...HOSTILE_VALUES) }),
  fc.record({ op: fc.constant('code' as const), at: fc.nat(), c: fc.constantFrom(...HOSTILE_CODES) }),
  fc.record({ op: fc.constant('swap' as const), at: fc.nat(), to: fc.nat() }),
  fc.record({ op: fc.constant('splice' as const), at: fc.nat(), text: fc.constantFrom(...HOSTILE_ENTITIES) }),
);

/** Apply edits in order; line-based edits work on group pairs (two lines each). */
export function applyEdits(text: string, edits: readonly Edit[]): string {
  let t = text;
  for (const ed of edits) {
    if (ed.op === 'flip') {
      if (t.length === 0) continue;
      const at = ed.at % t.length;
      t = t.slice(0, at) + String.fromCharCode(ed.byte) + t.slice(at + 1);
      continue;
    }
    if (ed.op === 'truncate') {
      t = t.slice(0, ed.at % (t.length + 1)) + (ed.eof ? '\n  0\nEOF\n' : '');
      continue;
    }
    const lines = t.split('\n');
    const pairs = Math.max(1, Math.floor(lines.length / 2));
    const p = (ed.at % pairs) * 2;
    switch (ed.op) {
      case 'dupGroup': lines.splice(p, 0, lines[p] ?? '0', lines[p + 1] ?? ''); break;
      case 'dropGroup': lines.splice(p, 2); break;
      case 'dropLine': lines.splice(ed.at % Math.max(1, lines.length), 1); break;
      case 'value': if (p + 1 < lines.length) lines[p + 1] = ed.v; break;
      case 'code': lines[p] = String(ed.c).padStart(3); break;
      case 'swap': {
        const q = (ed.to % pairs) * 2;
        if (p + 1 < lines.length && q + 1 < lines.length) {
          [lines[p], lines[q]] = [lines[q], lines[p]];
          [lines[p + 1], lines[q + 1]] = [lines[q + 1], lines[p + 1]];
        }
        break;
      }
      case 'splice': {
        // before the next entity start at or after the chosen pair, so the snippet lands between entities
        let k = p;
        while (k < lines.length && lines[k].trim() !== '0') k += 2;
        lines.splice(Math.min(k, lines.length), 0, ...ed.text.replace(/\n$/, '').split('\n'));
        break;
      }
    }
    t = lines.join('\n');
  }
  return t;
}
