// Writes assets/favicon.png (the beat mark on paper) without any image tool: a raw RGBA PNG through zlib.
const fs = require('fs');
const zlib = require('zlib');
const size = 48;
const px = Buffer.alloc(size * size * 4);
const put = (x, y, [r, g, b]) => {
  const i = (y * size + x) * 4;
  px[i] = r;
  px[i + 1] = g;
  px[i + 2] = b;
  px[i + 3] = 255;
};
for (let y = 0; y < size; y++) for (let x = 0; x < size; x++) put(x, y, [0x1f, 0x5f, 0x5b]);
const bars = [
  [8, 30, [0xc9, 0x76, 0x1c]],
  [17, 18, [0xf6, 0xf3, 0xec]],
  [26, 18, [0xf6, 0xf3, 0xec]],
  [35, 18, [0xf6, 0xf3, 0xec]],
];
for (const [x0, h, c] of bars) for (let y = 40 - h; y < 40; y++) for (let x = x0; x < x0 + 6; x++) put(x, y, c);
const raw = Buffer.alloc((size * 4 + 1) * size);
for (let y = 0; y < size; y++) px.copy(raw, y * (size * 4 + 1) + 1, y * size * 4, (y + 1) * size * 4);
const crcTable = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
const crc = (buf) => {
  let c = 0xffffffff;
  for (const b of buf) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
};
const chunk = (type, data) => {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const td = Buffer.concat([Buffer.from(type), data]);
  const c = Buffer.alloc(4);
  c.writeUInt32BE(crc(td));
  return Buffer.concat([len, td, c]);
};
const ihdr = Buffer.alloc(13);
ihdr.writeUInt32BE(size, 0);
ihdr.writeUInt32BE(size, 4);
ihdr[8] = 8;
ihdr[9] = 6;
const png = Buffer.concat([
  Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
  chunk('IHDR', ihdr),
  chunk('IDAT', zlib.deflateSync(raw)),
  chunk('IEND', Buffer.alloc(0)),
]);
fs.writeFileSync(require('path').join(__dirname, '..', 'assets', 'favicon.png'), png);
