// Draws Hotwell's app icons (PNG, no dependencies): a round well on a deep blue-green ground, its
// lower part filled with water under a level line. Run once after changing the drawing:
//   node scripts/make-icons.mjs   → public/icons/icon-192.png, icon-512.png, maskable-512.png
import { deflateSync } from 'node:zlib';
import { mkdirSync, writeFileSync } from 'node:fs';

const ground = [20, 60, 72];
const ring = [240, 244, 240];
const water = [96, 178, 206];

function crc32(bytes) {
  let c = ~0;
  for (const b of bytes) {
    c ^= b;
    for (let k = 0; k < 8; k++) c = (c >>> 1) ^ (0xedb88320 & -(c & 1));
  }
  return ~c >>> 0;
}

function chunk(type, data) {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'ascii');
  data.copy(out, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

/** `scale`: the drawing's share of the square (a maskable icon keeps it inside the safe circle). */
function icon(size, scale) {
  const rows = [];
  const c = size / 2;
  const outer = (size / 2) * scale * 0.86;
  const inner = outer * 0.8;
  const level = c + inner * 0.1;
  for (let y = 0; y < size; y++) {
    const row = Buffer.alloc(1 + size * 3);
    for (let x = 0; x < size; x++) {
      const d = Math.hypot(x + 0.5 - c, y + 0.5 - c);
      let colour = ground;
      if (d <= outer && d > inner) colour = ring;
      else if (d <= inner && y + 0.5 >= level) colour = Math.abs(y + 0.5 - level) < size * 0.012 ? ring : water;
      row.set(colour, 1 + x * 3);
    }
    rows.push(row);
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(size, 0);
  header.writeUInt32BE(size, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // truecolour RGB
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(Buffer.concat(rows), { level: 9 })),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

mkdirSync('public/icons', { recursive: true });
writeFileSync('public/icons/icon-192.png', icon(192, 1));
writeFileSync('public/icons/icon-512.png', icon(512, 1));
writeFileSync('public/icons/maskable-512.png', icon(512, 0.8));
console.log('public/icons: icon-192.png, icon-512.png, maskable-512.png');
