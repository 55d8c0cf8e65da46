// Run a pattern check for the chosen pest and window, follow it while it runs, and read its verdict.
import { useState } from 'react';
import type { CheckRequestInput, CheckView } from '@shared/schemas/checks.ts';
import { Button } from '../../../components/button.tsx';
import { Panel } from '../../../components/page-frame.tsx';
import { ErrorState, EmptyState, LoadingState } from '../../../components/query-states.tsx';
import { FormMessage } from '../../../components/form-field.tsx';
import { errorMessage, serverFieldErrors, type FieldErrors } from '../../../lib/form-errors.ts';
import { useRunCheck } from '../api/run-check.ts';
import type { useCheck } from '../../../lib/api/get-check.ts';
import { CheckOptionsForm } from './check-options-form.tsx';
import { optionsFromDraft, type CheckOptionsDraft } from '../check-options-draft.ts';
import { VerdictSummary } from './verdict-summary.tsx';

export function CheckPanel({
  window,
  draft,
  onDraftChange,
  check,
  onCheckOpened,
}: {
  window: Omit<CheckRequestInput, 'options'> | null;
  draft: CheckOptionsDraft;
  onDraftChange: (draft: CheckOptionsDraft) => void;
  check: ReturnType<typeof useCheck>;
  onCheckOpened: (check: CheckView) => void;
}) {
  const run = useRunCheck();
  const [errors, setErrors] = useState<FieldErrors>({});

  const start = () => {
    if (!window) return;
    const built = optionsFromDraft(draft);
    if (!built.ok) {
      setErrors(built.errors);
      return;
    }
    setErrors({});
    run.mutate({ ...window, options: built.options }, { onSuccess: onCheckOpened, onError: (error) => setErrors(serverFieldErrors(error)) });
  };

  const current = check.data;
  const working = current?.status === 'queued' || current?.status === 'running';
  return (
    <Panel title="Pattern check" className="space-y-3">
      <CheckOptionsForm draft={draft} onChange={onDraftChange} errors={errors} />
      <div className="flex items-center gap-3">
        <Button onClick={start} busy={run.isPending || working} disabled={!window}>
          Run check
        </Button>
        {!window && <span className="text-xs text-soil-600">Choose a pest first.</span>}
      </div>
      {run.isError && <FormMessage>{errorMessage(run.error)}</FormMessage>}
      <div aria-live="polite" className="border-t border-straw-200 pt-3">
        {check.fetchStatus === 'idle' && !current ? (
          <EmptyState title="No check yet">
            Run a check to test whether this pest is patchy here. The same sightings and options give back the stored result.
          </EmptyState>
        ) : check.isPending ? (
          <LoadingState label="Opening the check…" />
        ) : check.isError ? (
          <ErrorState error={check.error} onRetry={() => check.refetch()} />
        ) : current && working ? (
          <CheckProgress check={current} />
        ) : current?.status === 'failed' ? (
          <FormMessage>{current.error ?? 'The check failed; run it again.'}</FormMessage>
        ) : current?.result ? (
          <VerdictSummary check={current} result={current.result} />
        ) : null}
      </div>
    </Panel>
  );
}

function CheckProgress({ check }: { check: CheckView }) {
  const share = Math.round(check.progress * 100);
  return (
    <div className="space-y-1" role="status">
      <p className="text-sm font-medium text-soil-800">
        {check.status === 'queued' ? 'Queued — waiting for a worker…' : `Running the simulations… ${share} %`}
      </p>
      <div
        className="h-2 overflow-hidden rounded bg-straw-200"
        role="progressbar"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={share}
        aria-label="Check progress"
      >
        <div className="h-full bg-field-600 transition-all" style={{ width: `${share}%` }} />
      </div>
      <p className="text-xs text-soil-600">Heavy checks (many simulations) run in the background; this page follows it.</p>
    </div>
  );
}
