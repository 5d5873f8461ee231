// DXF export: Furrow's layers merged into the surveyor's original (new LAYER records and
// entities spliced in, everything else kept byte for byte), or a new file holding only
// Furrow's layers (AC1015) in the drawing's units and frame.

import { err, ok, type Result } from '../result';
import { versionNumber, handleHex, type TextEncoding } from './dxfFormat';
import { byteStringToBytes, scanDxf, type DxfScan } from './scanDxf';
import { buildTrenchDrawing, type TrenchDrawing, type TrenchDrawingInput } from './trenchEntities';
import { Tags, writeContinuousLtype, writeEntity, writeLayerRecord, type Flavor } from './writeEntities';
import type { LengthUnit } from '../units';

export type { TrenchDrawingInput, SegmentDrawInfo, PullBoxMark } from './trenchEntities';

export interface DxfWriteError {
  kind: 'binary' | 'structure';
  message: string;
}

export interface MergedDxf {
  bytes: Uint8Array;
  /** Layer names that already existed in the original (entities added to them, no new record). */
  warnings: string[];
  /** Entities (top-level) added. */
  added: number;
}

/**
 * The original drawing with Furrow's layers and entities spliced in. `original` is the file's
 * bytes; output bytes differ from them only at the insertion points and in $HANDSEED.
 */
export function writeMergedDxf(original: Uint8Array, input: TrenchDrawingInput): Result<MergedDxf, DxfWriteError> {
  const scanned = scanDxf(original);
  if (!scanned.ok) return err(scanned.error);
  const sc = scanned.value;
  const entitiesEnd = sc.sectionEnd.get('ENTITIES');
  if (entitiesEnd === undefined) return err({ kind: 'structure', message: 'the drawing has no complete ENTITIES section; write the layer-only DXF instead' });
  const version = versionNumber(sc.acadver || 'AC1009');
  const modern = version >= 1012;
  if (modern && (sc.tableEnd.get('LAYER') === undefined || !sc.modelSpaceRecord)) {
    return err({ kind: 'structure', message: `the drawing (${sc.acadver}) lacks a LAYER table or a *Model_Space block record; write the layer-only DXF instead` });
  }
  const handles = modern ? true : (sc.handling === 1 || sc.entitiesHaveHandles) && sc.sectionEnd.has('HEADER');
  const seed = sc.handseedValue ?? 0n;
  const start = seed > sc.maxHandle ? seed : sc.maxHandle + 1n;
  const existingLtype = sc.ltypeNames.find((n) => n.toUpperCase() === 'CONTINUOUS');
  const flavor: Flavor = {
    version: modern ? version : 1009, handles, encoding: textEncoding(version, sc.codepage), next: start < 1n ? 1n : start,
    modelSpace: sc.modelSpaceRecord ?? undefined, layerTable: sc.tableHandle.get('LAYER'),
    continuous: existingLtype ?? (modern ? 'Continuous' : 'CONTINUOUS'),
    plotStyle: sc.layerPlotStyle ?? undefined,
  };
  const drawing = buildTrenchDrawing(input);
  const warnings: string[] = [];
  const present = new Set(sc.layerNames.map((n) => n.toUpperCase()));
  const newLayers = drawing.layers.filter((l) => {
    if (!present.has(l.name.toUpperCase())) return true;
    warnings.push(`layer ${l.name} already exists in the drawing; Furrow's entities were added to it`);
    return false;
  });

  const inserts: { at: number; text: string }[] = [];
  const tableRecords = new Tags();
  const ltypeRecord = new Tags();
  const layerFlavor: Flavor = modern ? flavor : { ...flavor, handles: false };
  if (!existingLtype && (sc.tableEnd.has('LTYPE') || !sc.sectionStart.has('TABLES'))) {
    writeContinuousLtype(ltypeRecord, layerFlavor, sc.tableHandle.get('LTYPE'));
  }
  for (const l of newLayers) writeLayerRecord(tableRecords, l, layerFlavor);
  if (!modern) flavor.next = layerFlavor.next;
  if (sc.tableEnd.has('LAYER')) {
    if (ltypeRecord.lines.length) inserts.push({ at: sc.tableEnd.get('LTYPE')!, text: ltypeRecord.text(sc.eol) });
    inserts.push({ at: sc.tableEnd.get('LAYER')!, text: tableRecords.text(sc.eol) });
  } else {
    // An R12 file without a LAYER table: add one (and the linetype it names) in a TABLES section.
    const t = new Tags();
    if (ltypeRecord.lines.length && sc.tableEnd.has('LTYPE')) inserts.push({ at: sc.tableEnd.get('LTYPE')!, text: ltypeRecord.text(sc.eol) });
    if (!sc.sectionStart.has('TABLES')) t.add(0, 'SECTION').add(2, 'TABLES');
    if (ltypeRecord.lines.length && !sc.tableEnd.has('LTYPE')) {
      t.add(0, 'TABLE').add(2, 'LTYPE').add(70, 1);
      t.lines.push(...ltypeRecord.lines);
      t.add(0, 'ENDTAB');
    }
    t.add(0, 'TABLE').add(2, 'LAYER').add(70, newLayers.length);
    t.lines.push(...tableRecords.lines);
    t.add(0, 'ENDTAB');
    if (!sc.sectionStart.has('TABLES')) t.add(0, 'ENDSEC');
    const at = sc.sectionEnd.get('TABLES') ?? sc.sectionStart.get('BLOCKS') ?? sc.sectionStart.get('ENTITIES')!;
    inserts.push({ at, text: t.text(sc.eol) });
  }
  const ents = new Tags();
  for (const e of drawing.entities) writeEntity(ents, e, flavor);
  inserts.push({ at: entitiesEnd, text: ents.text(sc.eol) });

  let replaceSeed: { start: number; end: number; text: string } | null = null;
  if (handles) {
    const seedText = handleHex(flavor.next);
    if (sc.handseed) replaceSeed = { ...sc.handseed, text: seedText };
    else inserts.push({ at: sc.sectionEnd.get('HEADER')!, text: new Tags().add(9, '$HANDSEED').add(5, seedText).text(sc.eol) });
  }

  const cuts: { at: number; end: number; text: string }[] = inserts.map((i) => ({ at: i.at, end: i.at, text: i.text }));
  if (replaceSeed) cuts.push({ at: replaceSeed.start, end: replaceSeed.end, text: replaceSeed.text });
  cuts.sort((a, b) => a.at - b.at || a.end - b.end);
  let size = original.length;
  for (const c of cuts) size += c.text.length - (c.end - c.at);
  const bytes = new Uint8Array(size);
  let cursor = 0;
  let w = 0;
  for (const c of cuts) {
    bytes.set(original.subarray(cursor, c.at), w);
    w += c.at - cursor;
    bytes.set(byteStringToBytes(c.text), w);
    w += c.text.length;
    cursor = c.end;
  }
  bytes.set(original.subarray(cursor), w);
  return ok({ bytes, warnings, added: drawing.entities.length });
}

