// Positions inside one of the demo's fields (holes excluded), drawn from a seeded generator so each run uses the same.
import { booleanPointInPolygon, bbox } from '@turf/turf';
import { createRandom } from '../../../shared/analysis/random.ts';
import { demoFields, type DemoField } from '../../seed/demo-scenario.ts';

export function pointsInsideField(key: DemoField['key'], count: number, seed = 'load-bench') {
  const field = demoFields.find((f) => f.key === key)!;
  const [west, south, east, north] = bbox(field.boundary);
  const random = createRandom(seed);
  const points: Array<{ lon: number; lat: number }> = [];
  while (points.length < count) {
    const p = { lon: west + random() * (east - west), lat: south + random() * (north - south) };
    if (booleanPointInPolygon([p.lon, p.lat], field.boundary)) points.push(p);
  }
  return points;
}
