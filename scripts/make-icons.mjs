// Draws Bankside's own icons (a sand-coloured bank against teal water with two
// wave lines) and writes them as PNG with Node's zlib: no image tool needed.
// Run: node scripts/make-icons.mjs  (output is committed under public/icons/)
import { deflateSync } from 'node:zlib';
import { writeFileSync, mkdirSync } from 'node:fs';

const NAVY = [11, 61, 79];
const WATER = [47, 150, 168];
const SAND = [226, 196, 132];
const FOAM = [244, 241, 232];

function crc32(buf) {
  let c, crc = 0xffffffff;
  for (let n = 0; n < buf.length; n++) {
    c = (crc ^ buf[n]) & 0xff;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    crc = (crc >>> 8) ^ c;
  }
  return (crc ^ 0xffffffff) >>> 0;
}
function chunk(type, data) {
  const len = Buffer.alloc(4); len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type), data]);
  const crc = Buffer.alloc(4); crc.writeUInt32BE(crc32(td));
  return Buffer.concat([len, td, crc]);
}
function png(size, rgba) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0); ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8; ihdr[9] = 6; ihdr[10] = 0; ihdr[11] = 0; ihdr[12] = 0;
  const raw = Buffer.alloc((size * 4 + 1) * size);
  for (let y = 0; y < size; y++) {
    raw[y * (size * 4 + 1)] = 0;
    rgba.copy(raw, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
  }
  return Buffer.concat([
    Buffer.from([137, 80, 78, 71, 13, 10, 26, 10]),
    chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw, { level: 9 })), chunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Colour at unit coordinates (0..1) of the artwork, or null for transparent. */
function art(x, y, full) {
  // 'any' icons: a rounded square; 'maskable': full bleed, art kept in the inner 80 %.
  if (!full) {
    const r = 0.18, dx = Math.max(Math.abs(x - 0.5) - (0.5 - r), 0), dy = Math.max(Math.abs(y - 0.5) - (0.5 - r), 0);
    if (dx * dx + dy * dy > r * r) return null;
  }
  const s = full ? 0.8 : 1; // scale the art into the safe zone
  const u = (x - 0.5) / s + 0.5, v = (y - 0.5) / s + 0.5;
  if (v < 0.36) return NAVY;
  // the bank: a sand slope from lower left
  if (v > 0.36 + (u - 0.05) * 0.9 && u < 0.62) return SAND;
  for (const base of [0.52, 0.7]) {
    const wy = base + 0.035 * Math.sin(u * Math.PI * 4);
    if (Math.abs(v - wy) < 0.028 && u > 0.2) return FOAM;
  }
  return WATER;
}

function draw(size, full) {
  const buf = Buffer.alloc(size * size * 4);
  const ss = 4;
  for (let py = 0; py < size; py++) for (let px = 0; px < size; px++) {
    let r = 0, g = 0, b = 0, a = 0;
    for (let sy = 0; sy < ss; sy++) for (let sx = 0; sx < ss; sx++) {
      const c = art((px + (sx + 0.5) / ss) / size, (py + (sy + 0.5) / ss) / size, full);
      if (c) { r += c[0]; g += c[1]; b += c[2]; a += 1; }
    }
    const i = (py * size + px) * 4, n = ss * ss;
    buf[i] = a ? Math.round(r / a) : 0; buf[i + 1] = a ? Math.round(g / a) : 0;
    buf[i + 2] = a ? Math.round(b / a) : 0; buf[i + 3] = Math.round((a / n) * 255);
  }
  return png(size, buf);
}

mkdirSync('public/icons', { recursive: true });
for (const size of [192, 512]) {
  writeFileSync(`public/icons/icon-${size}.png`, draw(size, false));
  writeFileSync(`public/icons/maskable-${size}.png`, draw(size, true));
}
writeFileSync('public/icons/apple-touch-icon.png', draw(180, true));
console.log('icons written to public/icons/');
