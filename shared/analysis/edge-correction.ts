// Edge-correction weights for second-order statistics in a polygonal field.
import { isInsideField, squaredDistanceToEdge, type PlanarField } from './field-geometry.ts';

const TWO_PI = 2 * Math.PI;

/**
 * Share of the circle of radius r about (cx, cy) that lies inside the field — the reciprocal of
 * Ripley's isotropic edge weight (Ripley 1977). Computed from the entry and exit angles of the circle
 * across each edge: with the interior always left of an edge, inside arc = Σ exits − Σ entries (mod 2π),
 * so no sorting and no point-in-polygon test is needed unless the circle crosses no edge at all.
 * Module-level scratch arrays keep the hot loop allocation-free (each worker thread has its own).
 */
export function circleShareInside(field: PlanarField, cx: number, cy: number, r: number, nearEdges?: Int32Array, nearCount = 0): number {
  const edges = field.edges;
  const r2 = r * r;
  let crossings = 0;
  const total = nearEdges ? nearCount : field.edgeCount;
  for (let e = 0; e < total; e++) {
    const k = (nearEdges ? nearEdges[e] : e) * 4;
    const fx = edges[k] - cx;
    const fy = edges[k + 1] - cy;
    const gx = edges[k + 2] - cx;
    const gy = edges[k + 3] - cy;
    const f2 = fx * fx + fy * fy;
    const g2 = gx * gx + gy * gy;
    // Both ends inside the circle: the segment cannot reach it.
    if (f2 < r2 && g2 < r2) continue;
    const vx = gx - fx;
    const vy = gy - fy;
    const vv = vx * vx + vy * vy;
    const fv = fx * vx + fy * vy;
    const disc = fv * fv - vv * (f2 - r2);
    if (disc <= 0 || vv === 0) continue;
    const root = Math.sqrt(disc);
    for (let s = -1; s <= 1; s += 2) {
      const t = (-fv + s * root) / vv;
      if (t < 0 || t >= 1) continue;
      if (crossings === scratchX.length) growScratch();
      const px = fx + t * vx;
      const py = fy + t * vy;
      scratchX[crossings] = px;
      scratchY[crossings] = py;
      scratchEntry[crossings] = vx * px + vy * py > 0 ? 1 : 0;
      crossings++;
    }
  }
  if (crossings === 0) return isInsideField(field, cx + r, cy) ? 1 : 0;
  if (crossings === 2 && scratchEntry[0] !== scratchEntry[1]) {
    // The common case near a straight side: one atan2 for the arc from the entry to the exit.
    const e = scratchEntry[0] === 1 ? 0 : 1;
    const x = 1 - e;
    let arc = Math.atan2(scratchX[e] * scratchY[x] - scratchY[e] * scratchX[x], scratchX[e] * scratchX[x] + scratchY[e] * scratchY[x]);
    if (arc < 0) arc += TWO_PI;
    return arc / TWO_PI;
  }
  let inside = 0;
  for (let c = 0; c < crossings; c++) {
    let angle = Math.atan2(scratchY[c], scratchX[c]);
    if (angle < 0) angle += TWO_PI;
    inside += scratchEntry[c] === 1 ? -angle : angle;
  }
  if (inside < 0) inside += TWO_PI;
  return inside / TWO_PI;
}

/** Indices of the edges that come within r of (x, y), written to out; returns how many. */
export function edgesWithin(field: PlanarField, x: number, y: number, r: number, out: Int32Array): number {
  const edges = field.edges;
  const r2 = r * r;
  let count = 0;
  for (let e = 0; e < field.edgeCount; e++) {
    if (squaredDistanceToEdge(edges, e * 4, x, y) <= r2) out[count++] = e;
  }
  return count;
}

let scratchX = new Float64Array(64);
let scratchY = new Float64Array(64);
let scratchEntry = new Uint8Array(64);

function growScratch(): void {
  const size = scratchX.length * 2;
  const x = new Float64Array(size);
  const y = new Float64Array(size);
  const entry = new Uint8Array(size);
  x.set(scratchX);
  y.set(scratchY);
  entry.set(scratchEntry);
  scratchX = x;
  scratchY = y;
  scratchEntry = entry;
}
