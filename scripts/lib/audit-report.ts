// Reads `npm audit --json` output (npm 7+ report format, auditReportVersion 2) into what the run prints:
// counts by severity, or why nothing was checked when the registry's advisory service did not answer.

export const SEVERITIES = ['info', 'low', 'moderate', 'high', 'critical'] as const;
export type Severity = (typeof SEVERITIES)[number];

export type AuditOutcome =
  | { checked: true; counts: Record<Severity, number>; dependencies: number; blocking: Array<{ name: string; severity: Severity }> }
  | { checked: false; reason: string };

interface AuditJson {
  auditReportVersion?: number;
  vulnerabilities?: Record<string, { severity?: string }>;
  metadata?: { vulnerabilities?: Partial<Record<Severity, number>>; dependencies?: { prod?: number; total?: number } };
  message?: string;
  error?: { summary?: string; detail?: string };
}

/** High and critical advisories block; the lower levels are printed for the record. */
const BLOCKING: readonly Severity[] = ['high', 'critical'];

export function summariseAudit(stdout: string): AuditOutcome {
  let report: AuditJson;
  try {
    report = JSON.parse(stdout) as AuditJson;
  } catch {
    return { checked: false, reason: `npm audit printed no report (${stdout.trim().slice(0, 120) || 'nothing at all'})` };
  }
  const counted = report.metadata?.vulnerabilities;
  if (!counted || report.error || report.message) {
    const reason = report.message ?? report.error?.summary ?? report.error?.detail ?? 'the report has no vulnerability counts';
    return { checked: false, reason };
  }
  const counts = Object.fromEntries(SEVERITIES.map((s) => [s, counted[s] ?? 0])) as Record<Severity, number>;
  const blocking = Object.entries(report.vulnerabilities ?? {})
    .filter(([, v]) => BLOCKING.includes(v.severity as Severity))
    .map(([name, v]) => ({ name, severity: v.severity as Severity }));
  return { checked: true, counts, dependencies: report.metadata?.dependencies?.prod ?? report.metadata?.dependencies?.total ?? 0, blocking };
}

export function auditLine(outcome: AuditOutcome): string {
  if (!outcome.checked) return `Dependency audit not checked: the registry's advisory service did not answer (${outcome.reason}).`;
  const counts = SEVERITIES.map((s) => `${outcome.counts[s]} ${s}`).join(', ');
  const verdict = outcome.blocking.length
    ? `high or critical: ${outcome.blocking.map((b) => `${b.name} (${b.severity})`).join(', ')}`
    : 'no high or critical advisory';
  return `Dependency audit of the production tree: ${verdict} (${counts}).`;
}
