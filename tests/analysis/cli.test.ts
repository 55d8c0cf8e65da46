// The command-line entry on fixture files: good input prints the result JSON, bad input exits 2 with one sentence.
import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { runAnalyzeCli } from '../../scripts/analyze.ts';

const root = fileURLToPath(new URL('../..', import.meta.url));
const fixture = (name: string) => `tests/fixtures/analysis/${name}`;

// In-process, through the command's own entry: the same parsing, output and exit status without a process each.
function analyze(...args: string[]) {
  const run = runAnalyzeCli(args);
  return { status: run.status, stdout: run.stdout, stderr: run.stderr.trim() };
}

// One real process, to show the command prints and exits as the function says.
function analyzeInProcess(...args: string[]) {
  const run = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/analyze.ts', ...args], { cwd: root, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr.trim() };
}

function expectOneSentence(stderr: string, pattern: RegExp) {
  expect(stderr.split('\n')).toHaveLength(1);
  expect(stderr).toMatch(/\.$/);
  expect(stderr).toMatch(pattern);
}

describe('npm run analyze', () => {
  it('reproduces the lattice fixture figures (expected values and sources side by side in the fixture)', () => {
    const run = analyze('--boundary', fixture('lattice-field.geojson'), '--sightings', fixture('lattice-sightings.geojson'), '--planar', '--simulations', '19');
    expect(run.status).toBe(0);
    const result = JSON.parse(run.stdout);
    const expected = JSON.parse(readFileSync(`${root}${fixture('lattice-expected.json')}`, 'utf8')) as Record<string, { value: number }>;
    for (const [path, { value }] of Object.entries(expected)) {
      const actual = path.split('.').reduce((node, key) => node[key], result);
      expect(actual).toBeCloseTo(value, 6);
    }
    expect(result.crs).toBe('planar');
  });

  it('merges photos of one spot into one stop, and keeps them apart with --stop-radius 0', () => {
    const args = [
      '--boundary',
      fixture('lattice-field.geojson'),
      '--sightings',
      fixture('sightings-repeat-photos.geojson'),
      '--planar',
      '--simulations',
      '9',
      '--min-sightings',
      '2',
    ];
    const merged = JSON.parse(analyze(...args).stdout);
    expect(merged.stops.count).toBe(6);
    expect(merged.stops.merges).toHaveLength(6);
    const apart = JSON.parse(analyze(...args, '--stop-radius', '0').stdout);
    expect(apart.stops.count).toBe(12);
    expect(apart.stops.merges).toHaveLength(0);
  });

  it('exits 2 with one clear sentence for a negative --stop-radius', () => {
    const run = analyze(
      '--boundary',
      fixture('lattice-field.geojson'),
      '--sightings',
      fixture('sightings-repeat-photos.geojson'),
      '--planar',
      '--stop-radius',
      '-1',
    );
    expect(run.status).toBe(2);
    expectOneSentence(run.stderr, /same-stop radius/);
  });

  it('reports sightings outside the boundary, leaves them out and says how many', () => {
    const run = analyze('--boundary', fixture('field.geojson'), '--sightings', fixture('sightings-one-outside.geojson'), '--simulations', '19');
    expect(run.status).toBe(0);
    expect(run.stderr).toBe('1 sighting outside the boundary was left out.');
    expect(JSON.parse(run.stdout).excluded).toEqual({ count: 1, ids: ['OUT1'] });
  });

  const bad: Array<[string, string[], RegExp]> = [
    ['an unreadable file', ['--boundary', fixture('missing.geojson'), '--sightings', fixture('sightings.geojson')], /Cannot read the boundary file/],
    ['a file that is not GeoJSON', ['--boundary', fixture('not-geojson.geojson'), '--sightings', fixture('sightings.geojson')], /is not GeoJSON/],
    ['a boundary with no polygon', ['--boundary', fixture('no-polygon.geojson'), '--sightings', fixture('sightings.geojson')], /no Polygon or MultiPolygon/],
    ['fewer than 2 points', ['--boundary', fixture('field.geojson'), '--sightings', fixture('sightings-single.geojson')], /fewer than 2/i],
    [
      'a negative option',
      ['--boundary', fixture('field.geojson'), '--sightings', fixture('sightings.geojson'), '--bandwidth', '-5'],
      /bandwidth must be more than 0/,
    ],
    [
      'an absurd option',
      ['--boundary', fixture('field.geojson'), '--sightings', fixture('sightings.geojson'), '--simulations', '5000000'],
      /Simulations must be at most/,
    ],
    ['a malformed grid', ['--boundary', fixture('field.geojson'), '--sightings', fixture('sightings.geojson'), '--grid', 'five'], /--grid must look like/],
    ['metres without --planar', ['--boundary', fixture('lattice-field.geojson'), '--sightings', fixture('lattice-sightings.geojson')], /--planar/],
  ];
  for (const [name, args, message] of bad) {
    it(`exits 2 with one clear sentence for ${name}`, () => {
      const run = analyze(...args);
      expect(run.status).toBe(2);
      expect(run.stdout).toBe('');
      expectOneSentence(run.stderr, message);
    });
  }

  it('runs as a command: the result on stdout with status 0, and status 2 with one sentence for bad input', () => {
    const good = analyzeInProcess(
      '--boundary',
      fixture('lattice-field.geojson'),
      '--sightings',
      fixture('lattice-sightings.geojson'),
      '--planar',
      '--simulations',
      '9',
    );
    expect(good.status).toBe(0);
    const withoutTimings = (text: string) => JSON.parse(text, (key, value) => (key === 'timingsMs' ? undefined : value));
    const inProcess = analyze(
      '--boundary',
      fixture('lattice-field.geojson'),
      '--sightings',
      fixture('lattice-sightings.geojson'),
      '--planar',
      '--simulations',
      '9',
    );
    expect(withoutTimings(good.stdout)).toEqual(withoutTimings(inProcess.stdout));
    const bad = analyzeInProcess('--boundary', fixture('not-geojson.geojson'), '--sightings', fixture('sightings.geojson'));
    expect(bad.status).toBe(2);
    expectOneSentence(bad.stderr, /not GeoJSON/);
  });
});
