// The density surface as one image over the field: the engine's grid (fetched apart from the check's figures when
// this layer opens) painted cell by cell on a canvas in the single-hue density ramp; cells outside the field (NaN)
// stay transparent, which clips it.
import { useMemo } from 'react';
import { ImageOverlay } from 'react-leaflet';
import type { LatLngBoundsExpression } from 'leaflet';
import type { DensityResult } from '@shared/analysis/density.ts';
import palette from '../../../../../tailwind.config.ts';
import type { ToLonLat } from '../../utils/planar-to-lonlat.ts';
import { useDensityGrid } from '../../api/get-density-grid.ts';

/** The density figures the check carries; the grid itself comes from its own route. */
type DensityFigures = Pick<DensityResult, 'cols' | 'rows' | 'cellSizeM' | 'originX' | 'originY' | 'maxPerHa'>;

export const densityRamp = Object.values(palette.theme.extend.colors.density);

function rgb(hex: string): [number, number, number] {
  const n = Number.parseInt(hex.slice(1), 16);
  return [(n >> 16) & 255, (n >> 8) & 255, n & 255];
}

/** The ramp step for a value as a share of the surface's maximum (display scaling only). */
export function rampIndex(value: number, max: number) {
  if (!(max > 0) || value <= 0) return 0;
  return Math.min(densityRamp.length - 1, Math.floor((value / max) * densityRamp.length));
}

function paint(density: DensityFigures, perHa: Float64Array): string | null {
  const canvas = document.createElement('canvas');
  canvas.width = density.cols;
  canvas.height = density.rows;
  const context = canvas.getContext('2d');
  if (!context) return null;
  const image = context.createImageData(density.cols, density.rows);
  const colours = densityRamp.map(rgb);
  for (let row = 0; row < density.rows; row++) {
    for (let col = 0; col < density.cols; col++) {
      const value = perHa[row * density.cols + col];
      if (!(value > 0)) continue;
      // The engine's rows run from the south; the image's from the top.
      const offset = ((density.rows - 1 - row) * density.cols + col) * 4;
      const [r, g, b] = colours[rampIndex(value, density.maxPerHa)];
      image.data[offset] = r;
      image.data[offset + 1] = g;
      image.data[offset + 2] = b;
      image.data[offset + 3] = 210;
    }
  }
  context.putImageData(image, 0, 0);
  return canvas.toDataURL('image/png');
}

export function DensityLayer({ checkId, density, toLonLat }: { checkId: string; density: DensityFigures; toLonLat: ToLonLat }) {
  const grid = useDensityGrid(checkId);
  const picture = useMemo(() => {
    if (!grid.data || grid.data.length !== density.cols * density.rows) return null;
    const url = paint(density, grid.data);
    const [west, south] = toLonLat(density.originX, density.originY);
    const [east, north] = toLonLat(density.originX + density.cols * density.cellSizeM, density.originY + density.rows * density.cellSizeM);
    const bounds: LatLngBoundsExpression = [
      [south, west],
      [north, east],
    ];
    return url ? { url, bounds } : null;
  }, [density, toLonLat, grid.data]);
  if (!picture) return null;
  return (
    <ImageOverlay key={picture.url.length + String(picture.bounds)} url={picture.url} bounds={picture.bounds} opacity={0.85} className="density-surface" />
  );
}
