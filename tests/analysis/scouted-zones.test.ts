// Zones from abundance among the stops, kept inside the scouted area; the rest of the field is "not scouted".
// Expected values: the area of a disc (π r²), the field's own area, and the planted patch of the input.
import { describe, expect, it } from 'vitest';
import { analyse } from '../../shared/analysis/analyse.ts';
import { createPlanarField } from '../../shared/analysis/field-geometry.ts';
import { scoutedArea } from '../../shared/analysis/scouted.ts';
import { SQUARE_KM, mulberry32, patchLabels, squareField, stopsCollection, wWalk } from './walks.ts';

describe('scouted area', () => {
  it('gives each stop a disc of half the stop spacing: two discs less their lens, within 1 %', () => {
    const field = createPlanarField([[SQUARE_KM]]);
    const scouted = scoutedArea(field, Float64Array.from([500, 500, 540, 500]));
    expect(scouted.stopSpacingM).toBeCloseTo(40, 9);
    const r = scouted.radiusM;
    const d = 40;
    // Area of the lens where two circles of radius r at distance d overlap (circle–circle intersection).
    const lens = 2 * r * r * Math.acos(d / (2 * r)) - (d / 2) * Math.sqrt(4 * r * r - d * d);
    expect(Math.abs(scouted.scoutedM2 / (2 * Math.PI * r * r - lens) - 1)).toBeLessThan(0.01);
  });

  it('splits the field into scouted and not scouted, adding up to the field area', () => {
    const field = createPlanarField([[SQUARE_KM]]);
    const scouted = scoutedArea(field, new Float64Array(wWalk().flat()));
    expect(Math.abs(scouted.scoutedM2 + scouted.notScoutedM2 - 1_000_000)).toBeLessThan(50);
    expect(scouted.notScoutedM2).toBeGreaterThan(0.9 * 1_000_000);
  });
});

describe('zones in the stops design', () => {
  const walk = wWalk();
  const labels = patchLabels(walk, mulberry32(3), 0.1, 1, 0.05);
  const counted = stopsCollection(walk, labels);
  counted.features.forEach((f, i) => (f.properties.count = labels[i] ? 6 : 0));
  const result = analyse(squareField, counted, { planar: true, simulations: 199, zones: { actionThreshold: 2, unit: 'aphids per plant' } });

  it('reports the not-scouted area with the check', () => {
    expect(result.scouted?.notScouted.coordinates.length).toBeGreaterThan(0);
    expect(result.scouted?.scoutedShare).toBeLessThan(0.1);
  });

  it('proposes a zone over the patch that carries its stops, mean count and the threshold', () => {
    expect(result.spread.verdict).toBe('clustered');
    expect(result.zones.features.length).toBeGreaterThan(0);
    const zone = result.zones.features[0].properties;
    expect(zone.threshold).toBe(2);
    expect(zone.basis).toBe('mean-count');
    expect(zone.stops?.length).toBe(zone.stopCount);
    expect(zone.meanCount).toBeGreaterThan(0);
    expect(result.zones.note).toContain('aphids per plant');
  });

  it('never reaches past the scouted area', () => {
    const scoutedM2 = result.scouted?.scoutedM2 as number;
    const zonesM2 = result.zones.features.reduce((sum, f) => sum + f.properties.areaM2, 0);
    expect(zonesM2).toBeLessThanOrEqual(scoutedM2);
    const radius = result.scouted?.radiusM as number;
    for (const feature of result.zones.features) {
      for (const [x, y] of feature.geometry.coordinates[0]) {
        const nearest = Math.min(...walk.map(([sx, sy]) => Math.hypot(sx - x, sy - y)));
        expect(nearest).toBeLessThanOrEqual(radius * 1.01 + 0.05);
      }
    }
  });

  it('draws round margins, not stair steps', () => {
    const ring = result.zones.features[0].geometry.coordinates[0];
    const oblique = ring.slice(1).filter(([x, y], i) => Math.abs(x - ring[i][0]) > 0.01 && Math.abs(y - ring[i][1]) > 0.01);
    expect(oblique.length).toBeGreaterThan(ring.length / 2);
  });

  it('finds the planted patch with the scan statistic (Kulldorff 1997) and a small Monte Carlo p', () => {
    expect(result.scan?.pValue).toBeLessThanOrEqual(0.01);
    const planted = new Set(result.stops.count ? counted.features.filter((_, i) => labels[i]).map((f) => f.properties.id) : []);
    const caught = (result.scan?.stops ?? []).filter((id) => planted.has(id)).length;
    expect(caught).toBeGreaterThanOrEqual(0.6 * (result.scan?.found ?? 0));
  });
});
