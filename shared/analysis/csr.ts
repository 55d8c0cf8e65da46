// Complete spatial randomness inside the actual field boundary.
import { isInsideField, type PlanarField } from './field-geometry.ts';
import type { Random } from './random.ts';

/** n points uniform over the field (binomial CSR) by rejection from its bounding box (Diggle 2003). */
export function simulateCsr(field: PlanarField, n: number, random: Random, out = new Float64Array(n * 2)): Float64Array {
  const width = field.maxX - field.minX;
  const height = field.maxY - field.minY;
  let placed = 0;
  while (placed < n) {
    const x = field.minX + random() * width;
    const y = field.minY + random() * height;
    if (isInsideField(field, x, y)) {
      out[placed * 2] = x;
      out[placed * 2 + 1] = y;
      placed++;
    }
  }
  return out;
}
