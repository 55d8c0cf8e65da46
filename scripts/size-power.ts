// Size and power of the pattern check along realistic walks: prints the Markdown table published in
// shared/analysis/README.md. npx tsx scripts/size-power.ts [runs] (default 200 walks per row).
// Labels and photo positions come from mulberry32 (tests/analysis/walks.ts), not the engine's generator.
import { analyse } from '../shared/analysis/analyse.ts';
import { headlandWalk, mulberry32, patchLabels, randomLabels, squareField, stopsCollection, wWalk, zigzagWalk } from '../tests/analysis/walks.ts';

const runs = Number(process.argv[2] ?? 200);
const simulations = 999;
const alpha = 0.05;

/** Wilson 95 % interval of a binomial share (Wilson 1927). */
function wilson(k: number, n: number): [number, number] {
  const z = 1.959964;
  const p = k / n;
  const centre = (p + (z * z) / (2 * n)) / (1 + (z * z) / n);
  const half = (z * Math.sqrt((p * (1 - p)) / n + (z * z) / (4 * n * n))) / (1 + (z * z) / n);
  return [Math.max(0, centre - half), Math.min(1, centre + half)];
}

const pct = (v: number) => `${(100 * v).toFixed(1)} %`;

const walks = { W: wWalk(), zigzag: zigzagWalk(), 'headland only': headlandWalk() };
const rows: string[] = [];

for (const [name, stops] of Object.entries(walks)) {
  let clustered = 0;
  for (let s = 0; s < runs; s++) {
    const labels = randomLabels(stops.length, 0.3, mulberry32(100_000 + s));
    if (analyse(squareField, stopsCollection(stops, labels), { planar: true, seed: s, simulations, alpha }).spread.verdict === 'clustered') clustered++;
  }
  const [lo, hi] = wilson(clustered, runs);
  rows.push(
    `| ${name}, ${stops.length} stops 20 m apart | pest at a random 30 % of stops | ${pct(clustered / runs)} (${pct(lo)}–${pct(hi)}) | at most 7 % | ${clustered / runs <= 0.07 ? 'yes' : 'NO'} |`,
  );
}

for (const [name, stops] of Object.entries(walks)) {
  let clustered = 0;
  for (let s = 0; s < runs; s++) {
    const labels = patchLabels(stops, mulberry32(200_000 + s));
    if (analyse(squareField, stopsCollection(stops, labels), { planar: true, seed: s, simulations, alpha }).spread.verdict === 'clustered') clustered++;
  }
  const [lo, hi] = wilson(clustered, runs);
  rows.push(
    `| ${name}, ${stops.length} stops 20 m apart | one patch: the 10 % of stops nearest a random stop infested with p = 0.8, the rest with p = 0.1 | ${pct(clustered / runs)} (${pct(lo)}–${pct(hi)}) | at least 80 % | ${clustered / runs >= 0.8 ? 'yes' : 'NO'} |`,
  );
}

{
  let clustered = 0;
  for (let s = 0; s < runs; s++) {
    const random = mulberry32(300_000 + s);
    const features = [];
    for (let k = 0; k < 25; k++) {
      const x = 999 * random();
      const y = 1000 * random();
      for (const dx of [0, 1])
        features.push({ type: 'Feature' as const, properties: { id: `p${k}-${dx}` }, geometry: { type: 'Point' as const, coordinates: [x + dx, y] } });
    }
    if (analyse(squareField, { type: 'FeatureCollection', features }, { planar: true, seed: s, simulations, alpha }).spread.verdict === 'clustered')
      clustered++;
  }
  const [lo, hi] = wilson(clustered, runs);
  rows.push(
    `| 25 random spots, each photographed twice 1 m apart (photos only) | complete spatial randomness | ${pct(clustered / runs)} (${pct(lo)}–${pct(hi)}) | at most 7 % | ${clustered / runs <= 0.07 ? 'yes' : 'NO'} |`,
  );
}

console.log(
  `Share of checks reading "Clustered" at α = ${alpha}, ${simulations} relabellings (or CSR simulations), ${runs} walks per row, 1 km square field; 95 % Wilson interval in brackets.\n`,
);
console.log('| walk | truth | "Clustered" | target | met |');
console.log('| --- | --- | --- | --- | --- |');
for (const row of rows) console.log(row);
