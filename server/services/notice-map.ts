// The notice's map image, made with no tile service: an SVG of the boundary, zones and sightings drawn in
// the field's UTM projection (metres, so shapes keep their true proportions), rasterised by resvg.
import { Resvg } from '@resvg/resvg-js';
import type { MultiPolygon, Position } from 'geojson';
import { boundaryCentroid, utmProjectionFor } from '../../shared/analysis/projection.ts';
import { boxEdgePointToward, labelSize, placeZoneLabels, type Box, type PlacedLabel, type XY } from '../../shared/notices/zone-label-placement.ts';

export interface NoticeMapInput {
  boundary: MultiPolygon;
  zones: Array<{ label: string; geometry: MultiPolygon }>;
  /** [longitude, latitude] of each sighting with the pest found. */
  sightings: Position[];
}

// Our palette (tailwind.config.ts): straw background, field greens, the warm patch accent, soil for sightings.
const colours = { background: '#fbf8f0', field: '#dcebd6', fieldEdge: '#2f5d3a', zone: '#f08a4b', zoneEdge: '#9a3f14', sighting: '#352d25', text: '#241e19' };

const WIDTH = 800;
const MAX_HEIGHT = 640;
const PAD = 28;
const LEGEND = 44;
const DOT_RADIUS = 3.5;
const LABEL_FONT = 15;

/** A scale-bar length of 1, 2 or 5 × 10ⁿ metres close to a fifth of the map's width. */
function scaleBarMetres(mapWidthM: number) {
  const target = mapWidthM / 5;
  const power = 10 ** Math.floor(Math.log10(target));
  return [1, 2, 5, 10].map((k) => k * power).reduce((best, v) => (Math.abs(v - target) < Math.abs(best - target) ? v : best));
}

