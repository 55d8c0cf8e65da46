// The part of the field no stop speaks for, fetched apart from the check's figures while this layer is on.
import { GeoJSON } from 'react-leaflet';
import palette from '../../../../../tailwind.config.ts';
import { useCheckNotScoutedArea } from '../../../../lib/api/get-check-parts.ts';

const { soil } = palette.theme.extend.colors;

export function NotScoutedLayer({ checkId }: { checkId: string }) {
  const area = useCheckNotScoutedArea(checkId);
  const notScouted = area.data?.notScouted;
  if (!notScouted || notScouted.coordinates.length === 0) return null;
  return (
    <GeoJSON
      key={`not-scouted-${checkId}`}
      data={notScouted}
      style={{ color: soil[500], weight: 0.5, fillColor: soil[400], fillOpacity: 0.35 }}
      interactive={false}
    />
  );
}
