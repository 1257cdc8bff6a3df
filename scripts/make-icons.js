/* Draws Loadpath's own icon (a beam on two supports with a load arrow, on a slate-teal tile)
   at the sizes the manifest needs, and writes PNGs into assets/. Pure Node: zlib + CRC32.
   Generated files: assets/icon-*.png. Run: node scripts/make-icons.js */
const fs = require("fs");
const path = require("path");
const zlib = require("zlib");

const CRC_TABLE = new Uint32Array(256).map((_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buf) {
  let c = 0xffffffff;
  for (const b of buf) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}
function png(size, pixel) {
  const raw = Buffer.alloc((size * 4 + 1) * size);
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0;
    for (let x = 0; x < size; x++) {
      const [r, g, b, a] = pixel((x + 0.5) / size, (y + 0.5) / size);
      const o = y * (size * 4 + 1) + 1 + x * 4;
      raw[o] = r; raw[o + 1] = g; raw[o + 2] = b; raw[o + 3] = a;
    }
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; ihdr[9] = 6; ihdr[10] = 0; ihdr[11] = 0; ihdr[12] = 0;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", zlib.deflateSync(raw)),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

const TILE = [31, 94, 99, 255]; // slate teal
const INK = [250, 246, 236, 255]; // warm white
const LOAD = [244, 178, 62, 255]; // amber
const CLEAR = [0, 0, 0, 0];

/** Supersampled coverage of the icon's shapes at (u, v) in 0..1. */
function shape(u, v) {
  const r = 0.16; // rounded tile corner
  const cx = Math.min(Math.max(u, r), 1 - r), cy = Math.min(Math.max(v, r), 1 - r);
  if ((u - cx) ** 2 + (v - cy) ** 2 > r * r) return CLEAR;
  // beam
  if (v > 0.56 && v < 0.64 && u > 0.12 && u < 0.88) return INK;
  // two triangular supports under the beam
  for (const x0 of [0.24, 0.76]) {
    const h = v - 0.64;
    if (h > 0 && h < 0.16 && Math.abs(u - x0) < h * 0.75) return INK;
  }
  // load arrow: shaft and head, pointing down onto midspan
  if (u > 0.47 && u < 0.53 && v > 0.18 && v < 0.42) return LOAD;
  { const h = 0.54 - v; if (h > 0 && h < 0.13 && Math.abs(u - 0.5) < h * 0.8) return LOAD; }
  return TILE;
}
function pixel(u, v, size) {
  const n = 4; let acc = [0, 0, 0, 0];
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const c = shape(u + (i - 1.5) / (n * size), v + (j - 1.5) / (n * size));
    acc = acc.map((a, k) => a + (k < 3 ? c[k] * c[3] / 255 : c[3]));
  }
  const a = acc[3] / (n * n);
  return a === 0 ? [0, 0, 0, 0] : [0, 1, 2].map((k) => Math.round(acc[k] / (acc[3] / 255))).concat(Math.round(a));
}

const out = path.join(__dirname, "..", "assets");
fs.mkdirSync(out, { recursive: true });
for (const size of [16, 32, 64, 80, 128]) {
  fs.writeFileSync(path.join(out, `icon-${size}.png`), png(size, (u, v) => pixel(u, v, size)));
}
console.log("icons written to", out);
