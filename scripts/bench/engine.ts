// Engine benchmark: our pattern-check figures against turf on the same generated data, and the engine's
// heavy passes at the sizes the targets name. Prints a table; never asserts a time.
import { nearestNeighborAnalysis, point, featureCollection, polygon } from '@turf/turf';
import { availableParallelism } from 'node:os';
import { fieldAreaM2, fieldPerimeterM } from '../../shared/analysis/area.ts';
import { simulateCsr } from '../../shared/analysis/csr.ts';
import { densitySurface } from '../../shared/analysis/density.ts';
import { createPlanarField, fieldToCoordinates, isInsideField, type PlanarField } from '../../shared/analysis/field-geometry.ts';
import { nearestNeighbourTest } from '../../shared/analysis/nearest-neighbour.ts';
import { nearestNeighbourDistances } from '../../shared/analysis/nearest-neighbour-index.ts';
import { createMonteCarloPool } from '../../server/services/monte-carlo/monte-carlo-pool.ts';
import { utmProjectionFor } from '../../shared/analysis/projection.ts';
import { quadratTest } from '../../shared/analysis/quadrat.ts';
import { createRandom } from '../../shared/analysis/random.ts';
import { defaultRipleyRadii } from '../../shared/analysis/ripley.ts';
import type { BenchTable } from './table.ts';

const LON0 = -96.7;
const LAT0 = 40.8;

