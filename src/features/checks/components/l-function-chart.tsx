// Ripley's L against distance with the Monte Carlo envelope: where L rises above the band, sightings
// cluster at that distance. Drawn with recharts from the engine's own L and envelope arrays.
import { Area, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { RipleyResult } from '@shared/analysis/ripley.ts';
import palette from '../../../../tailwind.config.ts';
import { fixed } from '../utils/figures.ts';
import { SectionTitle } from './figure-list.tsx';

const { patch, soil, density } = palette.theme.extend.colors;

function rangeText(radii: number[]) {
  return radii.length === 1 ? `${fixed(radii[0], 0)} m` : `${fixed(radii[0], 0)}–${fixed(radii[radii.length - 1], 0)} m`;
}

export function LFunctionChart({ ripley }: { ripley: RipleyResult | null }) {
  if (!ripley) {
    return (
      <section>
        <SectionTitle source="Ripley 1976, 1977">Clustering by distance</SectionTitle>
        <p className="py-2 text-sm text-soil-600">Needs at least two sightings inside the field.</p>
      </section>
    );
  }
  // Not named `r`: recharts passes row fields to the dots, where `r` is the dot's radius.
  const rows = ripley.radiiM.map((distance, i) => ({
    distance,
    L: ripley.L[i],
    // The r = L line: what L would be for a chance scatter.
    chance: distance,
    envelope: ripley.envelopeLow && ripley.envelopeHigh ? [ripley.envelopeLow[i], ripley.envelopeHigh[i]] : undefined,
  }));
  const reading = ripley.aboveEnvelopeM.length
    ? `L rises above the random band at ${rangeText(ripley.aboveEnvelopeM)}: sightings gather together at that scale — about the size of a patch.`
    : ripley.belowEnvelopeM.length
      ? `L falls below the random band at ${rangeText(ripley.belowEnvelopeM)}: sightings keep apart at that scale.`
      : ripley.envelopeHigh
        ? `L stays inside the random band up to ${fixed(ripley.radiiM[ripley.radiiM.length - 1], 0)} m: no distance shows clustering.`
        : 'No random band was simulated (0 simulations): read L against the chance line only.';
  return (
    <section aria-labelledby="ripley-title">
      <SectionTitle source={`Ripley 1976, 1977 · ${ripley.correction} edge correction · ${ripley.simulations} simulations`}>
        <span id="ripley-title">Clustering by distance (L function)</span>
      </SectionTitle>
      <figure className="h-64" aria-label="L function chart: L of r against distance r, with the random envelope and the chance line" data-chart="l-function">
        <ResponsiveContainer width="100%" height="100%">
          <ComposedChart data={rows} margin={{ top: 8, right: 12, bottom: 18, left: 4 }}>
            <CartesianGrid stroke="#ebdcb4" strokeDasharray="3 3" />
            <XAxis dataKey="distance" type="number" domain={[0, 'dataMax']} tickFormatter={(v: number) => v.toFixed(0)} label={{ value: 'distance r (m)', position: 'insideBottom', offset: -10, fontSize: 11 }} tick={{ fontSize: 11 }} />
            <YAxis tickFormatter={(v: number) => v.toFixed(0)} label={{ value: 'L(r) (m)', angle: -90, position: 'insideLeft', fontSize: 11 }} tick={{ fontSize: 11 }} width={44} />
            <Tooltip formatter={(value) => (Array.isArray(value) ? value.map((v) => Number(v).toFixed(1)).join(' – ') : Number(value).toFixed(1))} labelFormatter={(r) => `r = ${Number(r).toFixed(1)} m`} />
            <Legend verticalAlign="top" height={22} iconSize={10} wrapperStyle={{ fontSize: 11 }} />
            {rows[0]?.envelope && <Area dataKey="envelope" name="Random envelope" stroke="none" fill={density[2]} fillOpacity={0.8} isAnimationActive={false} />}
            <Line dataKey="chance" name="Chance (L = r)" stroke={soil[500]} strokeDasharray="5 4" dot={false} isAnimationActive={false} />
            <Line dataKey="L" name="L(r) observed" stroke={patch[600]} strokeWidth={2.5} dot={{ r: 2.5 }} isAnimationActive={false} />
          </ComposedChart>
        </ResponsiveContainer>
      </figure>
      <p className="mt-1 text-xs text-soil-700">{reading}</p>
    </section>
  );
}
