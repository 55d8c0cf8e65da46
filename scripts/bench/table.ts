/** One benchmark table: a title and its rows. */
export interface BenchTable {
  title: string;
  rows: Array<Record<string, string | number>>;
}

/** What a benchmark module's run() gives: one table, or several printed in order. */
export type BenchOutput = BenchTable | BenchTable[];
