// The field boundary in planar metres, with the indexes the tests need for fast point-in-field checks.
// Hand-written rather than turf's booleanPointInPolygon: a quadrat or CSR pass asks this question
// millions of times, and a horizontal-strip edge index keeps each answer to a handful of edge tests.

/** One ring as interleaved x,y pairs in metres, without the closing duplicate vertex. */
export type Ring = Float64Array;
/** Outer ring first, then holes. */
export type PlanarPolygon = Ring[];

export interface PlanarField {
  polygons: PlanarPolygon[];
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
  /** Every ring edge as x0,y0,x1,y1 quadruples. */
  edges: Float64Array;
  edgeCount: number;
  stripCount: number;
  stripHeight: number;
  stripOffsets: Uint32Array;
  stripEdges: Uint32Array;
}

/** Builds the field from rings given as [x, y] pairs (closing vertex optional). */
export function createPlanarField(polygons: number[][][][]): PlanarField {
  // Outer rings counter-clockwise, holes clockwise: the field's interior is always left of an edge.
  const rings: PlanarPolygon[] = polygons.map((polygon) => polygon.map((ring, index) => orient(toRing(ring), index === 0)));
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  let edgeCount = 0;
  for (const polygon of rings) {
    for (const ring of polygon) {
      edgeCount += ring.length / 2;
      for (let i = 0; i < ring.length; i += 2) {
        if (ring[i] < minX) minX = ring[i];
        if (ring[i] > maxX) maxX = ring[i];
        if (ring[i + 1] < minY) minY = ring[i + 1];
        if (ring[i + 1] > maxY) maxY = ring[i + 1];
      }
    }
  }
  const edges = new Float64Array(edgeCount * 4);
  let e = 0;
  for (const polygon of rings) {
    for (const ring of polygon) {
      const m = ring.length;
      for (let i = 0; i < m; i += 2) {
        const j = (i + 2) % m;
        edges[e++] = ring[i];
        edges[e++] = ring[i + 1];
        edges[e++] = ring[j];
        edges[e++] = ring[j + 1];
      }
    }
  }
  const stripCount = Math.max(1, Math.min(4096, edgeCount * 2));
  const stripHeight = (maxY - minY) / stripCount || 1;
  const counts = new Uint32Array(stripCount + 1);
  const stripRange = (k: number): [number, number] => {
    const y0 = Math.min(edges[k * 4 + 1], edges[k * 4 + 3]);
    const y1 = Math.max(edges[k * 4 + 1], edges[k * 4 + 3]);
    const s0 = Math.max(0, Math.min(stripCount - 1, Math.floor((y0 - minY) / stripHeight)));
    const s1 = Math.max(0, Math.min(stripCount - 1, Math.floor((y1 - minY) / stripHeight)));
    return [s0, s1];
  };
  for (let k = 0; k < edgeCount; k++) {
    const [s0, s1] = stripRange(k);
    for (let s = s0; s <= s1; s++) counts[s + 1]++;
  }
  for (let s = 0; s < stripCount; s++) counts[s + 1] += counts[s];
  const stripOffsets = counts.slice();
  const fill = counts.slice();
  const stripEdges = new Uint32Array(stripOffsets[stripCount]);
  for (let k = 0; k < edgeCount; k++) {
    const [s0, s1] = stripRange(k);
    for (let s = s0; s <= s1; s++) stripEdges[fill[s]++] = k;
  }
  return { polygons: rings, minX, minY, maxX, maxY, edges, edgeCount, stripCount, stripHeight, stripOffsets, stripEdges };
}

function toRing(coordinates: number[][]): Ring {
  let m = coordinates.length;
  const first = coordinates[0];
  const last = coordinates[m - 1];
  if (m > 1 && first[0] === last[0] && first[1] === last[1]) m -= 1;
  const ring = new Float64Array(m * 2);
  for (let i = 0; i < m; i++) {
    ring[i * 2] = coordinates[i][0];
    ring[i * 2 + 1] = coordinates[i][1];
  }
  return ring;
}

