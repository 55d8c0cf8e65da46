// The scouted area: where the scout's stops can speak for the crop. Everything else is "not scouted", never "clean".
import { distanceToBoundary, fieldToCoordinates, type PlanarField } from './field-geometry.ts';
import { nearestNeighbourDistances } from './nearest-neighbour-index.ts';
import { discsAround, intersection, minus, polygonsArea, type Polygons } from './vector-buffer.ts';

export interface ScoutedArea {
  /** Median distance from a stop to the nearest other stop. */
  stopSpacingM: number;
  /** Each stop speaks for a disc of this radius: half the stop spacing. */
  radiusM: number;
  rule: string;
  /** Planar polygons clipped to the field. */
  scouted: Polygons;
  notScouted: Polygons;
  scoutedM2: number;
  notScoutedM2: number;
}

/** Median nearest-neighbour distance among the stops: the walk's stop spacing. */
export function stopSpacingM(stopsXY: Float64Array): number {
  const d = Array.from(nearestNeighbourDistances(stopsXY))
    .filter(Number.isFinite)
    .sort((a, b) => a - b);
  return d.length ? d[Math.floor(d.length / 2)] : 0;
}

/** The stops' area buffered by half the stop spacing (a vector buffer), inside the field, and the rest of the field. */
export function scoutedArea(field: PlanarField, stopsXY: Float64Array): ScoutedArea {
  const spacing = stopSpacingM(stopsXY);
  // Half the spacing exactly would leave discs touching at a point; 1 % more joins neighbouring stops.
  const radiusM = Math.max(0.505 * spacing, 1);
  const fieldPolygons = fieldToCoordinates(field);
  const discs = discsAround(stopsXY, radiusM);
  let inside = true;
  for (let i = 0; i < stopsXY.length && inside; i += 2) inside = distanceToBoundary(field, stopsXY[i], stopsXY[i + 1]) > radiusM * 1.01;
  const scouted = inside ? discs : intersection(discs, fieldPolygons);
  const notScouted = minus(fieldPolygons, scouted);
  return {
    stopSpacingM: spacing,
    radiusM,
    rule: `Each stop speaks for a disc of half the stop spacing (the median distance to the nearest stop, ${spacing.toFixed(1)} m).`,
    scouted,
    notScouted,
    scoutedM2: polygonsArea(scouted),
    notScoutedM2: polygonsArea(notScouted),
  };
}
