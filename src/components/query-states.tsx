// The three states every page shows around a server call: loading, failed, nothing there yet.
import type { ReactNode } from 'react';
import { Button } from './button.tsx';
import { errorMessage } from '../lib/form-errors.ts';

export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-10 text-soil-600">
      <span className="h-5 w-5 animate-spin rounded-full border-2 border-field-500 border-r-transparent" aria-hidden="true" />
      {label}
    </div>
  );
}

export function ErrorState({ error, onRetry, title = 'This could not be loaded' }: { error: unknown; onRetry?: () => void; title?: string }) {
  return (
    <div role="alert" className="rounded-lg bg-patch-50 p-4 text-patch-700 ring-1 ring-inset ring-patch-100">
      <p className="font-semibold">{title}</p>
      <p className="mt-1 text-sm">{errorMessage(error)}</p>
      {onRetry && (
        <Button variant="secondary" size="sm" className="mt-3" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-lg border-2 border-dashed border-straw-300 bg-straw-50 px-4 py-8 text-center">
      <p className="font-semibold text-soil-800">{title}</p>
      {children && <div className="mx-auto mt-1 max-w-md text-sm text-soil-600">{children}</div>}
      {action && <div className="mt-4">{action}</div>}
    </div>
  );
}
