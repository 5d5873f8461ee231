// Draws Furrow's icon (512×512 PNG): a loam-coloured tile with a brass three-way trench junction
// meeting at 120° (the Steiner condition) and three service dots. Run: npx tsx build/makeIcon.ts
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { PNG } from 'pngjs';

export const ICON_SIZE = 512;

type RGB = [number, number, number];
const LOAM: RGB = [0x1a, 0x1d, 0x17];
const TILE: RGB = [0x2c, 0x31, 0x27];
const BRASS: RGB = [0xc9, 0xa2, 0x27];
const DOTS: RGB[] = [[0xff, 0x00, 0x00], [0xff, 0x80, 0x00], [0x00, 0x5c, 0xff]];

function segDist(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax, dy = by - ay;
  const t = Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

function roundedBoxDist(px: number, py: number, c: number, half: number, r: number): number {
  const qx = Math.abs(px - c) - (half - r), qy = Math.abs(py - c) - (half - r);
  return Math.hypot(Math.max(qx, 0), Math.max(qy, 0)) + Math.min(Math.max(qx, qy), 0) - r;
}

export function drawIcon(size = ICON_SIZE): PNG {
  const png = new PNG({ width: size, height: size });
  const s = size / 512;
  const c = 256 * s;
  const arm = 150 * s;
  const ends = [90, 210, 330].map((deg) => [c + arm * Math.cos((deg * Math.PI) / 180), c - arm * Math.sin((deg * Math.PI) / 180)]);
  for (let y = 0; y < size; y++) {
    for (let x = 0; x < size; x++) {
      const px = x + 0.5, py = y + 0.5;
      const i = (y * size + x) * 4;
      const box = roundedBoxDist(px, py, c, 236 * s, 64 * s);
      const alpha = Math.max(0, Math.min(1, 0.5 - box));
      let col: RGB = box > -10 * s ? LOAM : TILE;
      const trench = Math.min(...ends.map(([ex, ey]) => segDist(px, py, c, c, ex, ey)));
      const tCov = Math.max(0, Math.min(1, 22 * s + 0.5 - trench));
      col = mix(col, BRASS, tCov);
      ends.forEach(([ex, ey], k) => {
        const d = Math.hypot(px - ex, py - ey);
        col = mix(col, LOAM, Math.max(0, Math.min(1, 46 * s + 0.5 - d)));
        col = mix(col, DOTS[k], Math.max(0, Math.min(1, 36 * s + 0.5 - d)));
      });
      png.data[i] = col[0]; png.data[i + 1] = col[1]; png.data[i + 2] = col[2];
      png.data[i + 3] = Math.round(alpha * 255);
    }
  }
  return png;
}

function mix(a: RGB, b: RGB, t: number): RGB {
  return [0, 1, 2].map((k) => Math.round(a[k] + (b[k] - a[k]) * t)) as RGB;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const out = path.join(path.dirname(fileURLToPath(import.meta.url)), 'icon.png');
  fs.writeFileSync(out, PNG.sync.write(drawIcon()));
  console.log(`wrote ${out}`);
}
