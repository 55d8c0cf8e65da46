// The zone table as the grower reads it: area in hectares and acres, share of the field, sightings inside.
import { toAcres, toHectares } from '@shared/units/area.ts';
import type { NoticeZoneRow } from '@shared/schemas/notices.ts';
import { SidewaysScroll } from '../sideways-scroll.tsx';
import { fromCornerText, latLonText } from '@shared/notices/zone-location-words.ts';

const two = new Intl.NumberFormat('en', { minimumFractionDigits: 2, maximumFractionDigits: 2 });
const percent = new Intl.NumberFormat('en', { style: 'percent', maximumFractionDigits: 1 });

export function NoticeZoneTable({ zones, totalTreatedM2, untreatedShare }: { zones: NoticeZoneRow[]; totalTreatedM2: number; untreatedShare: number }) {
  return (
    // Wider than a phone: the table scrolls sideways inside its frame, which says so while columns are out of sight.
    <SidewaysScroll label="Treatment zones" className="rounded-lg ring-1 ring-soil-300/60 print:ring-soil-400">
      <table className="min-w-full text-left text-sm">
        <caption className="sr-only">Treatment zones</caption>
        <thead className="bg-straw-100 text-xs text-soil-700">
          <tr>
            <th scope="col" className="sticky left-0 bg-straw-100 px-3 py-2">
              Zone
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Area (ha)
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Area (ac)
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Share of field
            </th>
            <th scope="col" className="px-3 py-2 text-right">
              Sightings inside
            </th>
            <th scope="col" className="px-3 py-2">
              Centre (lat, lon)
            </th>
            <th scope="col" className="px-3 py-2">
              From the nearest corner
            </th>
          </tr>
        </thead>
        <tbody className="divide-y divide-straw-200 bg-white">
          {zones.map((z) => (
            <tr key={z.label}>
              <th scope="row" className="sticky left-0 bg-white px-3 py-2 font-medium text-soil-900">
                {z.label}
              </th>
              <td className="px-3 py-2 text-right tabular-nums">{two.format(z.areaHa)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{two.format(z.areaAc)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{percent.format(z.shareOfField)}</td>
              <td className="px-3 py-2 text-right tabular-nums">{z.sightingsInside}</td>
              <td className="px-3 py-2 tabular-nums">{z.location ? latLonText(z.location.centre) : '—'}</td>
              <td className="px-3 py-2">{z.location ? fromCornerText(z.location) : '—'}</td>
            </tr>
          ))}
        </tbody>
        <tfoot className="border-t-2 border-straw-300 bg-straw-50 font-medium">
          <tr>
            <th scope="row" className="sticky left-0 bg-straw-50 px-3 py-2">
              All zones
            </th>
            <td className="px-3 py-2 text-right tabular-nums">{two.format(toHectares(totalTreatedM2))}</td>
            <td className="px-3 py-2 text-right tabular-nums">{two.format(toAcres(totalTreatedM2))}</td>
            <td className="px-3 py-2 text-right tabular-nums">{percent.format(1 - untreatedShare)}</td>
            <td className="px-3 py-2" colSpan={3} />
          </tr>
        </tfoot>
      </table>
    </SidewaysScroll>
  );
}
