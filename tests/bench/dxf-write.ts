// DXF write benchmark: merges Furrow's layers into a large drawing (the demo site's entities
// repeated to ~20 MB, written into tests/.tmp/) and reports one JSON line per case: the merge
// time, and as peers measured in the same process the time to decode the bytes and split them
// into lines (the least any reader does) and dxf-parser's parse of the same file.
//   npx tsx tests/bench/dxf-write.ts [--mb 20]
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import DxfParser from 'dxf-parser';
import { writeLayerOnlyDxf, writeMergedDxf } from '../../core/dxf/writeDxf';
import { sampleInput } from '../core/dxf/sampleNetwork';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const TMP = join(ROOT, 'tests', '.tmp', 'bench-dxf-write');
const args = process.argv.slice(2);
const targetMB = args.includes('--mb') ? Number(args[args.indexOf('--mb') + 1]) : 20;

/** The demo drawing with its model-space entities repeated until the file reaches `mb`. */
function inflate(mb: number): Uint8Array {
  const text = readFileSync(join(ROOT, 'assets', 'demo', 'site.dxf'), 'latin1');
  const start = text.indexOf('ENTITIES');
  const endsec = text.lastIndexOf('  0\nENDSEC', text.indexOf('OBJECTS'));
  const head = text.slice(0, text.indexOf('\n', start) + 1);
  const body = text.slice(head.length, endsec);
  const copies = Math.max(1, Math.ceil((mb * 1048576 - text.length) / body.length));
  return Buffer.from(head + body.repeat(copies) + text.slice(endsec), 'latin1');
}

const time = (f: () => unknown): number => { const t = performance.now(); f(); return performance.now() - t; };

mkdirSync(TMP, { recursive: true });
for (const mb of [Math.max(1, Math.round(targetMB / 4)), targetMB]) {
  const bytes = inflate(mb);
  writeFileSync(join(TMP, `big-${mb}.dxf`), bytes);
  const input = sampleInput('m');
  let outBytes = 0;
  const mergeMs = time(() => {
    const r = writeMergedDxf(bytes, input);
    if (!r.ok) throw new Error(r.error.message);
    outBytes = r.value.bytes.length;
  });
  const layerOnlyMs = time(() => writeLayerOnlyDxf(input, { insUnits: 6 }));
  const decodeMs = time(() => new TextDecoder('windows-1252').decode(bytes).split('\n').length);
  let parseMs = NaN;
  const text = new TextDecoder('windows-1252').decode(bytes);
  parseMs = time(() => new DxfParser().parseSync(text));
  process.stdout.write(JSON.stringify({
    bench: 'dxf-write', sizeMB: +(bytes.length / 1048576).toFixed(1), outMB: +(outBytes / 1048576).toFixed(1),
    mergeMs: +mergeMs.toFixed(1), layerOnlyMs: +layerOnlyMs.toFixed(1), peerDecodeSplitMs: +decodeMs.toFixed(1), peerDxfParserMs: +parseMs.toFixed(1),
    mergeVsDecodeSplit: +(mergeMs / decodeMs).toFixed(2), mergeVsDxfParser: +(mergeMs / parseMs).toFixed(3),
    mergeMBps: +((bytes.length / 1048576) / (mergeMs / 1000)).toFixed(1),
  }) + '\n');
}
