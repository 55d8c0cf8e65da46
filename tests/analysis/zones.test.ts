import { describe, expect, it } from 'vitest';
import { createPlanarField, isInsideField } from '../../shared/analysis/field-geometry.ts';
import { densitySurface } from '../../shared/analysis/density.ts';
import { quadratTest } from '../../shared/analysis/quadrat.ts';
import { zonesFromDensity, zonesFromQuadrat, zonesFromRectangles } from '../../shared/analysis/zones.ts';
import { createRandom, normalDeviate } from '../../shared/analysis/random.ts';

const FIELD = createPlanarField([
  [
    [
      [0, 0],
      [600, 0],
      [600, 400],
      [0, 400],
      [0, 0],
    ],
  ],
]);

describe('treatment zones', () => {
  it("buffers a square patch by the margin to s² + 4sm + πm² (Steiner's formula), within 3 %", () => {
    const s = 40;
    const m = 10;
    const [zone] = zonesFromRectangles(FIELD, [[200, 200, 200 + s, 200 + s]], { marginM: m, minZoneAreaM2: 0 });
    const steiner = s * s + 4 * s * m + Math.PI * m * m;
    expect(Math.abs(zone.areaM2 / steiner - 1)).toBeLessThan(0.03);
  });

  it('clips zones to the boundary and drops slivers under the smallest zone area', () => {
    const zones = zonesFromRectangles(
      FIELD,
      [
        [580, 100, 620, 140],
        [300, 300, 302, 302],
      ],
      { marginM: 0, minZoneAreaM2: 100 },
    );
    expect(zones).toHaveLength(1);
    // Only the 20 × 40 m part west of x = 600 lies in the field.
    expect(zones[0].areaM2).toBeCloseTo(800, 6);
    for (const [x] of zones[0].rings[0]) expect(x).toBeLessThanOrEqual(600);
  });

  it('outlines the patch of a clustered pest on the density surface', () => {
    const random = createRandom('zone');
    const pts: number[] = [];
    for (let i = 0; i < 40; i++) pts.push(random() * 600, random() * 400);
    for (let i = 0; i < 80; i++) pts.push(150 + 12 * normalDeviate(random), 250 + 12 * normalDeviate(random));
    const surface = densitySurface(FIELD, new Float64Array(pts), { bandwidthM: 50, cellSizeM: 5 });
    const zones = zonesFromDensity(FIELD, surface, { shareOfMax: 0.5, marginM: 10 });
    expect(zones.length).toBeGreaterThanOrEqual(1);
    const shape = createPlanarField([zones[0].rings]);
    expect(isInsideField(shape, 150, 250)).toBe(true);
    expect(isInsideField(shape, 450, 100)).toBe(false);
  });

  it("makes zones from quadrat cells whose mean count per sighting exceeds the pest's action threshold", () => {
    const xy = new Float64Array([50, 50, 60, 60, 350, 250, 360, 260, 550, 350]);
    const counts = [300, 280, 10, 20, 5];
    const quadrat = quadratTest(FIELD, xy, 240_000, { cellSizeM: 100, counts });
    const zones = zonesFromQuadrat(FIELD, quadrat, { actionThreshold: 250, marginM: 0 });
    expect(zones).toHaveLength(1);
    expect(zones[0].areaM2).toBeCloseTo(100 * 100, 6);
    const shape = createPlanarField([zones[0].rings]);
    expect(isInsideField(shape, 55, 55)).toBe(true);
  });
});
