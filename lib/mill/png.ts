/**
 * PNG encoding (pngjs) with the physical resolution written into the file: the pHYs chunk, pixels
 * per metre along x and y with the unit "metre" (PNG specification, 2nd ed., §11.3.5.3), so an
 * image program shows the tile at its true size.
 */
import { PNG } from 'pngjs';

const SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

let crcTable: Uint32Array | null = null;

/** CRC-32 (ISO 3309, the polynomial PNG uses) of a chunk's type and data. */
export function crc32(bytes: Uint8Array): number {
  if (!crcTable) {
    crcTable = new Uint32Array(256);
    for (let n = 0; n < 256; n++) {
      let c = n;
      for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
      crcTable[n] = c >>> 0;
    }
  }
  let c = 0xffffffff;
  for (const b of bytes) c = crcTable[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([len, body, crc]);
}

export interface PngChunk {
  type: string;
  data: Buffer;
}

/** The chunks of a PNG file, in order. @throws Error when the signature is wrong. */
export function readPngChunks(png: Uint8Array): PngChunk[] {
  const buf = Buffer.from(png.buffer, png.byteOffset, png.byteLength);
  if (!buf.subarray(0, 8).equals(SIGNATURE)) throw new Error('Not a PNG file.');
  const out: PngChunk[] = [];
  let at = 8;
  while (at + 12 <= buf.length) {
    const len = buf.readUInt32BE(at);
    const type = buf.toString('ascii', at + 4, at + 8);
    out.push({ type, data: buf.subarray(at + 8, at + 8 + len) });
    at += 12 + len;
    if (type === 'IEND') break;
  }
  return out;
}

/** The pHYs chunk's values, or null when the file has none. */
export function readPhys(png: Uint8Array): { pxPerMetreX: number; pxPerMetreY: number; unit: 'metre' | 'unknown' } | null {
  const c = readPngChunks(png).find((k) => k.type === 'pHYs');
  if (!c || c.data.length !== 9) return null;
  return { pxPerMetreX: c.data.readUInt32BE(0), pxPerMetreY: c.data.readUInt32BE(4), unit: c.data[8] === 1 ? 'metre' : 'unknown' };
}

/**
 * Encodes RGBA pixels as a PNG; with `pxPerMetre`, a pHYs chunk is inserted right after IHDR
 * (where the specification wants it: before the image data).
 */
export function encodePng(
  rgba: Uint8Array | Uint8ClampedArray,
  width: number,
  height: number,
  opts: { pxPerMetre?: { x: number; y: number }; text?: Record<string, string> } = {},
): Buffer {
  const png = new PNG({ width, height, colorType: 6, inputHasAlpha: true });
  png.data = Buffer.from(rgba.buffer, rgba.byteOffset, rgba.byteLength);
  const raw = PNG.sync.write(png, { colorType: 6 });
  const extra: Buffer[] = [];
  if (opts.pxPerMetre) {
    const d = Buffer.alloc(9);
    d.writeUInt32BE(Math.round(opts.pxPerMetre.x), 0);
    d.writeUInt32BE(Math.round(opts.pxPerMetre.y), 4);
    d[8] = 1;
    extra.push(chunk('pHYs', d));
  }
  for (const [k, v] of Object.entries(opts.text ?? {})) {
    extra.push(chunk('tEXt', Buffer.concat([Buffer.from(k, 'latin1'), Buffer.from([0]), Buffer.from(v, 'latin1')])));
  }
  if (!extra.length) return raw;
  const ihdrEnd = 8 + 12 + raw.readUInt32BE(8);
  return Buffer.concat([raw.subarray(0, ihdrEnd), ...extra, raw.subarray(ihdrEnd)]);
}

/** An opaque RGB image as a PNG, quickly (flat-colour drawings: no filter, moderate deflate). */
export function encodeRgbPng(rgb: Uint8Array, width: number, height: number): Buffer {
  const png = new PNG({ width, height, colorType: 2, inputColorType: 2, inputHasAlpha: false });
  png.data = Buffer.from(rgb.buffer, rgb.byteOffset, rgb.byteLength);
  return PNG.sync.write(png, { colorType: 2, inputColorType: 2, inputHasAlpha: false, filterType: 0, deflateLevel: 6 });
}
