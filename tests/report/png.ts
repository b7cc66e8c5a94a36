/**
 * A minimal PNG reader for the browser tests: 8-bit greyscale, RGB or RGBA, not interlaced, as Chromium
 * writes its screenshots (PNG specification, W3C Recommendation 2003, §11.2.2 IHDR, §9 filtering).
 */
import { inflateSync } from "node:zlib";

export interface Pixels {
  width: number;
  height: number;
  /** Luminance 0–255 of each pixel, row by row (ITU-R BT.601 weights on RGB). */
  luma: Float64Array;
}

function paeth(a: number, b: number, c: number): number {
  const p = a + b - c;
  const pa = Math.abs(p - a);
  const pb = Math.abs(p - b);
  const pc = Math.abs(p - c);
  return pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
}

export function readPng(png: Uint8Array): Pixels {
  const buf = Buffer.from(png);
  let pos = 8; // signature
  let width = 0;
  let height = 0;
  let channels = 0;
  const idat: Buffer[] = [];
  while (pos < buf.length) {
    const len = buf.readUInt32BE(pos);
    const type = buf.toString("latin1", pos + 4, pos + 8);
    const data = buf.subarray(pos + 8, pos + 8 + len);
    if (type === "IHDR") {
      width = data.readUInt32BE(0);
      height = data.readUInt32BE(4);
      const depth = data[8]!;
      const colour = data[9]!;
      if (depth !== 8 || data[12] !== 0) throw new Error("only 8-bit, non-interlaced PNG");
      channels = ({ 0: 1, 2: 3, 4: 2, 6: 4 } as Record<number, number>)[colour] ?? 0;
      if (channels === 0) throw new Error(`unsupported PNG colour type ${colour}`);
    } else if (type === "IDAT") idat.push(data);
    pos += 12 + len;
  }
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const out = new Uint8Array(height * stride);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)]!;
    for (let x = 0; x < stride; x++) {
      const v = raw[y * (stride + 1) + 1 + x]!;
      const a = x >= channels ? out[y * stride + x - channels]! : 0;
      const b = y > 0 ? out[(y - 1) * stride + x]! : 0;
      const c = x >= channels && y > 0 ? out[(y - 1) * stride + x - channels]! : 0;
      const pred = [0, a, b, (a + b) >> 1, paeth(a, b, c)][filter] ?? 0;
      out[y * stride + x] = (v + pred) & 0xff;
    }
  }
  const luma = new Float64Array(width * height);
  for (let i = 0; i < width * height; i++) {
    const p = i * channels;
    luma[i] = channels >= 3 ? 0.299 * out[p]! + 0.587 * out[p + 1]! + 0.114 * out[p + 2]! : (out[p] ?? 0);
  }
  return { width, height, luma };
}
