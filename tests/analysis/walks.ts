// Scouting walks and labellings for the stops-design tests and the size-and-power script (planar metres).
// Random numbers come from mulberry32 (Tommy Ettinger's public-domain generator), not the engine's own
// generator, so the calibration does not lean on the code it checks.

export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Stops every `spacing` metres along a polyline, `count` of them (the path is walked until they are placed). */
export function stopsAlong(path: [number, number][], spacing: number, count: number): [number, number][] {
  const out: [number, number][] = [];
  let carried = 0;
  for (let s = 0; s + 1 < path.length && out.length < count; s++) {
    const [x0, y0] = path[s];
    const [x1, y1] = path[s + 1];
    const length = Math.hypot(x1 - x0, y1 - y0);
    let at = carried;
    while (at <= length && out.length < count) {
      out.push([x0 + ((x1 - x0) * at) / length, y0 + ((y1 - y0) * at) / length]);
      at += spacing;
    }
    carried = at - length;
  }
  return out;
}

export const SQUARE_KM: [number, number][] = [
  [0, 0],
  [1000, 0],
  [1000, 1000],
  [0, 1000],
  [0, 0],
];

/** A W across a 1 km square field (common scouting practice), 160 stops 20 m apart. */
export function wWalk(count = 160, spacing = 20): [number, number][] {
  return stopsAlong(
    [
      [60, 940],
      [280, 60],
      [500, 940],
      [720, 60],
      [940, 940],
    ],
    spacing,
    count,
  );
}

/** A zigzag of six legs across the field. */
export function zigzagWalk(count = 160, spacing = 20): [number, number][] {
  return stopsAlong(
    [
      [50, 50],
      [950, 210],
      [50, 370],
      [950, 530],
      [50, 690],
      [950, 850],
      [50, 990],
    ],
    spacing,
    count,
  );
}

/** Along the headland only: a loop 30 m inside the boundary. */
export function headlandWalk(count = 160, spacing = 20): [number, number][] {
  return stopsAlong(
    [
      [30, 30],
      [970, 30],
      [970, 970],
      [30, 970],
      [30, 30],
    ],
    spacing,
    count,
  );
}

/** Found at a random `share` of the stops (exactly round(share·n) of them). */
export function randomLabels(n: number, share: number, random: () => number): boolean[] {
  const k = Math.round(share * n);
  const index = Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [index[i], index[j]] = [index[j], index[i]];
  }
  const labels = new Array(n).fill(false);
  for (let t = 0; t < k; t++) labels[index[t]] = true;
  return labels;
}

/**
 * One patch: the 10 % of stops nearest a random stop hold the pest with probability `inside`, the other
 * stops with probability `outside`.
 */
export function patchLabels(stops: [number, number][], random: () => number, share = 0.1, inside = 0.8, outside = 0.1): boolean[] {
  const centre = stops[Math.floor(random() * stops.length)];
  const order = stops.map((s, i) => [Math.hypot(s[0] - centre[0], s[1] - centre[1]), i] as const).sort((a, b) => a[0] - b[0]);
  const inPatch = new Set(order.slice(0, Math.round(share * stops.length)).map(([, i]) => i));
  return stops.map((_, i) => random() < (inPatch.has(i) ? inside : outside));
}

export function stopsCollection(stops: [number, number][], labels: boolean[], walk = 'w1') {
  return {
    type: 'FeatureCollection' as const,
    features: stops.map(([x, y], i) => ({
      type: 'Feature' as const,
      properties: { id: `stop${i + 1}`, count: labels[i] ? 1 : 0, walk },
      geometry: { type: 'Point' as const, coordinates: [x, y] },
    })),
  };
}

export const squareField = { type: 'Polygon' as const, coordinates: [SQUARE_KM] };
