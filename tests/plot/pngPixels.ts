import { inflateSync } from 'node:zlib';

/** Decodes an 8-bit RGBA, non-interlaced PNG (what resvg writes) to its size and pixels, for tests. */
export function decodePng(png: Uint8Array): { width: number; height: number; pixels: Uint8Array } {
  const bytes = Buffer.from(png);
  let offset = 8;
  let width = 0;
  let height = 0;
  const data: Buffer[] = [];
  while (offset < bytes.length) {
    const length = bytes.readUInt32BE(offset);
    const type = bytes.toString('latin1', offset + 4, offset + 8);
    const chunk = bytes.subarray(offset + 8, offset + 8 + length);
    if (type === 'IHDR') {
      width = chunk.readUInt32BE(0);
      height = chunk.readUInt32BE(4);
      if (chunk[8] !== 8 || chunk[9] !== 6 || chunk[12] !== 0) throw new Error('expected 8-bit RGBA, not interlaced');
    }
    if (type === 'IDAT') data.push(chunk);
    offset += 12 + length;
  }
  const raw = inflateSync(Buffer.concat(data));
  const stride = width * 4;
  const pixels = new Uint8Array(stride * height);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)];
    for (let x = 0; x < stride; x++) {
      const value = raw[y * (stride + 1) + 1 + x];
      const a = x >= 4 ? pixels[y * stride + x - 4] : 0;
      const b = y > 0 ? pixels[(y - 1) * stride + x] : 0;
      const c = x >= 4 && y > 0 ? pixels[(y - 1) * stride + x - 4] : 0;
      const p = a + b - c;
      const [pa, pb, pc] = [Math.abs(p - a), Math.abs(p - b), Math.abs(p - c)];
      const paeth = pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      const predictor = [0, a, b, (a + b) >> 1, paeth][filter];
      pixels[y * stride + x] = (value + predictor) & 0xff;
    }
  }
  return { width, height, pixels };
}

/** Pixels darker than `threshold` (mean of R, G, B) inside a box. */
export function darkPixels(
  image: { width: number; pixels: Uint8Array },
  box: { x: number; y: number; width: number; height: number },
  threshold = 110,
): number {
  let count = 0;
  for (let y = Math.floor(box.y); y < box.y + box.height; y++)
    for (let x = Math.floor(box.x); x < box.x + box.width; x++) {
      const i = (y * image.width + x) * 4;
      if ((image.pixels[i] + image.pixels[i + 1] + image.pixels[i + 2]) / 3 < threshold) count++;
    }
  return count;
}
