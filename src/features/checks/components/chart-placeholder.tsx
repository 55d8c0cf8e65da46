// Holds a chart's place (its figure sets the size) while the chart library loads, so nothing below jumps.
export function ChartPlaceholder() {
  return <div className="h-full w-full animate-pulse rounded bg-straw-100" role="status" aria-label="Loading the chart…" />;
}
