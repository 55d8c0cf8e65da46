// The audit summary must never read "no advisory" when the audit did not run, and must name what blocks.
// Report shapes: npm's `npm audit --json` (auditReportVersion 2, as documented for npm 7+ and produced by
// npm-audit-report's JSON reporter), and the error object npm 11 prints when the registry refuses the advisory
// endpoint (captured from this machine's npm 11.19 against a registry answering 405).
import { describe, expect, it } from 'vitest';
import { auditLine, summariseAudit } from '../../scripts/lib/audit-report.ts';

const report = (vulnerabilities: Record<string, { severity: string }>, counts: Record<string, number>) =>
  JSON.stringify({
    auditReportVersion: 2,
    vulnerabilities: Object.fromEntries(
      Object.entries(vulnerabilities).map(([name, v]) => [
        name,
        { name, isDirect: false, via: [], effects: [], range: '*', nodes: [], fixAvailable: true, ...v },
      ]),
    ),
    metadata: {
      vulnerabilities: { info: 0, low: 0, moderate: 0, high: 0, critical: 0, total: 0, ...counts },
      dependencies: { prod: 310, dev: 0, optional: 4, peer: 0, peerOptional: 0, total: 310 },
    },
  });

describe('dependency audit summary', () => {
  it('a clean report says so and counts nothing as blocking', () => {
    const outcome = summariseAudit(report({}, {}));
    expect(outcome).toMatchObject({ checked: true, blocking: [], dependencies: 310 });
    expect(auditLine(outcome)).toMatch(/no high or critical advisory/);
  });

  it('high and critical advisories block and are named; moderate and low are only counted', () => {
    const outcome = summariseAudit(
      report({ alpha: { severity: 'critical' }, beta: { severity: 'moderate' }, gamma: { severity: 'high' } }, { critical: 1, moderate: 1, high: 1, total: 3 }),
    );
    expect(outcome.checked && outcome.blocking.map((b) => b.name).sort()).toEqual(['alpha', 'gamma']);
    expect(auditLine(outcome)).toMatch(/alpha \(critical\).*gamma \(high\)|gamma \(high\).*alpha \(critical\)/);
    expect(auditLine(outcome)).toMatch(/1 moderate/);
  });

  it('a refused advisory endpoint reads as not checked, with the registry’s answer', () => {
    const refused = JSON.stringify({
      message: '405 Method Not Allowed - POST https://registry.npmjs.org/-/npm/v1/security/advisories/bulk',
      method: 'POST',
      statusCode: 405,
      body: '',
      error: { summary: '', detail: '' },
    });
    const outcome = summariseAudit(refused);
    expect(outcome.checked).toBe(false);
    expect(auditLine(outcome)).toMatch(/not checked.*405 Method Not Allowed/);
    expect(auditLine(outcome)).not.toMatch(/no high or critical/);
  });

  it('output that is not a report at all reads as not checked', () => {
    expect(summariseAudit('npm error network request failed').checked).toBe(false);
    expect(summariseAudit('').checked).toBe(false);
  });
});
