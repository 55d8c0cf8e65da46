import { describe, expect, it } from 'vitest';
import { testNeeds } from '../../scripts/lib/test-selection.ts';

describe('what npm test starts for the suites asked for', () => {
  it('runs every project, the build and the audit when nothing is named', () => {
    expect(testNeeds([])).toEqual({ projects: ['unit', 'api', 'e2e', 'faults'], database: true, clientBuild: true, audit: true });
  });

  it('starts neither database nor build for engine tests', () => {
    expect(testNeeds(['tests/analysis'])).toEqual({ projects: ['unit'], database: false, clientBuild: false, audit: false });
    expect(testNeeds(['--project', 'unit'])).toMatchObject({ database: false, clientBuild: false });
  });

  it('starts the database but not the build for one API file', () => {
    expect(testNeeds(['tests/api/auth.test.ts'])).toEqual({ projects: ['api'], database: true, clientBuild: false, audit: false });
  });

  it('builds the client only when a browser suite is named', () => {
    expect(testNeeds(['./tests/e2e/zone-notice.test.ts', '--project=faults'])).toMatchObject({ projects: ['e2e', 'faults'], clientBuild: true });
  });

  it('falls back to every project for a filter it cannot place, so nothing is skipped unprepared', () => {
    expect(testNeeds(['notices']).projects).toEqual(['unit', 'api', 'e2e', 'faults']);
  });

  it('does not read the value of a name filter as a file', () => {
    expect(testNeeds(['tests/api', '-t', 'refuses a boundary']).projects).toEqual(['api']);
  });
});

describe('a new test folder', () => {
  it('belongs to the unit project unless it is api, e2e or faults', () => {
    expect(testNeeds(['tests/boundary/validate-boundary.test.ts'])).toMatchObject({ projects: ['unit'], database: false });
  });
});
