// The L-function plot itself: recharts, loaded only when a check with Ripley's figures is on screen, so the
// review page's first load does not carry the chart library.
import { Area, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import type { RipleyResult } from '@shared/analysis/ripley.ts';
import palette from '../../../../tailwind.config.ts';

const { patch, soil, density } = palette.theme.extend.colors;

export function LFunctionPlot({ ripley }: { ripley: RipleyResult }) {
  // Not named `r`: recharts passes row fields to the dots, where `r` is the dot's radius.
  const rows = ripley.radiiM.map((distance, i) => ({
    distance,
    L: ripley.L[i],
    // The r = L line: what L would be for a chance scatter.
    chance: distance,
    envelope: ripley.envelopeLow && ripley.envelopeHigh ? [ripley.envelopeLow[i], ripley.envelopeHigh[i]] : undefined,
  }));
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart data={rows} margin={{ top: 8, right: 12, bottom: 18, left: 4 }}>
        <CartesianGrid stroke="#ebdcb4" strokeDasharray="3 3" />
        <XAxis
          dataKey="distance"
          type="number"
          domain={[0, 'dataMax']}
          tickFormatter={(v: number) => v.toFixed(0)}
          label={{ value: 'distance r (m)', position: 'insideBottom', offset: -10, fontSize: 11 }}
          tick={{ fontSize: 11 }}
        />
        <YAxis
          tickFormatter={(v: number) => v.toFixed(0)}
          label={{ value: 'L(r) (m)', angle: -90, position: 'insideLeft', fontSize: 11 }}
          tick={{ fontSize: 11 }}
          width={44}
        />
        <Tooltip
          formatter={(value) => (Array.isArray(value) ? value.map((v) => Number(v).toFixed(1)).join(' – ') : Number(value).toFixed(1))}
          labelFormatter={(r) => `r = ${Number(r).toFixed(1)} m`}
        />
        <Legend verticalAlign="top" height={22} iconSize={10} wrapperStyle={{ fontSize: 11 }} />
        {rows[0]?.envelope && <Area dataKey="envelope" name="Random envelope" stroke="none" fill={density[2]} fillOpacity={0.8} isAnimationActive={false} />}
        <Line dataKey="chance" name="Chance (L = r)" stroke={soil[500]} strokeDasharray="5 4" dot={false} isAnimationActive={false} />
        <Line dataKey="L" name="L(r) observed" stroke={patch[600]} strokeWidth={2.5} dot={{ r: 2.5 }} isAnimationActive={false} />
      </ComposedChart>
    </ResponsiveContainer>
  );
}
