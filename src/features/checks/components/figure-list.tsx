// A figure is never shown bare: its name, the engine's value and what it means for this field, side by side.
import type { ReactNode } from 'react';

export function FigureList({ children, label }: { children: ReactNode; label: string }) {
  return (
    <dl aria-label={label} className="divide-y divide-straw-200 text-sm">
      {children}
    </dl>
  );
}

export function Figure({ name, value, figure, children }: { name: ReactNode; value: ReactNode; figure?: string; children?: ReactNode }) {
  return (
    <div className="grid grid-cols-[9.5rem_6.5rem_1fr] items-baseline gap-x-3 py-1.5">
      <dt className="text-soil-700">{name}</dt>
      <dd className="text-right font-semibold tabular-nums text-soil-900" data-figure={figure}>
        {value}
      </dd>
      <dd className="text-xs leading-snug text-soil-600">{children}</dd>
    </div>
  );
}

export function Warning({ children }: { children: ReactNode }) {
  return (
    <p role="note" className="mt-2 rounded-md bg-straw-100 px-3 py-2 text-xs text-soil-800 ring-1 ring-inset ring-straw-300">
      <span className="font-semibold">Caution: </span>
      {children}
    </p>
  );
}

export function SectionTitle({ children, source }: { children: ReactNode; source?: string }) {
  return (
    <h3 className="mb-1 flex flex-wrap items-baseline justify-between gap-2 border-b border-soil-300/60 pb-1 text-sm font-semibold uppercase tracking-wide text-field-800">
      {children}
      {source && <span className="text-[11px] font-normal normal-case tracking-normal text-soil-500">{source}</span>}
    </h3>
  );
}
