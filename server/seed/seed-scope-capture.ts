import { deflateSync } from 'node:zlib';

// A small PNG drawn for the demo: one supply cycle (grey) and the phase-cut output fired at α (black),
// standing in for an oscilloscope capture. Invented data, drawn from the engine's firing angle.
const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});
const crc32 = (b: Buffer) => {
  let c = 0xffffffff;
  for (const x of b) c = CRC_TABLE[(c ^ x) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
};
function chunk(type: string, data: Buffer) {
  const body = Buffer.concat([Buffer.from(type, 'latin1'), data]);
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  body.copy(out, 4);
  out.writeUInt32BE(crc32(body), 8 + data.length);
  return out;
}

export function scopeCapturePng(alphaDeg: number, width = 240, height = 120): Buffer {
  const pixels = Buffer.alloc((width + 1) * height, 255);
  const plot = (x: number, v: number, shade: number) => {
    const y = Math.round(height / 2 - v * (height / 2 - 6));
    for (const dy of [0, 1]) if (y + dy >= 0 && y + dy < height) pixels[(y + dy) * (width + 1) + 1 + x] = shade;
  };
  for (let x = 0; x < width; x++) {
    const theta = (2 * Math.PI * x) / width;
    const supply = Math.sin(theta);
    const inHalf = ((theta % Math.PI) * 180) / Math.PI;
    plot(x, supply, 170);
    plot(x, inHalf >= alphaDeg ? supply : 0, 0);
    pixels[Math.floor(height / 2) * (width + 1) + 1 + x] = x % 4 ? pixels[Math.floor(height / 2) * (width + 1) + 1 + x] : 120;
  }
  for (let y = 0; y < height; y++) pixels[y * (width + 1)] = 0; // filter type 0 for every scanline
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.writeUInt8(8, 8); // bit depth
  header.writeUInt8(0, 9); // greyscale
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), chunk('IHDR', header), chunk('IDAT', deflateSync(pixels)), chunk('IEND', Buffer.alloc(0))]);
}