const escapeXml = (text: string) => text.replace(/[<>&"']/g, (c) => ({ '<': '&lt;', '>': '&gt;', '&': '&amp;', '"': '&quot;', "'": '&apos;' })[c] as string);

/** The SVG text of the map. */
export function noticeMapSvg(input: NoticeMapInput): string {
  const projection = utmProjectionFor(...boundaryCentroid(input.boundary.coordinates));
  const project = ([lon, lat]: Position) => projection.forward(lon, lat);
  const boundaryXY = input.boundary.coordinates.map((p) => p.map((r) => r.map(project)));
  const all = boundaryXY.flat(2);
  const minX = Math.min(...all.map((p) => p[0]));
  const maxX = Math.max(...all.map((p) => p[0]));
  const minY = Math.min(...all.map((p) => p[1]));
  const maxY = Math.max(...all.map((p) => p[1]));
  const spanX = Math.max(maxX - minX, 1);
  const spanY = Math.max(maxY - minY, 1);
  const scale = Math.min((WIDTH - 2 * PAD) / spanX, (MAX_HEIGHT - 2 * PAD - LEGEND) / spanY);
  const height = Math.ceil(spanY * scale + 2 * PAD + LEGEND);
  const px = ([x, y]: number[]) => `${(PAD + (x - minX) * scale).toFixed(1)},${(PAD + (maxY - y) * scale).toFixed(1)}`;
  // One path per polygon with even-odd fill, so holes stay open.
  const path = (polygons: number[][][][]) => polygons.map((p) => p.map((r) => `M${r.map(px).join('L')}Z`).join('')).join('');

  const toPixel = ([x, y]: number[]): XY => [PAD + (x - minX) * scale, PAD + (maxY - y) * scale];
  const zonesXY = input.zones.map((zone) => zone.geometry.coordinates.map((p) => p.map((r) => r.map(project))));
  const zones = zonesXY.map(
    (xy) => `<path d="${path(xy)}" fill="${colours.zone}" fill-opacity="0.6" stroke="${colours.zoneEdge}" stroke-width="2" fill-rule="evenodd"/>`,
  );
  const dotsXY = input.sightings.map((s) => toPixel(project(s)));
  const sightings = dotsXY.map(
    ([x, y]) => `<circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${DOT_RADIUS}" fill="${colours.sighting}" stroke="#ffffff" stroke-width="1"/>`,
  );
  const labels = noticeMapLabels(input, { toPixel, project, dotsXY, frame: { x0: 2, y0: 2, x1: WIDTH - 2, y1: height - LEGEND } }).map(({ text, placed }) => {
    const [x, y] = placed.centre;
    const leader = placed.leaderTo
      ? (() => {
          const [fx, fy] = boxEdgePointToward(placed.box, placed.leaderTo);
          const [tx, ty] = placed.leaderTo;
          const line = `x1="${fx.toFixed(1)}" y1="${fy.toFixed(1)}" x2="${tx.toFixed(1)}" y2="${ty.toFixed(1)}"`;
          return `<line ${line} stroke="#ffffff" stroke-width="4"/><line ${line} stroke="${colours.text}" stroke-width="1.5"/><circle cx="${tx.toFixed(1)}" cy="${ty.toFixed(1)}" r="2.5" fill="${colours.text}"/>`;
        })()
      : '';
    const at = `x="${x.toFixed(1)}" y="${(y + LABEL_FONT * 0.36).toFixed(1)}" font-family="DejaVu Sans, sans-serif" font-size="${LABEL_FONT}" font-weight="bold" text-anchor="middle"`;
    // The halo: the same text drawn first with a wide light stroke, so the label reads over zone, field and dots alike.
    return (
      `<g class="zone-label" data-box="${[placed.box.x0, placed.box.y0, placed.box.x1, placed.box.y1].map((v) => v.toFixed(1)).join(',')}">${leader}` +
      `<text ${at} fill="#ffffff" stroke="#ffffff" stroke-width="4" stroke-linejoin="round">${escapeXml(text)}</text>` +
      `<text ${at} fill="${colours.text}">${escapeXml(text)}</text></g>`
    );
  });
  const barM = scaleBarMetres(spanX);
  const barPx = barM * scale;
  const legendY = height - LEGEND + 18;
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${height}" viewBox="0 0 ${WIDTH} ${height}">
<rect width="100%" height="100%" fill="${colours.background}"/>
<path d="${path(boundaryXY)}" fill="${colours.field}" stroke="${colours.fieldEdge}" stroke-width="3" fill-rule="evenodd"/>
${zones.join('\n')}
${sightings.join('\n')}
${labels.join('\n')}
<g font-family="DejaVu Sans, sans-serif" font-size="13" fill="${colours.text}">
<rect x="${PAD}" y="${legendY - 10}" width="14" height="14" fill="${colours.zone}" fill-opacity="0.6" stroke="${colours.zoneEdge}"/><text x="${PAD + 20}" y="${legendY + 2}">Treatment zone</text>
<circle cx="${PAD + 150}" cy="${legendY - 3}" r="4" fill="${colours.sighting}"/><text x="${PAD + 160}" y="${legendY + 2}">Sighting</text>
<rect x="${PAD + 240}" y="${legendY - 10}" width="14" height="14" fill="${colours.field}" stroke="${colours.fieldEdge}" stroke-width="2"/><text x="${PAD + 260}" y="${legendY + 2}">Field boundary</text>
<line x1="${WIDTH - PAD - barPx}" y1="${legendY}" x2="${WIDTH - PAD}" y2="${legendY}" stroke="${colours.text}" stroke-width="3"/><text x="${WIDTH - PAD - barPx / 2}" y="${legendY - 8}" text-anchor="middle">${barM >= 1000 ? `${barM / 1000} km` : `${barM} m`}</text>
<text x="${WIDTH - PAD}" y="${legendY + 18}" text-anchor="end" font-size="11">Grid north up (UTM)</text>
</g>
</svg>`;
}

/** Each zone's label on the map's pixels: inside the zone clear of the dots and edges, or beside it with a leader line. */
function noticeMapLabels(
  input: NoticeMapInput,
  at: { toPixel: (xy: number[]) => XY; project: (p: Position) => number[]; dotsXY: XY[]; frame: Box },
): Array<{ text: string; placed: PlacedLabel }> {
  const requests = input.zones.map((zone) => ({
    polygons: zone.geometry.coordinates.map((p) => p.map((r) => r.map((position) => at.toPixel(at.project(position))))),
    ...labelSize(zone.label, LABEL_FONT),
  }));
  const placed = placeZoneLabels(requests, at.dotsXY, { dotRadius: DOT_RADIUS + 1, gap: 2, frame: at.frame });
  return input.zones.map((zone, i) => ({ text: zone.label, placed: placed[i] }));
}

/** The map as a PNG. */
export function renderNoticeMap(input: NoticeMapInput): Buffer {
  const resvg = new Resvg(noticeMapSvg(input), { fitTo: { mode: 'original' }, font: { loadSystemFonts: true, defaultFontFamily: 'DejaVu Sans' } });
  return resvg.render().asPng();
}
