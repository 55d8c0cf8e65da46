// The quadrat cells of a check (fetched apart from its figures when this layer opens), drawn from the engine's grid
// (origin, cell size, col/row) in its CRS, clipped to the boundary for display, with each cell's count as a label.
import { useEffect, useMemo } from 'react';
import L from 'leaflet';
import { useMap } from 'react-leaflet';
import type { MultiPolygon, Polygon } from 'geojson';
import { featureCollection, intersect, polygon as turfPolygon } from '@turf/turf';
import type { QuadratCell, QuadratResult } from '@shared/analysis/quadrat.ts';
import palette from '../../../../../tailwind.config.ts';
import type { ToLonLat } from '../../utils/planar-to-lonlat.ts';
import { useCheckQuadrats } from '../../../../lib/api/get-check-parts.ts';

const { field, straw } = palette.theme.extend.colors;
/** Above this many cells the labels would overlap at any useful zoom; the cells are still drawn. */
const MAX_LABELLED_CELLS = 600;

function cellRing(grid: QuadratResult['grid'], col: number, row: number, toLonLat: ToLonLat) {
  const x0 = grid.originX + col * grid.cellWidth;
  const y0 = grid.originY + row * grid.cellHeight;
  const x1 = x0 + grid.cellWidth;
  const y1 = y0 + grid.cellHeight;
  return [toLonLat(x0, y0), toLonLat(x1, y0), toLonLat(x1, y1), toLonLat(x0, y1), toLonLat(x0, y0)];
}

interface GridProps {
  checkId: string;
  grid: QuadratResult['grid'];
  boundary: Polygon | MultiPolygon;
  toLonLat: ToLonLat;
}

export function QuadratGridLayer({ checkId, ...props }: GridProps) {
  const cells = useCheckQuadrats(checkId);
  // Nothing to draw until the cells arrive; a failed fetch leaves the map as it was.
  return cells.data?.quadratCells ? <QuadratCells cells={cells.data.quadratCells} {...props} /> : null;
}

function QuadratCells({ cells, grid, boundary, toLonLat }: Omit<GridProps, 'checkId'> & { cells: QuadratCell[] }) {
  const map = useMap();
  const renderer = useMemo(() => L.canvas({ padding: 0.3 }), []);
  const shapes = useMemo(() => {
    const outline = { type: 'Feature' as const, properties: {}, geometry: boundary };
    const maxCount = Math.max(1, ...cells.map((c) => c.count));
    return cells.map((cell) => {
      const square = turfPolygon([cellRing(grid, cell.col, cell.row, toLonLat)]);
      const clipped = intersect(featureCollection([square, outline])) ?? square;
      return { cell, geometry: clipped.geometry, shade: cell.count / maxCount };
    });
  }, [cells, grid, boundary, toLonLat]);

  useEffect(() => {
    const group = L.layerGroup();
    const labelled = shapes.length <= MAX_LABELLED_CELLS;
    for (const { cell, geometry, shade } of shapes) {
      const layer = L.geoJSON(geometry, {
        style: { renderer, color: field[800], weight: 1, fillColor: straw[400], fillOpacity: 0.08 + 0.5 * shade, interactive: false } as L.PathOptions,
      });
      if (labelled) {
        layer.bindTooltip(String(cell.count), {
          permanent: true,
          direction: 'center',
          className: 'quadrat-count !border-0 !bg-transparent !p-0 !shadow-none text-[10px] font-semibold !text-soil-900',
          opacity: 1,
        });
      }
      group.addLayer(layer);
    }
    group.addTo(map);
    return () => {
      group.remove();
    };
  }, [map, renderer, shapes]);
  return null;
}
