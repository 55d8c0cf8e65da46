// Benchmark runner: `npm run bench`. Each module exports run(): Promise<BenchTable>; a failing module is skipped.
import type { BenchTable } from './table.ts';

const modules = ['./engine.ts', './review.ts', './ingest.ts'];

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

for (const specifier of modules) {
  try {
    const module = (await import(specifier)) as { run: () => Promise<BenchTable> };
    printTable(await module.run());
  } catch (error) {
    console.log(`\nSkipped ${specifier}: ${error instanceof Error ? error.message : String(error)}`);
  }
}
