// The boundary crossing check against turf's own (quadratic, pair-by-pair) kinks on rings where both must agree,
// and the corner limit with its sentence. turf is the reference library here; the rings are random, not expected values.
import { describe, expect, it } from 'vitest';
import { circle as turfCircle, kinks as turfKinks, polygon as turfPolygon } from '@turf/turf';
import type { MultiPolygon, Position } from 'geojson';
import { MAX_BOUNDARY_CORNERS, validateBoundary } from '../../shared/boundary/validate-boundary.ts';
import { BoundaryError } from '../../shared/boundary/boundary-faults.ts';
import { createRandom } from '../../shared/analysis/random.ts';

const asBoundary = (ring: Position[]): MultiPolygon => ({ type: 'MultiPolygon', coordinates: [[ring]] });

function faultCode(boundary: MultiPolygon): string | null {
  try {
    validateBoundary(boundary);
    return null;
  } catch (error) {
    if (error instanceof BoundaryError) return error.fault.code;
    throw error;
  }
}

describe('boundary crossing check', () => {
  it('finds a crossing exactly where turf kinks finds one, on 2,000 random rings of 3 to 14 corners', () => {
    const random = createRandom(11);
    let crossed = 0;
    for (let t = 0; t < 2000; t++) {
      const corners = 3 + Math.floor(random() * 12);
      // About 1 km across, so every ring passes the area limits and only the crossing check decides.
      const ring: Position[] = Array.from({ length: corners }, () => [-93.6 + random() * 0.012, 42 + random() * 0.009]);
      ring.push(ring[0]);
      const turfSaysCrossed = turfKinks(turfPolygon([ring])).features.length > 0;
      if (turfSaysCrossed) crossed++;
      expect(faultCode(asBoundary(ring)) === 'self-intersecting', JSON.stringify(ring)).toBe(turfSaysCrossed);
    }
    // Both outcomes occurred, so the agreement says something.
    expect(crossed).toBeGreaterThan(200);
    expect(crossed).toBeLessThan(1900);
  });

  it('accepts a 19,000-corner circle (turf circle) and refuses it once two neighbouring corners are swapped', () => {
    const ring = turfCircle([-93.6, 42.03], 0.4, { steps: 19_000 }).geometry.coordinates[0];
    expect(faultCode(asBoundary(ring))).toBeNull();
    const crossed = ring.map((p) => [...p]);
    [crossed[5000], crossed[5001]] = [crossed[5001], crossed[5000]];
    expect(faultCode(asBoundary(crossed))).toBe('self-intersecting');
  });

  it('refuses more corners than the limit with a sentence giving both numbers', () => {
    const ring = turfCircle([-93.6, 42.03], 0.4, { steps: 63_000 }).geometry.coordinates[0];
    expect(() => validateBoundary(asBoundary(ring))).toThrow(
      `This boundary has 63,000 corners; Patchwise takes at most ${MAX_BOUNDARY_CORNERS.toLocaleString('en')} — simplify it`,
    );
  });
});
