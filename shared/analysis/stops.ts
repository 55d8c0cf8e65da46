// Stops: the sampling unit of a walk. Photos of one walk within the same-stop radius are one stop.
export interface PlacedSighting {
  id: string;
  x: number;
  y: number;
  /** null: found, no number given; 0: an empty stop. */
  count: number | null;
  walk: string;
  accuracyM: number | null;
}

export interface Stop {
  id: string;
  x: number;
  y: number;
  count: number | null;
  found: boolean;
  /** Index into `walks`. */
  walk: number;
  sightingIds: string[];
}

export interface StopMerge {
  stop: string;
  sightingIds: string[];
  count: number | null;
  walk: string;
  /** Largest distance between two merged sightings. */
  spanM: number;
}

export interface StopsResult {
  stops: Stop[];
  walks: string[];
  merges: StopMerge[];
  radiusM: number | null;
  rule: string;
}

/** Default same-stop radius: 5 m, or the positions' stated accuracy where that is larger (our rule). */
export const DEFAULT_STOP_RADIUS_M = 5;

const isFound = (count: number | null) => count === null || count > 0;

/**
 * Merges the sightings of each walk that lie within the same-stop radius of a stop's first sighting (the leader
 * algorithm, Hartigan 1975, in input order), so a stop never spreads wider than twice the radius: photos of every
 * plant along a row stay separate stops instead of chaining into one. radiusM = 0 turns merging off; undefined
 * uses max(5 m, the stated accuracy of either position) per pair.
 */
export function mergeStops(sightings: PlacedSighting[], radiusM?: number): StopsResult {
  const walks = [...new Set(sightings.map((s) => s.walk))];
  const walkIndex = new Map(walks.map((w, i) => [w, i]));
  const n = sightings.length;
  const leaderOf = new Int32Array(n);
  const maxAccuracy = sightings.reduce((m, s) => Math.max(m, s.accuracyM ?? 0), 0);
  const reach = radiusM ?? Math.max(DEFAULT_STOP_RADIUS_M, maxAccuracy);
  // Leaders hashed into square cells of side `reach`, so each sighting looks at nine cells only.
  const cells = new Map<string, number[]>();
  const key = (cx: number, cy: number, walk: string) => `${walk}|${cx}|${cy}`;
  for (let i = 0; i < n; i++) {
    const s = sightings[i];
    leaderOf[i] = i;
    if (!(reach > 0)) continue;
    const cx = Math.floor(s.x / reach);
    const cy = Math.floor(s.y / reach);
    let best = -1;
    let bestD = Infinity;
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) {
        for (const l of cells.get(key(cx + dx, cy + dy, s.walk)) ?? []) {
          const leader = sightings[l];
          const d = Math.hypot(leader.x - s.x, leader.y - s.y);
          const limit = radiusM ?? Math.max(DEFAULT_STOP_RADIUS_M, leader.accuracyM ?? 0, s.accuracyM ?? 0);
          if (d < limit && d < bestD) {
            best = l;
            bestD = d;
          }
        }
      }
    if (best >= 0) leaderOf[i] = best;
    else {
      const k = key(cx, cy, s.walk);
      const list = cells.get(k);
      if (list) list.push(i);
      else cells.set(k, [i]);
    }
  }
  const root = (i: number) => leaderOf[i];
  const groups = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const r = root(i);
    const group = groups.get(r);
    if (group) group.push(i);
    else groups.set(r, [i]);
  }
  const stops: Stop[] = [];
  const merges: StopMerge[] = [];
  for (const members of groups.values()) {
    const first = sightings[members[0]];
    let x = 0;
    let y = 0;
    let sum = 0;
    let numbered = 0;
    let unnumbered = 0;
    for (const k of members) {
      x += sightings[k].x;
      y += sightings[k].y;
      const c = sightings[k].count;
      if (c === null) unnumbered++;
      else {
        numbered++;
        sum += c;
      }
    }
    // A found-without-number photo beside empty ones still marks the stop as found.
    const count = numbered === 0 || (unnumbered > 0 && sum === 0) ? null : sum;
    const ids = members.map((k) => sightings[k].id);
    const stop: Stop = {
      id: ids[0],
      x: x / members.length,
      y: y / members.length,
      count,
      found: isFound(count),
      walk: walkIndex.get(first.walk) as number,
      sightingIds: ids,
    };
    stops.push(stop);
    if (members.length > 1) {
      let span = 0;
      for (const a of members) for (const b of members) span = Math.max(span, Math.hypot(sightings[a].x - sightings[b].x, sightings[a].y - sightings[b].y));
      merges.push({ stop: stop.id, sightingIds: ids, count, walk: first.walk, spanM: span });
    }
  }
  const rule =
    radiusM === 0
      ? 'Same-stop merging is off: every sighting is its own stop.'
      : radiusM !== undefined
        ? `Sightings of one walk closer than ${radiusM} m to a stop's first sighting join that stop (counts summed).`
        : `Sightings of one walk closer than the larger of ${DEFAULT_STOP_RADIUS_M} m and their stated GPS accuracy to a stop's first sighting join that stop (counts summed).`;
  return { stops, walks, merges, radiusM: radiusM ?? reach, rule };
}
