// Sightings (bars) and mean count per stop (line) for each walk of the season: recharts, loaded only when
// the history panel has walks to show.
import { Bar, CartesianGrid, ComposedChart, Legend, Line, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import palette from '../../../../tailwind.config.ts';
import { useDates } from '../../../lib/dates.ts';

const { patch, field } = palette.theme.extend.colors;

export interface WalkHistoryRow {
  walkedOn: string;
  scout: string;
  sightings: number;
  stops: number;
  meanCount: number | null;
}

export function WalkHistoryChart({ rows }: { rows: WalkHistoryRow[] }) {
  // Walk days are calendar days (YYYY-MM-DD): written as the organisation writes dates, never shifted by a zone.
  const dates = useDates();
  const day = (walkedOn: unknown) => dates.calendarDate(String(walkedOn));
  return (
    <ResponsiveContainer width="100%" height="100%">
      <ComposedChart data={rows} margin={{ top: 8, right: 8, bottom: 4, left: 0 }}>
        <CartesianGrid stroke="#ebdcb4" strokeDasharray="3 3" />
        <XAxis dataKey="walkedOn" tick={{ fontSize: 11 }} tickFormatter={day} />
        <YAxis yAxisId="sightings" tick={{ fontSize: 11 }} width={36} allowDecimals={false} />
        <YAxis yAxisId="mean" orientation="right" tick={{ fontSize: 11 }} width={36} />
        <Tooltip labelFormatter={day} />
        <Legend verticalAlign="top" height={22} iconSize={10} wrapperStyle={{ fontSize: 11 }} />
        {/* A season of one or two walks would otherwise draw bars as wide as the chart. */}
        <Bar yAxisId="sightings" dataKey="sightings" name="Sightings" fill={field[400]} maxBarSize={40} isAnimationActive={false} />
        <Line yAxisId="mean" dataKey="meanCount" name="Mean count per stop" stroke={patch[600]} strokeWidth={2} isAnimationActive={false} connectNulls />
      </ComposedChart>
    </ResponsiveContainer>
  );
}
