// DXF syntax for Furrow's entities and layer records, in two flavours: R12 (AC1009: layers by
// name, POLYLINE/VERTEX/SEQEND, handles only when the file uses them) and R2000+ (AC1015 on:
// handles, owner 330 = model-space block record, subclass markers, LWPOLYLINE).
// Group codes per the DXF reference (read).

import { dxfReal, dxfText, handleHex, trueColor, type TextEncoding } from './dxfFormat';
import type { OutEntity, OutLayer } from './trenchEntities';

export interface Flavor {
  /** Version ordinal: 1009 for R12, 1015 for R2000, ... */
  version: number;
  /** Write group 5 handles (always for AC1012+, for R12 only when the file uses handles). */
  handles: boolean;
  /** How text values are encoded (see dxfText). */
  encoding: TextEncoding;
  /** Next free handle; advanced by every record written. */
  next: bigint;
  /** Handle of the model-space BLOCK_RECORD (owner of entities; AC1012+). */
  modelSpace?: string;
  /** Handle of the LAYER table (owner of layer records; AC1012+). */
  layerTable?: string;
  /** Name of the continuous linetype as the file spells it. */
  continuous: string;
  /** Plot style handle for new layer records (group 390), as the file's layer 0 has it. */
  plotStyle?: string;
}

/** Collects group code / value lines. */
export class Tags {
  readonly lines: string[] = [];
  add(code: number, value: string | number): this {
    this.lines.push(String(code).padStart(3, ' '), typeof value === 'number' ? String(value) : value);
    return this;
  }
  real(code: number, x: number): this { return this.add(code, dxfReal(x)); }
  text(eol: string): string { return this.lines.length ? this.lines.join(eol) + eol : ''; }
}

const modern = (f: Flavor): boolean => f.version >= 1012;

function handle(t: Tags, f: Flavor, code = 5): void {
  if (!f.handles) return;
  t.add(code, handleHex(f.next));
  f.next += 1n;
}

export function writeLayerRecord(t: Tags, layer: OutLayer, f: Flavor): void {
  t.add(0, 'LAYER');
  handle(t, f);
  if (modern(f)) {
    if (f.layerTable) t.add(330, f.layerTable);
    t.add(100, 'AcDbSymbolTableRecord').add(100, 'AcDbLayerTableRecord');
  }
  t.add(2, dxfText(layer.name, f.encoding)).add(70, 0).add(62, layer.color).add(6, f.continuous);
  if (modern(f)) {
    t.add(370, -3);
    if (f.plotStyle) t.add(390, f.plotStyle);
  }
}

/** A CONTINUOUS linetype record, for files that lack one. */
export function writeContinuousLtype(t: Tags, f: Flavor, ltypeTable?: string): void {
  t.add(0, 'LTYPE');
  handle(t, f);
  if (modern(f)) {
    if (ltypeTable) t.add(330, ltypeTable);
    t.add(100, 'AcDbSymbolTableRecord').add(100, 'AcDbLinetypeTableRecord');
  }
  t.add(2, f.continuous).add(70, 0).add(3, 'Solid line').add(72, 65).add(73, 0).real(40, 0);
}

function common(t: Tags, type: string, e: OutEntity, f: Flavor): void {
  t.add(0, type);
  handle(t, f);
  if (modern(f)) {
    if (f.modelSpace) t.add(330, f.modelSpace);
    t.add(100, 'AcDbEntity');
  }
  t.add(8, dxfText(e.layer, f.encoding));
  if (e.color !== undefined) t.add(62, e.color);
  if (f.version >= 1018 && 'hex' in e && e.hex) {
    const tc = trueColor(e.hex);
    if (tc !== null) t.add(420, tc);
  }
}

export function writeEntity(t: Tags, e: OutEntity, f: Flavor): void {
  switch (e.type) {
    case 'polyline': {
      const n = e.points.length / 2;
      if (f.version >= 1014) {
        // LWPOLYLINE exists from R14 (AC1014) on
        common(t, 'LWPOLYLINE', e, f);
        t.add(100, 'AcDbPolyline').add(90, n).add(70, e.closed ? 1 : 0).real(43, 0);
        for (let i = 0; i < e.points.length; i += 2) t.real(10, e.points[i]).real(20, e.points[i + 1]);
        return;
      }
      // R12 and R13: POLYLINE / VERTEX / SEQEND; in R13 the vertices and SEQEND are owned by the POLYLINE
      const polyHandle = f.handles ? handleHex(f.next) : undefined;
      common(t, 'POLYLINE', e, f);
      if (modern(f)) t.add(100, 'AcDb2dPolyline');
      t.add(66, 1).real(10, 0).real(20, 0).real(30, 0).add(70, e.closed ? 1 : 0);
      const sub = (type: string): void => {
        t.add(0, type);
        handle(t, f);
        if (modern(f)) {
          if (polyHandle) t.add(330, polyHandle);
          t.add(100, 'AcDbEntity');
        }
        t.add(8, dxfText(e.layer, f.encoding));
        if (e.color !== undefined) t.add(62, e.color);
      };
      for (let i = 0; i < e.points.length; i += 2) {
        sub('VERTEX');
        if (modern(f)) t.add(100, 'AcDbVertex').add(100, 'AcDb2dVertex');
        t.real(10, e.points[i]).real(20, e.points[i + 1]).real(30, 0);
      }
      sub('SEQEND');
      return;
    }
    case 'circle':
      common(t, 'CIRCLE', e, f);
      if (modern(f)) t.add(100, 'AcDbCircle');
      t.real(10, e.x).real(20, e.y).real(30, 0).real(40, e.r);
      return;
    case 'line':
      common(t, 'LINE', e, f);
      if (modern(f)) t.add(100, 'AcDbLine');
      t.real(10, e.x1).real(20, e.y1).real(30, 0).real(11, e.x2).real(21, e.y2).real(31, 0);
      return;
    case 'text':
      common(t, 'TEXT', e, f);
      if (modern(f)) t.add(100, 'AcDbText');
      t.real(10, e.x).real(20, e.y).real(30, 0).real(40, e.height).add(1, dxfText(e.text, f.encoding));
      if (e.rotationDeg !== 0) t.real(50, e.rotationDeg);
      if (modern(f)) t.add(100, 'AcDbText');
      return;
  }
}
