/**
 * Draws Cairn's icons into public/: the mark as SVG (favicon.svg) and rasterised by this script (no image
 * library) into favicon.ico (16 and 32 px PNGs) and apple-touch-icon.png (180 px). The four stones are the
 * ones of components/ui/logo.tsx. Run: node scripts/draw-icons.mjs
 */
import { writeFileSync } from "node:fs";
import { deflateSync } from "node:zlib";

// [cx, cy, rx, ry, colour] in a 32 × 32 box, bottom stone first.
const STONES = [
  [16, 26, 12, 4.2, "#5f594f"],
  [14.5, 18.6, 8.6, 3.8, "#7d766a"],
  [17, 11.6, 5.6, 3.3, "#a29b8c"],
  [15.6, 5.6, 3.2, 2.5, "#2f7d6b"],
];

const svg = `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 32 32" width="32" height="32">
  <title>Cairn</title>
${STONES.map(([cx, cy, rx, ry, c]) => `  <ellipse cx="${cx}" cy="${cy}" rx="${rx}" ry="${ry}" fill="${c}"/>`).join("\n")}
</svg>
`;

const rgb = (hex) => [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16));

/** RGBA pixels of the mark at `size` px, 4 × 4 samples per pixel; `background` fills the square when given. */
function raster(size, background) {
  const px = Buffer.alloc(size * size * 4);
  const pad = background ? size * 0.12 : 0;
  const scale = (size - 2 * pad) / 32;
  for (let py = 0; py < size; py++)
    for (let qx = 0; qx < size; qx++) {
      let r = 0,
        g = 0,
        b = 0,
        a = 0;
      for (let sy = 0; sy < 4; sy++)
        for (let sx = 0; sx < 4; sx++) {
          const x = (qx + (sx + 0.5) / 4 - pad) / scale,
            y = (py + (sy + 0.5) / 4 - pad) / scale;
          let colour = background ? rgb(background) : null;
          for (const [cx, cy, rx, ry, c] of STONES) if (((x - cx) / rx) ** 2 + ((y - cy) / ry) ** 2 <= 1) colour = rgb(c);
          if (colour) {
            r += colour[0];
            g += colour[1];
            b += colour[2];
            a += 1;
          }
        }
      const o = (py * size + qx) * 4;
      px[o] = a ? Math.round(r / a) : 0;
      px[o + 1] = a ? Math.round(g / a) : 0;
      px[o + 2] = a ? Math.round(b / a) : 0;
      px[o + 3] = Math.round((a / 16) * 255);
    }
  return px;
}

const CRC = new Uint32Array(256).map((_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
function crc32(buf) {
  let c = 0xffffffff;
  for (const byte of buf) c = CRC[(c ^ byte) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}
function chunk(type, data) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}
/** A PNG (RFC 2083): 8-bit RGBA, filter 0 on every row. */
function png(size, background) {
  const px = raster(size, background);
  const rows = Buffer.alloc(size * (size * 4 + 1));
  for (let y = 0; y < size; y++) px.copy(rows, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(size, 0);
  ihdr.writeUInt32BE(size, 4);
  ihdr[8] = 8;
  ihdr[9] = 6;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", deflateSync(rows)),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}
/** An ICO file holding PNG images (allowed since Windows Vista; every current browser reads it). */
function ico(images) {
  const head = Buffer.alloc(6 + 16 * images.length);
  head.writeUInt16LE(0, 0);
  head.writeUInt16LE(1, 2);
  head.writeUInt16LE(images.length, 4);
  let offset = head.length;
  images.forEach(([size, data], i) => {
    const e = 6 + 16 * i;
    head[e] = size;
    head[e + 1] = size;
    head.writeUInt16LE(1, e + 4);
    head.writeUInt16LE(32, e + 6);
    head.writeUInt32LE(data.length, e + 8);
    head.writeUInt32LE(offset, e + 12);
    offset += data.length;
  });
  return Buffer.concat([head, ...images.map(([, d]) => d)]);
}

const out = new URL("../public/", import.meta.url);
writeFileSync(new URL("favicon.svg", out), svg);
writeFileSync(
  new URL("favicon.ico", out),
  ico([
    [16, png(16)],
    [32, png(32)],
  ]),
);
writeFileSync(new URL("apple-touch-icon.png", out), png(180, "#f7f6f3"));
console.log("wrote public/favicon.svg, public/favicon.ico, public/apple-touch-icon.png");
