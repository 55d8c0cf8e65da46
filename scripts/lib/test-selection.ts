// Which vitest projects a `npm test` command line asks for, and what each needs before its first test.
export type TestProject = 'unit' | 'api' | 'e2e' | 'faults';

export const ALL_PROJECTS: readonly TestProject[] = ['unit', 'api', 'e2e', 'faults'];

// Folders of their own project; every other folder under tests/ is the unit project's (as in vite.config.ts).
const PROJECT_FOLDERS: ReadonlyArray<[string, TestProject]> = [
  ['tests/api', 'api'],
  ['tests/e2e', 'e2e'],
  ['tests/faults', 'faults'],
];

// vitest flags whose value is the next argument, so it is not read as a file.
const FLAGS_WITH_VALUE = new Set(['-t', '--testNamePattern', '--shard', '--reporter', '--outputFile', '--retry', '--bail']);

export interface TestNeeds {
  projects: TestProject[];
  database: boolean;
  clientBuild: boolean;
  audit: boolean;
}

function projectOfPath(arg: string): TestProject | null {
  const normalised = arg.replace(/^\.\//, '');
  const own = PROJECT_FOLDERS.find(([folder]) => normalised === folder || normalised.startsWith(`${folder}/`))?.[1];
  if (own) return own;
  return normalised.startsWith('tests/') && !normalised.startsWith('tests/helpers') && !normalised.startsWith('tests/fixtures') ? 'unit' : null;
}

/** Reads `--project X` and file or folder arguments; anything it cannot place asks for every project. */
export function testNeeds(args: readonly string[]): TestNeeds {
  const chosen = new Set<TestProject>();
  let unplaced = false;
  let everything = true;
  for (let i = 0; i < args.length; i++) {
    const arg = args[i];
    const projectValue = arg === '--project' ? args[++i] : arg.startsWith('--project=') ? arg.slice('--project='.length) : null;
    if (projectValue !== null) {
      everything = false;
      if ((ALL_PROJECTS as readonly string[]).includes(projectValue ?? '')) chosen.add(projectValue as TestProject);
      else unplaced = true;
      continue;
    }
    if (FLAGS_WITH_VALUE.has(arg)) {
      i++;
      continue;
    }
    if (arg.startsWith('-')) continue;
    everything = false;
    const project = projectOfPath(arg);
    if (project) chosen.add(project);
    else unplaced = true;
  }
  const projects = everything || unplaced ? [...ALL_PROJECTS] : ALL_PROJECTS.filter((p) => chosen.has(p));
  return {
    projects,
    database: projects.some((p) => p !== 'unit'),
    clientBuild: projects.includes('e2e'),
    audit: everything,
  };
}
