// Zone labels on the notice maps keep clear of the sighting dots and stay with their zone: checked with turf's
// point-in-polygon and plain circle-to-rectangle distances, on the placement itself and on the e-mailed map's SVG.
import { describe, expect, it } from 'vitest';
import { booleanPointInPolygon, point, polygon } from '@turf/turf';
import type { MultiPolygon, Position } from 'geojson';
import { placeZoneLabels, type Box, type XY } from '../../shared/notices/zone-label-placement.ts';
import { noticeMapSvg } from '../../server/services/notice-map.ts';

/** Distance from a circle's centre to the nearest point of an axis-aligned rectangle (0 inside). */
function centreToRect([x, y]: XY, b: Box) {
  const dx = x < b.x0 ? b.x0 - x : x > b.x1 ? x - b.x1 : 0;
  const dy = y < b.y0 ? b.y0 - y : y > b.y1 ? y - b.y1 : 0;
  return Math.sqrt(dx * dx + dy * dy);
}
const corners = (b: Box): XY[] => [
  [b.x0, b.y0],
  [b.x1, b.y0],
  [b.x1, b.y1],
  [b.x0, b.y1],
];
/** Least distance from a point to a closed ring's edges. */
function toRing([px, py]: XY, ring: XY[]) {
  let best = Infinity;
  for (let i = 0; i < ring.length - 1; i++) {
    const [ax, ay] = ring[i];
    const [bx, by] = ring[i + 1];
    const t = Math.max(0, Math.min(1, ((px - ax) * (bx - ax) + (py - ay) * (by - ay)) / ((bx - ax) ** 2 + (by - ay) ** 2)));
    best = Math.min(best, Math.hypot(px - ax - t * (bx - ax), py - ay - t * (by - ay)));
  }
  return best;
}

const square: XY[] = [
  [0, 0],
  [240, 0],
  [240, 160],
  [0, 160],
  [0, 0],
];
// A tight patch of dots on the square's centroid (120, 80): where a centroid label would sit.
const patch: XY[] = [];
for (let x = 90; x <= 150; x += 10) for (let y = 60; y <= 100; y += 10) patch.push([x, y]);
const RADIUS = 4.5;

describe('zone label placement', () => {
  it('moves a label off dots that cover the zone’s centroid, keeping the box inside the zone', () => {
    const [label] = placeZoneLabels([{ polygons: [[square]], width: 60, height: 22 }], patch, { dotRadius: RADIUS });
    for (const dot of patch) expect(centreToRect(dot, label.box)).toBeGreaterThan(RADIUS);
    const zone = polygon([square]);
    for (const corner of corners(label.box)) expect(booleanPointInPolygon(point(corner), zone)).toBe(true);
    expect(label.inside).toBe(true);
  });

  it('puts the label beside a zone full of dots, touching none, with a leader line into the zone', () => {
    const small: XY[] = [
      [100, 100],
      [160, 100],
      [160, 140],
      [100, 140],
      [100, 100],
    ];
    const crowd: XY[] = [];
    for (let x = 102; x <= 158; x += 8) for (let y = 102; y <= 138; y += 8) crowd.push([x, y]);
    const [label] = placeZoneLabels([{ polygons: [[small]], width: 60, height: 22 }], crowd, { dotRadius: RADIUS });
    for (const dot of crowd) expect(centreToRect(dot, label.box)).toBeGreaterThan(RADIUS);
    expect(label.inside).toBe(false);
    // Next to the zone: the box's nearest corner or edge lies within one label height of the zone's outline.
    const nearest = Math.min(...corners(label.box).map((c) => toRing(c, small)), ...small.map((v) => centreToRect(v, label.box)));
    expect(nearest).toBeLessThanOrEqual(22);
    expect(label.leaderTo).not.toBeNull();
    expect(booleanPointInPolygon(point(label.leaderTo!), polygon([small]))).toBe(true);
  });

  it('keeps two labels apart from each other', () => {
    const left: XY[] = square.map(([x, y]) => [x / 4, y]);
    const right: XY[] = square.map(([x, y]) => [x / 4 + 62, y]);
    const [a, b] = placeZoneLabels(
      [
        { polygons: [[left]], width: 50, height: 20 },
        { polygons: [[right]], width: 50, height: 20 },
      ],
      [],
    );
    const overlap = a.box.x0 < b.box.x1 && b.box.x0 < a.box.x1 && a.box.y0 < b.box.y1 && b.box.y0 < a.box.y1;
    expect(overlap).toBe(false);
  });
});

describe('the e-mailed map image', () => {
  // A 400 m × 250 m field near 44° N, a zone in its middle and sightings heaped on the zone's centre.
  const lon0 = -96.7;
  const lat0 = 44.3;
  const dLon = 400 / (111_320 * Math.cos((lat0 * Math.PI) / 180));
  const dLat = 250 / 110_950;
  const rect = (x0: number, y0: number, x1: number, y1: number): Position[] => [
    [lon0 + x0 * dLon, lat0 + y0 * dLat],
    [lon0 + x1 * dLon, lat0 + y0 * dLat],
    [lon0 + x1 * dLon, lat0 + y1 * dLat],
    [lon0 + x0 * dLon, lat0 + y1 * dLat],
    [lon0 + x0 * dLon, lat0 + y0 * dLat],
  ];
  const boundary: MultiPolygon = { type: 'MultiPolygon', coordinates: [[rect(0, 0, 1, 1)]] };
  const zone: MultiPolygon = { type: 'MultiPolygon', coordinates: [[rect(0.3, 0.3, 0.7, 0.7)]] };
  const sightings: Position[] = [];
  for (let i = -2; i <= 2; i++) for (let j = -2; j <= 2; j++) sightings.push([lon0 + (0.5 + i * 0.015) * dLon, lat0 + (0.5 + j * 0.02) * dLat]);

  it('labels a zone whose centre holds sightings with a box clear of every dot, inside the zone as drawn', () => {
    const svg = noticeMapSvg({ boundary, zones: [{ label: 'Zone 1', geometry: zone }], sightings });
    const box = /class="zone-label" data-box="([^"]+)"/.exec(svg)?.[1].split(',').map(Number);
    expect(box).toHaveLength(4);
    const [x0, y0, x1, y1] = box!;
    const dots = [...svg.matchAll(/<circle cx="([\d.]+)" cy="([\d.]+)" r="3.5"/g)].map((m) => [Number(m[1]), Number(m[2])] as XY);
    expect(dots).toHaveLength(sightings.length);
    for (const dot of dots) expect(centreToRect(dot, { x0, y0, x1, y1 })).toBeGreaterThan(3.5);
    // The zone's outline as drawn: the second path (after the field's) holds its pixel ring.
    const zonePath = [...svg.matchAll(/<path d="M([^"Z]+)Z"/g)][1][1];
    const ring = zonePath.split('L').map((pair) => pair.split(',').map(Number) as XY);
    const drawn = polygon([[...ring, ring[0]]]);
    for (const corner of corners({ x0, y0, x1, y1 })) expect(booleanPointInPolygon(point(corner), drawn)).toBe(true);
    // The label is drawn with a halo under its text.
    expect(svg).toMatch(/<text [^>]*stroke="#ffffff"[^>]*>Zone 1<\/text><text [^>]*>Zone 1<\/text>/);
  });
});