function orient(ring: Ring, counterClockwise: boolean): Ring {
  let twiceArea = 0;
  const m = ring.length;
  for (let i = 0; i < m; i += 2) {
    const j = (i + 2) % m;
    twiceArea += ring[i] * ring[j + 1] - ring[j] * ring[i + 1];
  }
  if (twiceArea > 0 === counterClockwise) return ring;
  const reversed = new Float64Array(m);
  for (let i = 0; i < m; i += 2) {
    reversed[i] = ring[m - 2 - i];
    reversed[i + 1] = ring[m - 1 - i];
  }
  return reversed;
}

/** Even–odd crossing test (Shimrat 1962) against the edges of the point's strip only. */
export function isInsideField(field: PlanarField, x: number, y: number): boolean {
  if (x < field.minX || x > field.maxX || y < field.minY || y > field.maxY) return false;
  let s = Math.floor((y - field.minY) / field.stripHeight);
  if (s >= field.stripCount) s = field.stripCount - 1;
  const edges = field.edges;
  const list = field.stripEdges;
  let inside = false;
  for (let p = field.stripOffsets[s], end = field.stripOffsets[s + 1]; p < end; p++) {
    const k = list[p] * 4;
    const y0 = edges[k + 1];
    const y1 = edges[k + 3];
    if (y0 > y !== y1 > y) {
      const x0 = edges[k];
      if (x < x0 + ((y - y0) * (edges[k + 2] - x0)) / (y1 - y0)) inside = !inside;
    }
  }
  return inside;
}

/** Squared distance from (x, y) to the edge stored at edges[k..k+3] (ax, ay, bx, by). */
export function squaredDistanceToEdge(edges: Float64Array, k: number, x: number, y: number): number {
  const ax = edges[k];
  const ay = edges[k + 1];
  const dx = edges[k + 2] - ax;
  const dy = edges[k + 3] - ay;
  const len2 = dx * dx + dy * dy;
  let t = len2 > 0 ? ((x - ax) * dx + (y - ay) * dy) / len2 : 0;
  if (t < 0) t = 0;
  else if (t > 1) t = 1;
  const ex = ax + t * dx - x;
  const ey = ay + t * dy - y;
  return ex * ex + ey * ey;
}

/** Distance from a point to the nearest boundary edge (outer ring or hole). */
export function distanceToBoundary(field: PlanarField, x: number, y: number): number {
  const edges = field.edges;
  let best = Infinity;
  for (let k = 0; k < field.edgeCount * 4; k += 4) {
    const d2 = squaredDistanceToEdge(edges, k, x, y);
    if (d2 < best) best = d2;
  }
  return Math.sqrt(best);
}

/** The field's rings back as GeoJSON-style coordinates (closed rings), e.g. to send to a worker. */
export function fieldToCoordinates(field: PlanarField): number[][][][] {
  return field.polygons.map((polygon) =>
    polygon.map((ring) => {
      const out: number[][] = [];
      for (let i = 0; i < ring.length; i += 2) out.push([ring[i], ring[i + 1]]);
      out.push([ring[0], ring[1]]);
      return out;
    }),
  );
}

/**
 * A point on or just outside the boundary moved onto it, a centimetre inside (interior lies left of each
 * edge); null when it is farther out than the tolerance. Keeps headland photos that GPS error put outside.
 */
export function snapInsideField(field: PlanarField, x: number, y: number, toleranceM: number): [number, number] | null {
  if (isInsideField(field, x, y)) return [x, y];
  const edges = field.edges;
  let best = Infinity;
  let bestK = -1;
  for (let k = 0; k < field.edgeCount * 4; k += 4) {
    const d2 = squaredDistanceToEdge(edges, k, x, y);
    if (d2 < best) {
      best = d2;
      bestK = k;
    }
  }
  if (bestK < 0 || Math.sqrt(best) > toleranceM) return null;
  const ax = edges[bestK];
  const ay = edges[bestK + 1];
  const dx = edges[bestK + 2] - ax;
  const dy = edges[bestK + 3] - ay;
  const len = Math.hypot(dx, dy) || 1;
  const t = Math.min(1, Math.max(0, ((x - ax) * dx + (y - ay) * dy) / (len * len)));
  for (const step of [0.01, 0.1, 0.5]) {
    const px = ax + t * dx - (dy / len) * step;
    const py = ay + t * dy + (dx / len) * step;
    if (isInsideField(field, px, py)) return [px, py];
  }
  return null;
}
