// Reads a boundary file in the browser with the same parser and checks the server uses,
// so the admin sees the outline, its area or its fault before saving.
import type { MultiPolygon } from 'geojson';
import { parseBoundaryText } from '@shared/boundary/parse-boundary.ts';
import { validateBoundary } from '@shared/boundary/validate-boundary.ts';
import { BoundaryError } from '@shared/boundary/boundary-faults.ts';

export type BoundaryPreview = { ok: true; boundary: MultiPolygon; areaM2: number } | { ok: false; message: string };

export function previewBoundary(text: string): BoundaryPreview {
  try {
    const boundary = parseBoundaryText(text, DOMParser);
    return { ok: true, boundary, areaM2: validateBoundary(boundary).areaM2 };
  } catch (error) {
    if (error instanceof BoundaryError) return { ok: false, message: error.message };
    return { ok: false, message: 'The file could not be read as GeoJSON or KML.' };
  }
}

export function previewDrawn(boundary: MultiPolygon): BoundaryPreview {
  try {
    return { ok: true, boundary, areaM2: validateBoundary(boundary).areaM2 };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : 'The drawn boundary is not valid.' };
  }
}
