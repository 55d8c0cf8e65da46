// The trend of a process's memory through a load run: the least-squares slope (simple-statistics'
// linearRegression) of each measure over the samples after warm-up, in MB per minute, against a tolerance.
import { linearRegression } from 'simple-statistics';

export interface MemoryPoint {
  /** Seconds since the load began. */
  seconds: number;
  /** Megabytes after a forced GC. */
  heapMb: number;
  externalMb: number;
  rssMb: number;
}

export interface MemoryTrend {
  measure: string;
  samples: number;
  fromSeconds: number;
  slopeMbPerMin: number;
  toleranceMbPerMin: number;
  verdict: 'flat' | 'growing' | 'falling' | 'too few samples';
}

/** The slope of `pick` over the points at or after `fromSeconds`; three points at least, or no verdict. */
export function memoryTrend(
  points: MemoryPoint[],
  measure: string,
  pick: (p: MemoryPoint) => number,
  fromSeconds: number,
  toleranceMbPerMin: number,
): MemoryTrend {
  const used = points.filter((p) => p.seconds >= fromSeconds);
  const base = { measure, samples: used.length, fromSeconds, toleranceMbPerMin };
  if (used.length < 3) return { ...base, slopeMbPerMin: Number.NaN, verdict: 'too few samples' };
  const { m } = linearRegression(used.map((p) => [p.seconds / 60, pick(p)]));
  const verdict = m >= toleranceMbPerMin ? 'growing' : m <= -toleranceMbPerMin ? 'falling' : 'flat';
  return { ...base, slopeMbPerMin: m, verdict };
}
