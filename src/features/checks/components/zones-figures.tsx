// The density surface's settings and the treatment zones proposed from it.
import type { CheckFigures } from '@shared/schemas/checks.ts';
import { fixed, metres, percent } from '../utils/figures.ts';
import { Figure, FigureList, SectionTitle } from './figure-list.tsx';
import { ButtonLink } from '../../../components/button.tsx';

type Density = NonNullable<CheckFigures['density']>;

/** The engine's bandwidth sentence; a check stored before it wrote one keeps its two phrases, joined into one. */
function bandwidthText(density: Density): string {
  if (density.bandwidthSentence) return density.bandwidthSentence;
  const meaning = density.bandwidthMeaning;
  return `${meaning.charAt(0).toUpperCase()}${meaning.slice(1)} (${density.bandwidthRule}).`;
}

export function ZonesFigures({ result, zoneEditorPath }: { result: CheckFigures; zoneEditorPath: string }) {
  const { density, zones } = result;
  return (
    <section aria-labelledby="zones-title">
      <SectionTitle source="Kernel density estimate (Silverman 1986)">
        <span id="zones-title">Density surface and proposed zones</span>
      </SectionTitle>
      {density && (
        <FigureList label="Density figures">
          <Figure name="Kernel · bandwidth" value={`${density.kernel} · ${metres(density.bandwidthM, 0)}`} figure="bandwidth">
            {bandwidthText(density)}
          </Figure>
          <Figure name="Peak density" value={`${fixed(density.maxPerHa, 1)}/ha`} figure="max-density">
            The densest spot on the surface, in sightings per hectare ({metres(density.cellSizeM, 1)} cells).
          </Figure>
        </FigureList>
      )}
      <p className="mt-2 text-xs text-soil-700">{zones.note}</p>
      {zones.features.length > 0 && (
        <table className="mt-2 w-full text-left text-xs">
          <caption className="sr-only">Proposed treatment zones</caption>
          <thead className="bg-straw-100 text-soil-700">
            <tr>
              <th scope="col" className="px-2 py-1">
                Zone
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Area (ha)
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Area (ac)
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Share of field
              </th>
              <th scope="col" className="px-2 py-1 text-right">
                Sightings inside
              </th>
            </tr>
          </thead>
          <tbody className="divide-y divide-straw-200 tabular-nums">
            {zones.features.map((z) => (
              <tr key={z.properties.zone}>
                <td className="px-2 py-1">{z.properties.zone}</td>
                <td className="px-2 py-1 text-right">{fixed(z.properties.areaHa, 2)}</td>
                <td className="px-2 py-1 text-right">{fixed(z.properties.areaAc, 2)}</td>
                <td className="px-2 py-1 text-right">{percent(z.properties.shareOfField, 1)}</td>
                <td className="px-2 py-1 text-right">{z.properties.sightings}</td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <div className="mt-3">
        <ButtonLink to={zoneEditorPath} variant="secondary" size="sm">
          {zones.features.length > 0 ? 'Edit and accept these zones' : 'Draw treatment zones by hand'}
        </ButtonLink>
      </div>
    </section>
  );
}
