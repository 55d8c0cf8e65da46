// `npm run audit`: `npm audit --omit=dev` on the production dependency tree, summarised in one line.
// Exit 0: no high or critical advisory. Exit 1: at least one. Exit 3: the advisory service did not answer,
// so nothing was checked (some registries and mirrors refuse the advisory endpoint).
import { spawnSync } from 'node:child_process';
import { auditLine, summariseAudit } from './lib/audit-report.ts';
import { projectRoot } from './lib/local-env.ts';

const audit = spawnSync('npm', ['audit', '--omit=dev', '--json'], { cwd: projectRoot, encoding: 'utf8', timeout: 120_000 });
const outcome = summariseAudit(audit.stdout ?? '');
console.log(auditLine(outcome));
process.exit(!outcome.checked ? 3 : outcome.blocking.length ? 1 : 0);
