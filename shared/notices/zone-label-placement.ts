// Where each zone's label goes on a map, in the map's own planar units (pixels): inside the zone at the point
// farthest from the sighting dots and the zone's edges (starting from polylabel's pole of inaccessibility), or,
// when no box fits inside clear of the dots, just beside the zone with a leader line back to it.
import polylabel from 'polylabel';

export type XY = [number, number];
/** One polygon: outer ring first, holes after; each ring a closed or open list of points. */
export type PolygonRings = XY[][];

export interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

export interface LabelToPlace {
  /** The zone's polygons (a MultiPolygon's parts). */
  polygons: PolygonRings[];
  width: number;
  height: number;
}

export interface PlacedLabel {
  centre: XY;
  box: Box;
  /** True when the box lies wholly inside the zone. */
  inside: boolean;
  /** For a label beside its zone: the point inside the zone the leader line runs to. */
  leaderTo: XY | null;
}

export interface PlacementOptions {
  /** Radius of a sighting dot, including its outline. */
  dotRadius?: number;
  /** Free space kept between a label and any dot or other label. */
  gap?: number;
  /** Keep labels inside this frame (the map's drawing area) when given. */
  frame?: Box;
}

const boxAt = ([x, y]: XY, width: number, height: number): Box => ({ x0: x - width / 2, y0: y - height / 2, x1: x + width / 2, y1: y + height / 2 });

/** Distance from a point to a box (0 inside it). */
export function pointBoxDistance([x, y]: XY, b: Box) {
  const dx = Math.max(b.x0 - x, 0, x - b.x1);
  const dy = Math.max(b.y0 - y, 0, y - b.y1);
  return Math.hypot(dx, dy);
}

const boxesOverlap = (a: Box, b: Box, gap: number) => a.x0 < b.x1 + gap && b.x0 < a.x1 + gap && a.y0 < b.y1 + gap && b.y0 < a.y1 + gap;

function pointSegmentDistance([px, py]: XY, [ax, ay]: XY, [bx, by]: XY) {
  const dx = bx - ax;
  const dy = by - ay;
  const length2 = dx * dx + dy * dy;
  const t = length2 === 0 ? 0 : Math.max(0, Math.min(1, ((px - ax) * dx + (py - ay) * dy) / length2));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

/** Whether segment a–b crosses or touches the box (Liang–Barsky clipping). */
function segmentHitsBox([ax, ay]: XY, [bx, by]: XY, b: Box) {
  let t0 = 0;
  let t1 = 1;
  const dx = bx - ax;
  const dy = by - ay;
  const edges: Array<[number, number]> = [
    [-dx, ax - b.x0],
    [dx, b.x1 - ax],
    [-dy, ay - b.y0],
    [dy, b.y1 - ay],
  ];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
    } else {
      const t = q / p;
      if (p < 0) t0 = Math.max(t0, t);
      else t1 = Math.min(t1, t);
      if (t0 > t1) return false;
    }
  }
  return true;
}

/** Distance from a segment to a box: 0 when they touch, else the least of the end points' and the box corners' distances. */
function segmentBoxDistance(a: XY, c: XY, b: Box) {
  if (segmentHitsBox(a, c, b)) return 0;
  const corners: XY[] = [
    [b.x0, b.y0],
    [b.x1, b.y0],
    [b.x1, b.y1],
    [b.x0, b.y1],
  ];
  return Math.min(pointBoxDistance(a, b), pointBoxDistance(c, b), ...corners.map((p) => pointSegmentDistance(p, a, c)));
}

/** Even-odd point-in-polygon over every ring (holes included). */
export function insidePolygon([x, y]: XY, rings: PolygonRings) {
  let inside = false;
  for (const ring of rings) {
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [xi, yi] = ring[i];
      const [xj, yj] = ring[j];
      if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
    }
  }
  return inside;
}

const segmentsOf = (polygons: PolygonRings[]) =>
  polygons.flatMap((rings) => rings.flatMap((ring) => ring.map((p, i) => [p, ring[(i + 1) % ring.length]] as [XY, XY])));

/** Distance from the box to the nearest edge of the zone. */
const edgeClearance = (b: Box, segments: Array<[XY, XY]>) => Math.min(Infinity, ...segments.map(([a, c]) => segmentBoxDistance(a, c, b)));

/** The largest polygon part by area: where a label belongs. */
function largestPart(polygons: PolygonRings[]) {
  const area = (ring: XY[]) => Math.abs(ring.reduce((s, [x, y], i) => s + x * ring[(i + 1) % ring.length][1] - ring[(i + 1) % ring.length][0] * y, 0)) / 2;
  return polygons.reduce((best, p) => (area(p[0]) > area(best[0]) ? p : best));
}

function bboxOf(rings: PolygonRings): Box {
  const xs = rings[0].map((p) => p[0]);
  const ys = rings[0].map((p) => p[1]);
  return { x0: Math.min(...xs), y0: Math.min(...ys), x1: Math.max(...xs), y1: Math.max(...ys) };
}

