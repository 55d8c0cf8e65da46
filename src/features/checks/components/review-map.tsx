// The review map (lazy-loaded with Leaflet): boundary, the chosen pest's sightings on a canvas, and the
// check's quadrat grid, density surface and proposed zones as layers the adviser switches on and off.
import { stopsSummary } from '@shared/units/stops-summary.ts';
import { useMemo, useState } from 'react';
import { GeoJSON, Popup } from 'react-leaflet';
import type { SightingView } from '@shared/schemas/sightings.ts';
import type { CheckFigures } from '@shared/schemas/checks.ts';
import { MapFrame } from '../../../components/map-frame.tsx';
import type { FieldAnswer as Field } from '@shared/schemas/fields.ts';
import palette from '../../../../tailwind.config.ts';
import { planarToLonLat } from '../utils/planar-to-lonlat.ts';
import { fixed } from '../utils/figures.ts';
import { SightingDots } from './map/sighting-dots.tsx';
import { QuadratGridLayer } from './map/quadrat-grid-layer.tsx';
import { DensityLayer, densityRamp } from './map/density-layer.tsx';
import { NotScoutedLayer } from './map/not-scouted-layer.tsx';
import { SightingDetails } from './sighting-details.tsx';

const { patch } = palette.theme.extend.colors;
type LayerKey = 'sightings' | 'quadrat' | 'density' | 'zones' | 'notScouted';
const layerLabels: Record<LayerKey, string> = {
  sightings: 'Sightings',
  quadrat: 'Quadrat grid',
  density: 'Density surface',
  zones: 'Proposed zones',
  notScouted: 'Not scouted',
};

export function ReviewMap({
  field,
  sightings,
  result,
  checkId,
  selectedId,
  onSelect,
}: {
  field: Field;
  sightings: SightingView[];
  result: CheckFigures | null;
  /** The check the result belongs to: its density grid, quadrat cells and not-scouted polygons are fetched only while their layer is on. */
  checkId: string | null;
  selectedId: string | null;
  onSelect: (id: string | null) => void;
}) {
  const [shown, setShown] = useState<Record<LayerKey, boolean>>({ sightings: true, quadrat: false, density: false, zones: true, notScouted: true });
  const toLonLat = useMemo(() => planarToLonLat(result?.crsDefinition ?? null), [result]);
  const selected = selectedId ? sightings.find((s) => s.id === selectedId && s.position) : undefined;
  const available: Record<LayerKey, boolean> = {
    sightings: true,
    quadrat: Boolean(result?.quadrat && toLonLat),
    density: Boolean(result?.density && toLonLat),
    zones: Boolean(result?.zones.features.length),
    notScouted: Boolean(result?.scouted?.notScoutedParts),
  };

  return (
    <div className="space-y-2">
      <fieldset className="flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
        <legend className="sr-only">Map layers</legend>
        {(Object.keys(layerLabels) as LayerKey[]).map((key) => (
          <label key={key} className={`inline-flex items-center gap-1.5 ${available[key] ? 'text-soil-800' : 'text-soil-400'}`}>
            <input
              type="checkbox"
              className="h-4 w-4 rounded border-soil-300 text-field-700 focus:ring-field-600"
              checked={shown[key] && available[key]}
              disabled={!available[key]}
              onChange={(e) => setShown((s) => ({ ...s, [key]: e.target.checked }))}
            />
            {layerLabels[key]}
          </label>
        ))}
        {!result && <span className="text-xs text-soil-600">Run a check to see its grid, surface and zones.</span>}
      </fieldset>
      <MapFrame
        boundaries={[{ id: field.id, geometry: field.boundary, label: field.name }]}
        label={`Map of ${field.name} with ${stopsSummary(sightings.filter((s) => !s.isEmptyStop).length, sightings.filter((s) => s.isEmptyStop).length)}`}
        className="h-[38rem]"
      >
        {shown.density && result?.density && checkId && toLonLat && <DensityLayer checkId={checkId} density={result.density} toLonLat={toLonLat} />}
        {shown.quadrat && result?.quadrat && checkId && toLonLat && (
          <QuadratGridLayer checkId={checkId} grid={result.quadrat.grid} boundary={field.boundary} toLonLat={toLonLat} />
        )}
        {shown.notScouted && result?.scouted && result.scouted.notScoutedParts > 0 && checkId && <NotScoutedLayer checkId={checkId} />}
        {shown.zones && result && result.zones.features.length > 0 && (
          <GeoJSON
            key={JSON.stringify(result.zones.features.map((f) => f.properties.areaM2))}
            data={result.zones}
            style={{ color: patch[700], weight: 2.5, dashArray: '6 4', fillColor: patch[400], fillOpacity: 0.18 }}
          />
        )}
        {shown.sightings && <SightingDots sightings={sightings} selectedId={selectedId} onSelect={onSelect} />}
        {selected?.position && (
          <Popup position={[selected.position.lat, selected.position.lon]} eventHandlers={{ remove: () => onSelect(null) }}>
            <SightingDetails sighting={selected} />
          </Popup>
        )}
      </MapFrame>
      <MapLegend result={result} shownDensity={shown.density && available.density} />
    </div>
  );
}

function MapLegend({ result, shownDensity }: { result: CheckFigures | null; shownDensity: boolean }) {
  return (
    <div className="flex flex-wrap items-center gap-x-5 gap-y-1 text-xs text-soil-700">
      <span className="inline-flex items-center gap-1.5">
        <span className="inline-block h-3 w-3 rounded-full bg-patch-500 ring-1 ring-patch-700" aria-hidden="true" /> Sighting (larger = higher count)
      </span>
      <span className="inline-flex items-center gap-1.5">
        <span className="inline-block h-2.5 w-2.5 rounded-full ring-[1.5px] ring-soil-700" aria-hidden="true" /> Empty stop
      </span>
      {shownDensity && result?.density && (
        <span className="inline-flex items-center gap-1.5">
          Density 0
          <span className="inline-flex" aria-hidden="true">
            {densityRamp.map((colour) => (
              <span key={colour} className="inline-block h-3 w-5" style={{ backgroundColor: colour }} />
            ))}
          </span>
          {fixed(result.density.maxPerHa, 0)} sightings/ha ({result.density.kernel}, bandwidth {fixed(result.density.bandwidthM, 0)} m)
        </span>
      )}
      {result?.scouted && result.scouted.notScoutedParts > 0 && (
        <span className="inline-flex items-center gap-1.5">
          <span className="inline-block h-3 w-5 bg-soil-400/40 ring-1 ring-soil-500" aria-hidden="true" /> Not scouted (
          {fixed(result.scouted.notScoutedM2 / 10_000, 1)} ha, {fixed(100 * (1 - result.scouted.scoutedShare), 0)} % of the field): no stop speaks for it, so it
          is not known to be clean
        </span>
      )}
      {result && result.zones.features.length > 0 && (
        <span className="inline-flex items-center gap-1.5">
          <span className="inline-block h-3 w-5 border-2 border-dashed border-patch-700 bg-patch-100" aria-hidden="true" /> Proposed zone
        </span>
      )}
    </div>
  );
}
