// The scout's field list in the order a person in the field wants it: the field they stand in, then the nearest,
// with past seasons set aside.
import { booleanPointInPolygon, point, pointToPolygonDistance } from '@turf/turf';
import type { FieldAnswer } from '@shared/schemas/fields.ts';

export interface PlacedField {
  field: FieldAnswer;
  /** Metres from the phone to the boundary (0 inside), or null without a position. */
  distanceM: number | null;
  inside: boolean;
}

export interface ScoutFieldOrder {
  current: PlacedField[];
  /** Fields of seasons before this year: kept, but out of the way. */
  past: PlacedField[];
  /** The field the phone stands in, if any. */
  here: FieldAnswer | null;
}

export function orderFieldsForScout(fields: FieldAnswer[], position: { lon: number; lat: number } | null, year: number): ScoutFieldOrder {
  const where = position ? point([position.lon, position.lat]) : null;
  const placed = fields.map((field): PlacedField => {
    if (!where) return { field, distanceM: null, inside: false };
    const inside = booleanPointInPolygon(where, field.boundary);
    return { field, inside, distanceM: inside ? 0 : Math.abs(pointToPolygonDistance(where, field.boundary, { units: 'meters' })) };
  });
  const byNearness = (a: PlacedField, b: PlacedField) =>
    a.distanceM === null || b.distanceM === null ? a.field.name.localeCompare(b.field.name) : a.distanceM - b.distanceM;
  const current = placed.filter((p) => p.field.season >= year).sort(byNearness);
  const past = placed.filter((p) => p.field.season < year).sort((a, b) => b.field.season - a.field.season || byNearness(a, b));
  return { current, past, here: current.find((p) => p.inside)?.field ?? null };
}