/** An irregular field of the given area: a wobbly 24-gon, aspect about 3:2. */
function irregularField(areaHa: number): PlanarField {
  const ring: number[][] = [];
  for (let k = 0; k < 24; k++) {
    const angle = (2 * Math.PI * k) / 24;
    const wobble = 1 + 0.18 * Math.sin(3 * angle) + 0.08 * Math.cos(5 * angle);
    ring.push([1.5 * wobble * Math.cos(angle), wobble * Math.sin(angle)]);
  }
  ring.push(ring[0]);
  const unit = fieldAreaM2(createPlanarField([[ring]]));
  const scale = Math.sqrt((areaHa * 10_000) / unit);
  return createPlanarField([[ring.map(([x, y]) => [x * scale + 2000, y * scale + 2000])]]);
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

function time<T>(work: () => T): { ms: number; value: T } {
  const started = performance.now();
  const value = work();
  return { ms: performance.now() - started, value };
}

function medianTime(work: () => unknown, runs: number): number {
  work();
  return median(Array.from({ length: runs }, () => time(work).ms));
}

const ms = (value: number) => (value >= 1000 ? `${(value / 1000).toFixed(2)} s` : `${value.toFixed(1)} ms`);

export async function run(): Promise<BenchTable> {
  const rows: BenchTable['rows'] = [];
  const random = createRandom('bench');
  const field = irregularField(40);
  const area = fieldAreaM2(field);
  const perimeter = fieldPerimeterM(field);

  // Nearest-neighbour test against turf, on lon/lat points in a field around (LON0, LAT0).
  const projection = utmProjectionFor(LON0, LAT0);
  const [ex, ey] = projection.forward(LON0, LAT0);
  const toLonLat = (x: number, y: number) => projection.inverse(ex + x, ey + y);
  const studyArea = polygon(fieldToCoordinates(field)[0].map((ring) => ring.map(([x, y]) => toLonLat(x, y))));
  const skip20k = process.env.BENCH_SKIP_TURF_20K === '1';
  for (const n of [1000, 5000, 20000]) {
    const xy = simulateCsr(field, n, random);
    const lonLat = Array.from({ length: n }, (_, i) => toLonLat(xy[i * 2], xy[i * 2 + 1]));
    const ours = () => {
      const projected = new Float64Array(n * 2);
      for (let i = 0; i < n; i++) {
        const [x, y] = projection.forward(lonLat[i][0], lonLat[i][1]);
        projected[i * 2] = x;
        projected[i * 2 + 1] = y;
      }
      return nearestNeighbourTest(projected, area, perimeter);
    };
    const oursMs = medianTime(ours, 5);
    const result = ours();
    if (n === 20000 && skip20k) {
      rows.push({
        case: `nearest-neighbour test, n = ${n}`,
        ours: ms(oursMs),
        reference: 'skipped (BENCH_SKIP_TURF_20K=1)',
        ratio: '',
        target: '≥ 1000× faster than turf',
        agreement: '',
      });
      continue;
    }
    const points = featureCollection(lonLat.map((c) => point(c)));
    const turfRun = time(() => nearestNeighborAnalysis(points, { studyArea, units: 'meters' }));
    // turf's type omits nearestNeighborIndex, which its result does carry.
    const turf = turfRun.value.properties.nearestNeighborAnalysis as unknown as { nearestNeighborIndex: number };
    rows.push({
      case: `nearest-neighbour test, n = ${n}`,
      ours: ms(oursMs),
      reference: `turf ${ms(turfRun.ms)}`,
      ratio: `${Math.round(turfRun.ms / oursMs)}×`,
      target: n === 20000 ? '≥ 1000× faster than turf' : '',
      agreement: `R ${result.R.toFixed(4)} vs ${turf.nearestNeighborIndex.toFixed(4)}`,
    });
  }

  const big = simulateCsr(field, 100_000, random);
  rows.push({
    case: 'nearest-neighbour pass, n = 100,000',
    ours: ms(medianTime(() => nearestNeighbourDistances(big), 7)),
    reference: 'compiled ≈ 45 ms; plain JS k-d tree ≈ 110 ms',
    ratio: '',
    target: '≤ 50 ms',
    agreement: '',
  });

  const pool = createMonteCarloPool();
  try {
    const coordinates = fieldToCoordinates(field);
    await pool.run({ fieldCoordinates: coordinates, n: 100, seed: 0, simulations: 8, nearestNeighbour: true, ripley: null });
    for (const n of [200, 1000]) {
      const started = performance.now();
      await pool.run({ fieldCoordinates: coordinates, n, seed: 'bench', simulations: 999, nearestNeighbour: true, ripley: null });
      rows.push({
        case: `Monte Carlo nearest-neighbour, 999 simulations, n = ${n}`,
        ours: ms(performance.now() - started),
        reference: '',
        ratio: '',
        target: '',
        agreement: `${pool.threads} worker threads`,
      });
    }
    for (const n of [200, 1000]) {
      const started = performance.now();
      await pool.run({
        fieldCoordinates: coordinates,
        n,
        seed: 'bench',
        simulations: 999,
        nearestNeighbour: false,
        ripley: { radiiM: defaultRipleyRadii(field), correction: 'isotropic', areaM2: area },
      });
      rows.push({
        case: `Ripley K envelope (isotropic), 999 simulations, n = ${n}`,
        ours: ms(performance.now() - started),
        reference: n === 1000 ? 'compiled, 1 thread ≈ 3.9 s' : '',
        ratio: '',
        target: n === 1000 ? '≤ 2 s' : '',
        agreement: `${pool.threads} worker threads, 20 radii`,
      });
    }
  } finally {
    await pool.close();
  }

  // Quadrat test: 100,000 sightings checked against the field by the point-in-field index, then binned into clipped cells.
  const sightingsXY = simulateCsr(field, 100_000, random);
  const quadratRun = () => {
    const inside = new Float64Array(sightingsXY.length);
    let kept = 0;
    for (let i = 0; i < sightingsXY.length; i += 2) {
      if (!isInsideField(field, sightingsXY[i], sightingsXY[i + 1])) continue;
      inside[kept++] = sightingsXY[i];
      inside[kept++] = sightingsXY[i + 1];
    }
    return quadratTest(field, inside.subarray(0, kept), area);
  };
  const quadrat = quadratRun();
  rows.push({
    case: 'quadrat test, 100,000 points, irregular 40 ha field',
    ours: ms(medianTime(quadratRun, 5)),
    reference: 'compiled ≈ 0.45 s',
    ratio: '',
    target: '≤ 0.4 s',
    agreement: `${quadrat.cells.length} clipped cells, χ² ${quadrat.chiSquare.toFixed(0)} on ${quadrat.df} df`,
  });

  const field50 = irregularField(50);
  const dense = simulateCsr(field50, 100_000, random);
  const densityRun = time(() => densitySurface(field50, dense, { cellSizeM: 2 }));
  rows.push({
    case: 'kernel density, 100,000 points, 50 ha, 2 m cells',
    ours: ms(densityRun.ms),
    reference: '',
    ratio: '',
    target: '',
    agreement: `quartic, bandwidth ${densityRun.value.bandwidthM.toFixed(1)} m, ${densityRun.value.cols * densityRun.value.rows} cells, edge-corrected`,
  });
  return { title: `Pattern-check engine (${availableParallelism()} cores)`, rows };
}
