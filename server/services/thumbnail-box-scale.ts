// Hand-written because neither jimp nor @jsquash/jpeg offers a fast integer prescale of a decoded bitmap.

export interface RgbaBitmap {
  data: Uint8Array | Uint8ClampedArray;
  width: number;
  height: number;
}

/**
 * Shrinks an RGBA bitmap by a whole factor, each output pixel the mean of its factor × factor box (edge boxes
 * average the pixels they have), so a 12 MP photo is cut down in one pass before jimp's finer resize.
 */
export function boxScaleDown(source: RgbaBitmap, factor: number): RgbaBitmap {
  const k = Math.floor(factor);
  if (k < 2) return source;
  const { data, width, height } = source;
  const outWidth = Math.ceil(width / k);
  const outHeight = Math.ceil(height / k);
  const out = new Uint8Array(outWidth * outHeight * 4);
  const sums = new Uint32Array(outWidth * 4);
  const lastColumns = width - (outWidth - 1) * k;
  for (let oy = 0; oy < outHeight; oy++) {
    sums.fill(0);
    const yEnd = Math.min(height, (oy + 1) * k);
    for (let y = oy * k; y < yEnd; y++) {
      let i = y * width * 4;
      for (let ox = 0, s = 0; ox < outWidth; ox++, s += 4) {
        const columns = ox === outWidth - 1 ? lastColumns : k;
        let r = 0;
        let g = 0;
        let b = 0;
        let a = 0;
        for (let c = 0; c < columns; c++, i += 4) {
          r += data[i];
          g += data[i + 1];
          b += data[i + 2];
          a += data[i + 3];
        }
        sums[s] += r;
        sums[s + 1] += g;
        sums[s + 2] += b;
        sums[s + 3] += a;
      }
    }
    const rows = yEnd - oy * k;
    let o = oy * outWidth * 4;
    for (let ox = 0, s = 0; ox < outWidth; ox++, s += 4, o += 4) {
      const count = rows * (ox === outWidth - 1 ? lastColumns : k);
      const half = count >> 1;
      out[o] = ((sums[s] + half) / count) | 0;
      out[o + 1] = ((sums[s + 1] + half) / count) | 0;
      out[o + 2] = ((sums[s + 2] + half) / count) | 0;
      out[o + 3] = ((sums[s + 3] + half) / count) | 0;
    }
  }
  return { data: out, width: outWidth, height: outHeight };
}
