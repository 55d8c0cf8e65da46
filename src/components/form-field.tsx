// Labelled inputs with hint and error text wired to aria-describedby, so screen readers read both.
import { useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';

const inputClass =
  'block w-full rounded-md border-0 bg-white px-3 py-2 text-soil-900 ring-1 ring-inset ring-soil-300 placeholder:text-soil-400 focus:ring-2 focus:ring-field-600 aria-[invalid=true]:ring-patch-600 disabled:bg-straw-100';

interface FrameProps {
  label: ReactNode;
  hint?: ReactNode;
  error?: string;
  className?: string;
}

function useFieldIds(error?: string, hint?: ReactNode) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return { id, hintId, errorId, describedBy: [hintId, errorId].filter(Boolean).join(' ') || undefined };
}

function Frame({
  id,
  label,
  hint,
  hintId,
  error,
  errorId,
  className = '',
  children,
}: FrameProps & { id: string; hintId?: string; errorId?: string; children: ReactNode }) {
  return (
    <div className={className}>
      <label htmlFor={id} className="mb-1 block text-sm font-medium text-soil-800">
        {label}
      </label>
      {children}
      {hint && (
        <p id={hintId} className="mt-1 text-xs text-soil-600">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="mt-1 text-sm font-medium text-patch-700">
          {error}
        </p>
      )}
    </div>
  );
}

export function TextField({ label, hint, error, className, ...input }: FrameProps & InputHTMLAttributes<HTMLInputElement>) {
  const ids = useFieldIds(error, hint);
  return (
    <Frame {...ids} label={label} hint={hint} error={error} className={className}>
      <input id={ids.id} className={inputClass} aria-invalid={error ? true : undefined} aria-describedby={ids.describedBy} {...input} />
    </Frame>
  );
}

export function TextAreaField({ label, hint, error, className, ...input }: FrameProps & TextareaHTMLAttributes<HTMLTextAreaElement>) {
  const ids = useFieldIds(error, hint);
  return (
    <Frame {...ids} label={label} hint={hint} error={error} className={className}>
      <textarea id={ids.id} className={inputClass} rows={3} aria-invalid={error ? true : undefined} aria-describedby={ids.describedBy} {...input} />
    </Frame>
  );
}

export function SelectField({ label, hint, error, className, children, ...select }: FrameProps & SelectHTMLAttributes<HTMLSelectElement>) {
  const ids = useFieldIds(error, hint);
  return (
    <Frame {...ids} label={label} hint={hint} error={error} className={className}>
      <select id={ids.id} className={inputClass} aria-invalid={error ? true : undefined} aria-describedby={ids.describedBy} {...select}>
        {children}
      </select>
    </Frame>
  );
}

/** A message for the whole form (the server's refusal, or a fault not tied to one input). */
export function FormMessage({ tone = 'error', children }: { tone?: 'error' | 'success'; children: ReactNode }) {
  if (!children) return null;
  const look = tone === 'error' ? 'bg-patch-50 text-patch-700 ring-patch-100' : 'bg-field-50 text-field-800 ring-field-200';
  return (
    <p role={tone === 'error' ? 'alert' : 'status'} className={`rounded-md px-3 py-2 text-sm ring-1 ring-inset ${look}`}>
      {children}
    </p>
  );
}
