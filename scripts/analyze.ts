// Command-line pattern check: npm run analyze -- --boundary FIELD.geojson --sightings POINTS.geojson [options]
// Prints the result JSON on stdout; bad input exits with status 2 and one sentence on stderr. runAnalyzeCli() is the
// same command as a function, so tests run it in-process.
import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { analyse } from '../shared/analysis/analyse.ts';
import { AnalysisInputError } from '../shared/analysis/errors.ts';
import type { AnalysisOptionsInput } from '../shared/analysis/options.ts';

class UsageError extends Error {}

export interface CliOutcome {
  status: number;
  stdout: string;
  stderr: string;
}

function number(flag: string, value: string | undefined): number | undefined {
  if (value === undefined) return undefined;
  const parsed = Number(value);
  if (value.trim() === '' || !Number.isFinite(parsed)) throw new UsageError(`--${flag} must be a number, not "${value}".`);
  return parsed;
}

function readGeoJson(flag: string, path: string | undefined): unknown {
  if (!path) throw new UsageError(`Give --${flag} FILE.geojson.`);
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch {
    throw new UsageError(`Cannot read the ${flag} file "${path}".`);
  }
  try {
    return JSON.parse(text);
  } catch {
    throw new UsageError(`The ${flag} file "${path}" is not GeoJSON (it is not valid JSON).`);
  }
}

function optionsFrom(values: Record<string, string | boolean | undefined>): AnalysisOptionsInput {
  const options: AnalysisOptionsInput = {};
  const text = (key: string) => values[key] as string | undefined;
  if (values.planar) options.planar = true;
  options.cellSizeM = number('cell-size', text('cell-size'));
  if (text('grid') !== undefined) {
    const match = /^(\d+)x(\d+)$/i.exec(text('grid') as string);
    if (!match) throw new UsageError(`--grid must look like 5x4 (columns x rows), not "${text('grid')}".`);
    options.grid = { nx: Number(match[1]), ny: Number(match[2]) };
  }
  if (text('slivers') !== undefined) options.slivers = text('slivers') as 'merge';
  if (text('radii') !== undefined) options.radiiM = (text('radii') as string).split(',').map((r) => number('radii', r) as number);
  if (text('ripley-correction') !== undefined) options.ripleyCorrection = text('ripley-correction') as 'isotropic';
  options.simulations = number('simulations', text('simulations'));
  if (text('seed') !== undefined) options.seed = /^-?\d+$/.test(text('seed') as string) ? Number(text('seed')) : (text('seed') as string);
  options.alpha = number('alpha', text('alpha'));
  if (text('kernel') !== undefined) options.kernel = text('kernel') as 'quartic';
  options.bandwidthM = number('bandwidth', text('bandwidth'));
  if (text('area-basis') !== undefined) options.areaBasis = text('area-basis') as 'boundary';
  options.customAreaM2 = number('area', text('area'));
  if (options.customAreaM2 !== undefined && options.areaBasis === undefined) options.areaBasis = 'custom';
  options.minSightings = number('min-sightings', text('min-sightings'));
  options.stopRadiusM = number('stop-radius', text('stop-radius'));
  for (const key of Object.keys(options) as (keyof AnalysisOptionsInput)[]) if (options[key] === undefined) delete options[key];
  return options;
}

/** "--simulations -5" reads as a value, so the option check can say what is wrong with it. */
function joinNegativeValues(argv: string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    if (argv[i].startsWith('--') && !argv[i].includes('=') && /^-\d/.test(argv[i + 1] ?? '')) out.push(`${argv[i]}=${argv[++i]}`);
    else out.push(argv[i]);
  }
  return out;
}

/** The command on its arguments (without node and the script): what it would print and its exit status. */
export function runAnalyzeCli(argv: string[]): CliOutcome {
  let parsed;
  try {
    parsed = parseArgs({
      args: joinNegativeValues(argv),
      options: {
        boundary: { type: 'string' },
        sightings: { type: 'string' },
        planar: { type: 'boolean' },
        'cell-size': { type: 'string' },
        grid: { type: 'string' },
        slivers: { type: 'string' },
        radii: { type: 'string' },
        'ripley-correction': { type: 'string' },
        simulations: { type: 'string' },
        seed: { type: 'string' },
        alpha: { type: 'string' },
        kernel: { type: 'string' },
        bandwidth: { type: 'string' },
        'area-basis': { type: 'string' },
        area: { type: 'string' },
        'min-sightings': { type: 'string' },
        'stop-radius': { type: 'string' },
        pretty: { type: 'boolean' },
      },
      strict: true,
      allowPositionals: false,
    });
  } catch (error) {
    return {
      status: 2,
      stdout: '',
      stderr: `${(error as Error).message.split('\n')[0].replace(/\.?$/, '.')} Run with --boundary FIELD.geojson --sightings POINTS.geojson.\n`,
    };
  }
  try {
    const boundary = readGeoJson('boundary', parsed.values.boundary);
    const sightings = readGeoJson('sightings', parsed.values.sightings);
    const result = analyse(boundary, sightings, optionsFrom(parsed.values));
    if (result.n + result.emptyStops + result.excluded.count < 2)
      throw new UsageError('The sightings file holds fewer than 2 points; a pattern check needs at least 2.');
    if (result.n < 2) {
      throw new UsageError(
        `Fewer than 2 sightings lie inside the boundary (${result.excluded.count} outside were left out); a pattern check needs at least 2.`,
      );
    }
    const stderr =
      result.excluded.count > 0
        ? `${result.excluded.count} sighting${result.excluded.count === 1 ? '' : 's'} outside the boundary ${result.excluded.count === 1 ? 'was' : 'were'} left out.\n`
        : '';
    return { status: 0, stdout: `${JSON.stringify(result, null, parsed.values.pretty ? 2 : undefined)}\n`, stderr };
  } catch (error) {
    if (error instanceof UsageError || error instanceof AnalysisInputError) return { status: 2, stdout: '', stderr: `${error.message}\n` };
    throw error;
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const outcome = runAnalyzeCli(process.argv.slice(2));
  process.stdout.write(outcome.stdout);
  process.stderr.write(outcome.stderr);
  process.exitCode = outcome.status;
}
