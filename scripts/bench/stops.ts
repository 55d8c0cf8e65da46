// Stops-design benchmark: one pattern check of 500 stops along a W walk with 999 relabellings, beside spatstat's
// envelope() with random labelling on the same stops (timed inside R, start-up excluded) when Rscript is installed.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { analyse } from '../../shared/analysis/analyse.ts';
import { mulberry32, patchLabels, randomLabels, squareField, stopsCollection, wWalk } from '../../tests/analysis/walks.ts';
import type { BenchTable } from './table.ts';

const STOPS = 500;
const SIMULATIONS = 999;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

const R_SCRIPT = `
suppressPackageStartupMessages({ library(spatstat); library(jsonlite) })
d <- fromJSON(Sys.getenv("STOPS_JSON"))
X <- ppp(d$x, d$y, window = square(1000), marks = factor(ifelse(d$found == 1, "found", "empty")))
kdiff <- function(X) { K1 <- Kest(X[marks(X) == "found"], r = d$radii, correction = "isotropic"); K0 <- Kest(unmark(X), r = d$radii, correction = "isotropic"); K1$iso - K0$iso }
f <- function(X, r) fv(data.frame(r = d$radii, theo = 0, D = kdiff(X)), argu = "r", valu = "D", fmla = . ~ r)
t <- system.time(envelope(X, f, nsim = ${SIMULATIONS}, simulate = expression(rlabel(X)), global = TRUE, verbose = FALSE))
cat(t[["elapsed"]] * 1000)
`;

function spatstatMs(stops: [number, number][], labels: boolean[]): string {
  const which = spawnSync('Rscript', ['-e', 'cat(requireNamespace("spatstat", quietly = TRUE))'], { encoding: 'utf8' });
  if (which.error || which.stdout.trim() !== 'TRUE') return 'not installed';
  const dir = mkdtempSync(path.join(tmpdir(), 'patchwise-bench-'));
  try {
    const file = path.join(dir, 'stops.json');
    const radii = Array.from({ length: 20 }, (_, k) => (250 * k) / 19);
    writeFileSync(file, JSON.stringify({ x: stops.map((s) => s[0]), y: stops.map((s) => s[1]), found: labels.map(Number), radii }));
    const run = spawnSync('Rscript', ['-e', R_SCRIPT], { encoding: 'utf8', env: { ...process.env, STOPS_JSON: file } });
    return run.status === 0 ? `${Number(run.stdout.trim()).toFixed(0)} ms` : `failed: ${run.stderr.trim().split('\n').pop()}`;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export async function run(): Promise<BenchTable> {
  const stops = wWalk(STOPS, 7);
  const cases = [
    { name: 'pest at a random 30 % of stops', labels: randomLabels(STOPS, 0.3, mulberry32(1)) },
    { name: 'one patch (10 % of stops)', labels: patchLabels(stops, mulberry32(2)) },
  ];
  const rows: BenchTable['rows'] = [];
  for (const { name, labels } of cases) {
    const sightings = stopsCollection(stops, labels);
    const runs = Array.from({ length: 3 }, () => analyse(squareField, sightings, { planar: true, simulations: SIMULATIONS }));
    const total = median(runs.map((r) => Object.values(r.timingsMs).reduce((a, b) => a + b, 0)));
    const parts = runs[runs.length - 1].timingsMs;
    rows.push({
      case: `${STOPS} stops, W walk, ${name}`,
      'analyse() ms (median of 3)': total.toFixed(0),
      'random labelling ms': parts.randomLabelling.toFixed(0),
      'scan ms': (parts.scan ?? 0).toFixed(0),
      'scouted area + zones ms': ((parts.scouted ?? 0) + (parts.zones ?? 0)).toFixed(0),
      target: '≤ 1000 ms',
      'spatstat envelope(), rlabel, 999, global': spatstatMs(stops, labels),
    });
  }
  return { title: `Stops design: ${STOPS} stops, ${SIMULATIONS} relabellings, one thread`, rows };
}
