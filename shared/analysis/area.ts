// Study-area figures: the boundary itself, and the sightings' bounding rectangle and convex hull beside it,
// because every density-based statistic is sensitive to which area is used.
import type { PlanarField, Ring } from './field-geometry.ts';

export type AreaBasis = 'boundary' | 'bbox' | 'hull' | 'custom';

export interface AreaFigures {
  boundaryM2: number;
  perimeterM: number;
  /** Bounding rectangle of the sightings. */
  boundingBoxM2: number;
  /** Convex hull of the sightings. */
  convexHullM2: number;
  usedM2: number;
  basis: AreaBasis;
}

/** Signed area of a ring by the shoelace formula (Gauss); positive when counter-clockwise. */
export function ringSignedArea(ring: Ring): number {
  let sum = 0;
  const m = ring.length;
  for (let i = 0; i < m; i += 2) {
    const j = (i + 2) % m;
    sum += ring[i] * ring[j + 1] - ring[j] * ring[i + 1];
  }
  return sum / 2;
}

/** Area inside the field: outer rings minus holes, summed over parts. */
export function fieldAreaM2(field: PlanarField): number {
  let total = 0;
  for (const polygon of field.polygons) {
    polygon.forEach((ring, index) => {
      const a = Math.abs(ringSignedArea(ring));
      total += index === 0 ? a : -a;
    });
  }
  return total;
}

/** Boundary length including holes: the edge along which Donnelly's correction applies. */
export function fieldPerimeterM(field: PlanarField): number {
  let total = 0;
  const edges = field.edges;
  for (let k = 0; k < field.edgeCount * 4; k += 4) total += Math.hypot(edges[k + 2] - edges[k], edges[k + 3] - edges[k + 1]);
  return total;
}

/** Convex hull by Andrew's monotone chain (Andrew 1979); returns the hull as a ring. */
export function convexHull(xy: Float64Array): Ring {
  const n = xy.length / 2;
  const order = Array.from({ length: n }, (_, i) => i).sort((a, b) => xy[a * 2] - xy[b * 2] || xy[a * 2 + 1] - xy[b * 2 + 1]);
  const cross = (o: number, a: number, b: number) =>
    (xy[a * 2] - xy[o * 2]) * (xy[b * 2 + 1] - xy[o * 2 + 1]) - (xy[a * 2 + 1] - xy[o * 2 + 1]) * (xy[b * 2] - xy[o * 2]);
  const lower: number[] = [];
  for (const i of order) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], i) <= 0) lower.pop();
    lower.push(i);
  }
  const upper: number[] = [];
  for (let k = order.length - 1; k >= 0; k--) {
    const i = order[k];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], i) <= 0) upper.pop();
    upper.push(i);
  }
  const hull = lower.slice(0, -1).concat(upper.slice(0, -1));
  const ring = new Float64Array(hull.length * 2);
  hull.forEach((i, k) => {
    ring[k * 2] = xy[i * 2];
    ring[k * 2 + 1] = xy[i * 2 + 1];
  });
  return ring;
}

export function boundingBoxAreaM2(xy: Float64Array): number {
  if (xy.length < 4) return 0;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < xy.length; i += 2) {
    if (xy[i] < minX) minX = xy[i];
    if (xy[i] > maxX) maxX = xy[i];
    if (xy[i + 1] < minY) minY = xy[i + 1];
    if (xy[i + 1] > maxY) maxY = xy[i + 1];
  }
  return (maxX - minX) * (maxY - minY);
}

/** All area figures for a field and its sightings, with the one the tests will use. */
export function areaFigures(field: PlanarField, xy: Float64Array, basis: AreaBasis = 'boundary', customAreaM2?: number): AreaFigures {
  const boundaryM2 = fieldAreaM2(field);
  const boundingBoxM2 = boundingBoxAreaM2(xy);
  const convexHullM2 = xy.length >= 6 ? Math.abs(ringSignedArea(convexHull(xy))) : 0;
  const used = { boundary: boundaryM2, bbox: boundingBoxM2, hull: convexHullM2, custom: customAreaM2 ?? boundaryM2 }[basis];
  return { boundaryM2, perimeterM: fieldPerimeterM(field), boundingBoxM2, convexHullM2, usedM2: used, basis };
}
