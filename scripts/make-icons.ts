/**
 * Draws Riseline's app icons (the name mark of components/shell/Mark.tsx: a pump-down curve that
 * settles, the isolation point in flare amber, on tide teal) as PNG files for the web app manifest:
 * 192 and 512 px, plus maskable versions with the mark inside the central 80 % safe zone.
 * Run: npx tsx scripts/make-icons.ts (writes public/icons/). No image library: a small rasteriser
 * with 4×4 supersampling and a PNG writer on node:zlib (PNG, W3C/ISO 15948).
 */
import { writeFileSync, mkdirSync } from "node:fs";
import { deflateSync } from "node:zlib";

const TIDE = [0x0b, 0x6e, 0x69];
const WHITE = [0xff, 0xff, 0xff];
const FLARE = [0xe8, 0xa3, 0x17];

type P = [number, number];
function cubic(p0: P, p1: P, p2: P, p3: P, n: number): P[] {
  const out: P[] = [];
  for (let i = 0; i <= n; i++) {
    const t = i / n, u = 1 - t;
    out.push([u * u * u * p0[0] + 3 * u * u * t * p1[0] + 3 * u * t * t * p2[0] + t * t * t * p3[0], u * u * u * p0[1] + 3 * u * u * t * p1[1] + 3 * u * t * t * p2[1] + t * t * t * p3[1]]);
  }
  return out;
}
// The mark's path in its 32-unit box: M5 9 C9 21, 11 24, 14 24 S19 22, 27 12.
const CURVE = [...cubic([5, 9], [9, 21], [11, 24], [14, 24], 40), ...cubic([14, 24], [17, 24], [19, 22], [27, 12], 40)];

function segDist(x: number, y: number, a: P, b: P): number {
  const dx = b[0] - a[0], dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / (dx * dx + dy * dy || 1)));
  return Math.hypot(x - a[0] - t * dx, y - a[1] - t * dy);
}

/** Colour at a point of the 32-unit box; null outside the rounded square (transparent). */
function colourAt(x: number, y: number, maskable: boolean): number[] | null {
  if (!maskable) {
    const r = 8, cx = Math.min(Math.max(x, r), 32 - r), cy = Math.min(Math.max(y, r), 32 - r);
    if (x < 0 || y < 0 || x > 32 || y > 32 || Math.hypot(x - cx, y - cy) > r) return null;
  }
  // Maskable: the whole square is teal; the mark is drawn at 80 % around the centre.
  const mx = maskable ? (x - 16) / 0.8 + 16 : x, my = maskable ? (y - 16) / 0.8 + 16 : y;
  if (Math.hypot(mx - 14, my - 24) <= 2.6) return FLARE;
  for (let i = 1; i < CURVE.length; i++) if (segDist(mx, my, CURVE[i - 1], CURVE[i]) <= 1.5) return WHITE;
  return TIDE;
}

function crc32(buf: Buffer): number {
  let c = ~0;
  for (const b of buf) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
  }
  return ~c >>> 0;
}
function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}

function png(size: number, maskable: boolean): Buffer {
  const S = 4;
  const rows: Buffer[] = [];
  for (let py = 0; py < size; py++) {
    const row = Buffer.alloc(1 + size * 4);
    for (let px = 0; px < size; px++) {
      let r = 0, g = 0, b = 0, a = 0;
      for (let sy = 0; sy < S; sy++)
        for (let sx = 0; sx < S; sx++) {
          const c = colourAt(((px + (sx + 0.5) / S) / size) * 32, ((py + (sy + 0.5) / S) / size) * 32, maskable);
          if (c) {
            r += c[0]; g += c[1]; b += c[2]; a++;
          }
        }
      const o = 1 + px * 4;
      if (a) {
        row[o] = Math.round(r / a); row[o + 1] = Math.round(g / a); row[o + 2] = Math.round(b / a);
      }
      row[o + 3] = Math.round((a / (S * S)) * 255);
    }
    rows.push(row);
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; ihdr[9] = 6; // 8-bit RGBA
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk("IHDR", ihdr), chunk("IDAT", deflateSync(Buffer.concat(rows))), chunk("IEND", Buffer.alloc(0))]);
}

mkdirSync("public/icons", { recursive: true });
for (const size of [192, 512]) {
  writeFileSync(`public/icons/icon-${size}.png`, png(size, false));
  writeFileSync(`public/icons/maskable-${size}.png`, png(size, true));
}
console.log("wrote public/icons/icon-{192,512}.png and maskable-{192,512}.png");
