// A small PNG drawn in code, for the demo sign-off's photo and for tests that upload an image.
// PNG layout per the PNG specification (RFC 2083): signature, IHDR, IDAT (zlib), IEND, each chunk
// with a CRC-32 over its type and data.
import { deflateSync } from 'node:zlib';

type Rgb = [number, number, number];

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'latin1');
  out.set(data, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

/** An 8-bit RGB PNG with each pixel's colour from `pixel(x, y)`. */
export function encodePng(width: number, height: number, pixel: (x: number, y: number) => Rgb): Uint8Array {
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 2, 0, 0, 0], 8); // bit depth 8, colour type 2 (RGB), deflate, adaptive filtering, no interlace
  const raw = Buffer.alloc(height * (1 + width * 3));
  for (let y = 0; y < height; y++) {
    const row = y * (1 + width * 3);
    raw[row] = 0; // filter type 0: the row as it is
    for (let x = 0; x < width; x++) raw.set(pixel(x, y), row + 1 + x * 3);
  }
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(raw)),
    chunk('IEND', new Uint8Array()),
  ]);
}

/**
 * A sketch of an engine's sump face seen from below: a grey casting with eight dark flange bolts in a
 * circle and a brass crankshaft end in the middle. Good enough to tell a photo tile from an empty one.
 */
export function demoBenchPhoto(width = 160, height = 120): Uint8Array {
  const cx = width / 2;
  const cy = height / 2;
  const r = Math.min(width, height) * 0.42;
  const bolts = Array.from({ length: 8 }, (_, i) => {
    const a = (i / 8) * 2 * Math.PI;
    return [cx + Math.cos(a) * r * 0.78, cy + Math.sin(a) * r * 0.78] as const;
  });
  return encodePng(width, height, (x, y) => {
    const d = Math.hypot(x - cx, y - cy);
    if (bolts.some(([bx, by]) => Math.hypot(x - bx, y - by) < r * 0.09)) return [40, 44, 52];
    if (d < r * 0.16) return [196, 150, 60];
    if (d < r) return [150, 158, 170];
    return [228, 231, 236];
  });
}
