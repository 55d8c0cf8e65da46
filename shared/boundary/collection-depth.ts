// GeoJSON collections nested thousands deep would exhaust a recursive parser's stack; this counts without recursion.
import { fault } from './boundary-faults.ts';

// A field's outline needs a Feature in a FeatureCollection at most, or a GeometryCollection of polygons; a few more
// levels cost nothing, but thousands would exhaust the parser's stack and take the request down with them.
const MAX_COLLECTION_DEPTH = 16;

/** How deeply GeoJSON collections nest in a value, counted without recursion (so any depth is safe to measure). */
function collectionDepth(value: unknown) {
  let deepest = 0;
  const pending: Array<{ node: unknown; depth: number }> = [{ node: value, depth: 0 }];
  while (pending.length > 0) {
    const { node, depth } = pending.pop()!;
    if (!node || typeof node !== 'object') continue;
    const { type, geometries, features, geometry } = node as { type?: unknown; geometries?: unknown; features?: unknown; geometry?: unknown };
    if (type !== 'GeometryCollection' && type !== 'FeatureCollection' && type !== 'Feature') continue;
    deepest = Math.max(deepest, depth + 1);
    if (deepest > MAX_COLLECTION_DEPTH) return deepest;
    const children = [geometries, features].flatMap((list) => (Array.isArray(list) ? list : []));
    if (geometry) children.push(geometry);
    for (const child of children) pending.push({ node: child, depth: depth + 1 });
  }
  return deepest;
}

/** Refuses a GeoJSON value nested deeper than any field outline needs, before a parser walks it. */
export function refuseDeepNesting(value: unknown) {
  if (collectionDepth(value) > MAX_COLLECTION_DEPTH) {
    throw fault(
      'unparseable',
      `The boundary nests collections more than ${MAX_COLLECTION_DEPTH} levels deep; export the field outline as a plain Polygon or MultiPolygon and upload that.`,
    );
  }
}
