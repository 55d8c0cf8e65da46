// Benchmark runner: `npm run bench` (all) or `npm run bench -- engine review` (some).
// Each module exports run(): Promise<BenchOutput> (one table or several); a failing module is skipped. Every module runs in a
// child process of its own, because server modules read DATABASE_URL once, on first import.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import type { BenchOutput, BenchTable } from './table.ts';

const modules = ['./engine.ts', './stops.ts', './review.ts', './ingest.ts', './load.ts', './stalls.ts', './scout.ts'];

function printTable(table: BenchTable): void {
  console.log(`\n${table.title}`);
  if (table.rows.length === 0) {
    console.log('  (no rows)');
    return;
  }
  const columns = [...new Set(table.rows.flatMap((row) => Object.keys(row)))];
  const cell = (value: string | number | undefined) => (value === undefined ? '' : String(value));
  const widths = columns.map((column) => Math.max(column.length, ...table.rows.map((row) => cell(row[column]).length)));
  const line = (values: string[]) => values.map((value, i) => value.padEnd(widths[i])).join('  ');
  console.log(line(columns));
  console.log(line(widths.map((w) => '-'.repeat(w))));
  for (const row of table.rows) console.log(line(columns.map((column) => cell(row[column]))));
}

async function runInThisProcess(specifier: string) {
  try {
    const module = (await import(specifier)) as { run: () => Promise<BenchOutput> };
    const output = await module.run();
    for (const table of Array.isArray(output) ? output : [output]) printTable(table);
  } catch (error) {
    console.log(`\nSkipped ${specifier}: ${error instanceof Error ? error.message : String(error)}`);
  }
}

const [, , childFlag, childModule, ...wanted] = process.argv;
if (childFlag === '--one') {
  await runInThisProcess(childModule);
  process.exit(0);
}
const names = [childFlag, childModule, ...wanted].filter(Boolean);
const chosen = names.length ? modules.filter((m) => names.some((n) => m.includes(n))) : modules;
for (const specifier of chosen) {
  spawnSync(process.execPath, ['--import', 'tsx', fileURLToPath(import.meta.url), '--one', specifier], { stdio: 'inherit' });
}