export interface LayerOnlyOptions {
  /** $INSUNITS of the original drawing (0 when unitless). */
  insUnits: number;
}

/** Text encoding of a file: UTF-8 from AC1021 (R2007) on, else its code page (1252 or ASCII with escapes). */
function textEncoding(version: number, codepage: string): TextEncoding {
  if (version >= 1021) return 'utf8';
  return codepage === '' || codepage.toUpperCase() === 'ANSI_1252' ? 'cp1252' : 'ascii';
}

/** A new AC1015 DXF (ANSI_1252) holding only Furrow's layers, in the original drawing's units and frame. */
export function writeLayerOnlyDxf(input: TrenchDrawingInput, opts: LayerOnlyOptions): Uint8Array {
  const d = buildTrenchDrawing(input);
  const units: LengthUnit = input.net.units;
  const insUnits = opts.insUnits || (input.net.frame.scale === 1 ? (units === 'm' ? 6 : 2) : 0);
  return byteStringToBytes(layerOnlyText(d, insUnits, units === 'm' ? 1 : 0));
}

function layerOnlyText(d: TrenchDrawing, insUnits: number, measurement: number): string {
  // Fixed handles for the document skeleton; entities and layers follow from 0x100.
  const H = {
    vportT: '8', ltypeT: '5', layerT: '2', styleT: '3', viewT: '6', ucsT: '7', appidT: '9', dimT: 'A', brT: '1',
    vport: '10', byBlock: '14', byLayer: '15', cont: '16', layer0: '11', std: '12', acad: '13', dimStd: '17',
    brModel: '1F', brPaper: '1B', blkModel: '20', endModel: '21', blkPaper: '1C', endPaper: '1D',
    root: 'C', groups: 'D', layouts: '1A', layoutModel: '22', layoutPaper: '1E',
  };
  const f: Flavor = { version: 1015, handles: true, encoding: 'cp1252', next: 0x100n, modelSpace: H.brModel, layerTable: H.layerT, continuous: 'Continuous' };
  const ents = new Tags();
  for (const e of d.entities) writeEntity(ents, e, f);
  const layers = new Tags();
  for (const l of d.layers) writeLayerRecord(layers, l, f);
  const ext = extentsOf(d);

  const t = new Tags();
  t.add(0, 'SECTION').add(2, 'HEADER');
  t.add(9, '$ACADVER').add(1, 'AC1015');
  t.add(9, '$DWGCODEPAGE').add(3, 'ANSI_1252');
  t.add(9, '$INSBASE').real(10, 0).real(20, 0).real(30, 0);
  t.add(9, '$EXTMIN').real(10, ext.minX).real(20, ext.minY).real(30, 0);
  t.add(9, '$EXTMAX').real(10, ext.maxX).real(20, ext.maxY).real(30, 0);
  t.add(9, '$INSUNITS').add(70, insUnits);
  t.add(9, '$MEASUREMENT').add(70, measurement);
  t.add(9, '$HANDSEED').add(5, handleHex(f.next));
  t.add(0, 'ENDSEC');
  t.add(0, 'SECTION').add(2, 'CLASSES').add(0, 'ENDSEC');
  t.add(0, 'SECTION').add(2, 'TABLES');
  const table = (name: string, h: string, count: number, body: () => void, dim = false): void => {
    t.add(0, 'TABLE').add(2, name).add(5, h).add(330, 0).add(100, 'AcDbSymbolTable').add(70, count);
    if (dim) t.add(100, 'AcDbDimStyleTable');
    body();
    t.add(0, 'ENDTAB');
  };
  const rec = (type: string, h: string, owner: string, sub: string, name: string, code5 = 5): void => {
    t.add(0, type).add(code5, h).add(330, owner).add(100, 'AcDbSymbolTableRecord').add(100, sub).add(2, name).add(70, 0);
  };
  const cx = (ext.minX + ext.maxX) / 2, cy = (ext.minY + ext.maxY) / 2;
  const span = Math.max(ext.maxY - ext.minY, (ext.maxX - ext.minX) / 1.6, 1);
  table('VPORT', H.vportT, 1, () => {
    rec('VPORT', H.vport, H.vportT, 'AcDbViewportTableRecord', '*Active');
    t.real(10, 0).real(20, 0).real(11, 1).real(21, 1).real(12, cx).real(22, cy).real(13, 0).real(23, 0).real(14, 1).real(24, 1)
      .real(15, 0).real(25, 0).real(16, 0).real(26, 0).real(36, 1).real(17, 0).real(27, 0).real(37, 0)
      .real(40, span * 1.1).real(41, 1.6).real(42, 50).real(43, 0).real(44, 0).real(50, 0).real(51, 0)
      .add(71, 0).add(72, 100).add(73, 1).add(74, 3).add(75, 0).add(76, 0).add(77, 0).add(78, 0);
  });
  table('LTYPE', H.ltypeT, 3, () => {
    for (const [h, name] of [[H.byBlock, 'ByBlock'], [H.byLayer, 'ByLayer'], [H.cont, 'Continuous']] as const) {
      rec('LTYPE', h, H.ltypeT, 'AcDbLinetypeTableRecord', name);
      t.add(3, name === 'Continuous' ? 'Solid line' : '').add(72, 65).add(73, 0).real(40, 0);
    }
  });
  table('LAYER', H.layerT, d.layers.length + 1, () => {
    rec('LAYER', H.layer0, H.layerT, 'AcDbLayerTableRecord', '0');
    t.add(62, 7).add(6, 'Continuous').add(370, -3);
    t.lines.push(...layers.lines);
  });
  table('STYLE', H.styleT, 1, () => {
    rec('STYLE', H.std, H.styleT, 'AcDbTextStyleTableRecord', 'Standard');
    t.real(40, 0).real(41, 1).real(50, 0).add(71, 0).real(42, 2.5).add(3, 'txt').add(4, '');
  });
  table('VIEW', H.viewT, 0, () => undefined);
  table('UCS', H.ucsT, 0, () => undefined);
  table('APPID', H.appidT, 1, () => rec('APPID', H.acad, H.appidT, 'AcDbRegAppTableRecord', 'ACAD'));
  table('DIMSTYLE', H.dimT, 1, () => rec('DIMSTYLE', H.dimStd, H.dimT, 'AcDbDimStyleTableRecord', 'Standard', 105), true);
  table('BLOCK_RECORD', H.brT, 2, () => {
    t.add(0, 'BLOCK_RECORD').add(5, H.brModel).add(330, H.brT).add(100, 'AcDbSymbolTableRecord').add(100, 'AcDbBlockTableRecord').add(2, '*Model_Space').add(340, H.layoutModel);
    t.add(0, 'BLOCK_RECORD').add(5, H.brPaper).add(330, H.brT).add(100, 'AcDbSymbolTableRecord').add(100, 'AcDbBlockTableRecord').add(2, '*Paper_Space').add(340, H.layoutPaper);
  });
  t.add(0, 'ENDSEC');
  t.add(0, 'SECTION').add(2, 'BLOCKS');
  for (const [blk, end, br, name, paper] of [[H.blkModel, H.endModel, H.brModel, '*Model_Space', false], [H.blkPaper, H.endPaper, H.brPaper, '*Paper_Space', true]] as const) {
    t.add(0, 'BLOCK').add(5, blk).add(330, br).add(100, 'AcDbEntity');
    if (paper) t.add(67, 1);
    t.add(8, '0').add(100, 'AcDbBlockBegin').add(2, name).add(70, 0).real(10, 0).real(20, 0).real(30, 0).add(3, name).add(1, '');
    t.add(0, 'ENDBLK').add(5, end).add(330, br).add(100, 'AcDbEntity');
    if (paper) t.add(67, 1);
    t.add(8, '0').add(100, 'AcDbBlockEnd');
  }
  t.add(0, 'ENDSEC');
  t.add(0, 'SECTION').add(2, 'ENTITIES');
  t.lines.push(...ents.lines);
  t.add(0, 'ENDSEC');
  t.add(0, 'SECTION').add(2, 'OBJECTS');
  t.add(0, 'DICTIONARY').add(5, H.root).add(330, 0).add(100, 'AcDbDictionary').add(281, 1)
    .add(3, 'ACAD_GROUP').add(350, H.groups).add(3, 'ACAD_LAYOUT').add(350, H.layouts);
  t.add(0, 'DICTIONARY').add(5, H.groups).add(330, H.root).add(100, 'AcDbDictionary').add(281, 1);
  t.add(0, 'DICTIONARY').add(5, H.layouts).add(330, H.root).add(100, 'AcDbDictionary').add(281, 1)
    .add(3, 'Layout1').add(350, H.layoutPaper).add(3, 'Model').add(350, H.layoutModel);
  for (const [h, name, br, order] of [[H.layoutModel, 'Model', H.brModel, 0], [H.layoutPaper, 'Layout1', H.brPaper, 1]] as const) {
    t.add(0, 'LAYOUT').add(5, h).add(330, H.layouts).add(100, 'AcDbPlotSettings').add(1, '').add(2, 'none_device').add(4, '').add(6, '')
      .real(40, 0).real(41, 0).real(42, 0).real(43, 0).real(44, 0).real(45, 0).real(46, 0).real(47, 0).real(48, 0).real(49, 0)
      .real(140, 0).real(141, 0).real(142, 1).real(143, 1).add(70, 688).add(72, 0).add(73, 0).add(74, 5).add(7, '').add(75, 16).real(147, 1).real(148, 0).real(149, 0)
      .add(100, 'AcDbLayout').add(1, name).add(70, 1).add(71, order)
      .real(10, 0).real(20, 0).real(11, 420).real(21, 297).real(12, 0).real(22, 0).real(32, 0)
      .real(14, ext.minX).real(24, ext.minY).real(34, 0).real(15, ext.maxX).real(25, ext.maxY).real(35, 0)
      .real(146, 0).real(13, 0).real(23, 0).real(33, 0).real(16, 1).real(26, 0).real(36, 0).real(17, 0).real(27, 1).real(37, 0)
      .add(76, 0).add(330, br);
  }
  t.add(0, 'ENDSEC');
  t.add(0, 'EOF');
  return t.text('\n');
}

function extentsOf(d: TrenchDrawing): { minX: number; minY: number; maxX: number; maxY: number } {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const add = (x: number, y: number): void => {
    if (x < minX) minX = x; if (x > maxX) maxX = x; if (y < minY) minY = y; if (y > maxY) maxY = y;
  };
  for (const e of d.entities) {
    switch (e.type) {
      case 'polyline': for (let i = 0; i < e.points.length; i += 2) add(e.points[i], e.points[i + 1]); break;
      case 'circle': add(e.x - e.r, e.y - e.r); add(e.x + e.r, e.y + e.r); break;
      case 'line': add(e.x1, e.y1); add(e.x2, e.y2); break;
      case 'text': add(e.x, e.y); break;
    }
  }
  return Number.isFinite(minX) ? { minX, minY, maxX, maxY } : { minX: 0, minY: 0, maxX: 0, maxY: 0 };
}

export type { DxfScan };
