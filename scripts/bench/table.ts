/** One benchmark module's output: a titled table of rows. */
export interface BenchTable {
  title: string;
  rows: Array<Record<string, string | number>>;
}