/** Candidate centres on a grid over a box, at most about 48 × 48 of them. */
function grid(b: Box, step: number): XY[] {
  const sx = Math.max(step, (b.x1 - b.x0) / 48);
  const sy = Math.max(step, (b.y1 - b.y0) / 48);
  const points: XY[] = [];
  for (let y = b.y0; y <= b.y1 + 1e-9; y += sy) for (let x = b.x0; x <= b.x1 + 1e-9; x += sx) points.push([x, y]);
  return points;
}

/**
 * Places each zone's label in turn; labels already placed are kept clear of like the dots.
 * Inside: among the pole of inaccessibility (Garcia-Castellanos & Lombardo 2007, through mapbox's polylabel) and a
 * grid of points, the box wholly inside the zone whose nearest dot or edge is farthest away. Beside: the nearest
 * box clear of every dot, label and other zone, with a leader line to the pole.
 */
export function placeZoneLabels(labels: LabelToPlace[], dots: XY[], options: PlacementOptions = {}): PlacedLabel[] {
  const dotRadius = options.dotRadius ?? 4.5;
  const gap = options.gap ?? 2;
  const placed: PlacedLabel[] = [];
  const allZones = labels.map((l) => l.polygons);
  const withinFrame = (b: Box) =>
    !options.frame || (b.x0 >= options.frame.x0 && b.y0 >= options.frame.y0 && b.x1 <= options.frame.x1 && b.y1 <= options.frame.y1);
  const dotClearance = (b: Box) => Math.min(Infinity, ...dots.map((d) => pointBoxDistance(d, b) - dotRadius));
  const clearOfLabels = (b: Box) => placed.every((p) => !boxesOverlap(p.box, b, gap));

  for (const [index, label] of labels.entries()) {
    const part = largestPart(label.polygons);
    const pole = polylabel(part, 0.5) as XY;
    const segments = segmentsOf(label.polygons);
    const { width, height } = label;
    const fitsInside = (c: XY) => {
      const b = boxAt(c, width, height);
      const corners: XY[] = [
        [b.x0, b.y0],
        [b.x1, b.y0],
        [b.x1, b.y1],
        [b.x0, b.y1],
      ];
      return corners.every((p) => insidePolygon(p, part)) && edgeClearance(b, segmentsOf([part])) > 0;
    };
    // Clearance is capped at one label height: beyond that a label is plainly clear, and closeness to the pole decides.
    const cap = height;
    let best: { centre: XY; score: number } | null = null;
    for (const centre of [pole, ...grid(bboxOf(part), Math.min(width, height) / 3)]) {
      if (!fitsInside(centre)) continue;
      const b = boxAt(centre, width, height);
      if (!withinFrame(b) || !clearOfLabels(b)) continue;
      const clearance = Math.min(dotClearance(b), edgeClearance(b, segments));
      if (clearance < gap) continue;
      const score = Math.min(clearance, cap) - 0.001 * Math.hypot(centre[0] - pole[0], centre[1] - pole[1]);
      if (!best || score > best.score) best = { centre, score };
    }
    if (best) {
      placed.push({ centre: best.centre, box: boxAt(best.centre, width, height), inside: true, leaderTo: null });
      continue;
    }
    // Beside the zone: candidates on a grid around it, the nearest to the pole that keeps clear of dots, labels and other zones.
    const around = bboxOf(part);
    const reach = Math.max(width, height) * 2.5;
    const ring = { x0: around.x0 - reach, y0: around.y0 - reach, x1: around.x1 + reach, y1: around.y1 + reach };
    const otherSegments = segmentsOf(allZones.filter((_, i) => i !== index).flat());
    let beside: { centre: XY; distance: number } | null = null;
    for (const centre of grid(ring, Math.min(width, height) / 2)) {
      const b = boxAt(centre, width, height);
      if (!withinFrame(b) || !clearOfLabels(b) || dotClearance(b) < gap) continue;
      if (pointBoxDistance(pole, b) === 0) continue;
      if (otherSegments.length && edgeClearance(b, otherSegments) < gap) continue;
      const distance = pointBoxDistance(pole, b);
      if (!beside || distance < beside.distance) beside = { centre, distance };
    }
    const centre = beside?.centre ?? pole;
    placed.push({ centre, box: boxAt(centre, width, height), inside: false, leaderTo: beside ? pole : null });
  }
  return placed;
}

/** The point on a box's outline nearest to a point: where a leader line leaves the label. */
export function boxEdgePointToward(b: Box, [x, y]: XY): XY {
  return [Math.max(b.x0, Math.min(b.x1, x)), Math.max(b.y0, Math.min(b.y1, y))];
}

/** A label box's size for text of a given length, generous for bold sans-serif faces. */
export function labelSize(text: string, fontSize: number, padding = 4) {
  return { width: Math.ceil(text.length * fontSize * 0.66 + 2 * padding), height: Math.ceil(fontSize * 1.3 + padding) };
}
