import { useEffect, type ReactNode } from 'react';

/** Every page's heading row and width; sets the tab title too. */
export function PageFrame({
  title,
  eyebrow,
  actions,
  wide,
  children,
}: {
  title: string;
  eyebrow?: ReactNode;
  actions?: ReactNode;
  wide?: boolean;
  children: ReactNode;
}) {
  useEffect(() => {
    document.title = `${title} · Patchwise`;
  }, [title]);
  return (
    <div className={`mx-auto w-full ${wide ? 'max-w-7xl' : 'max-w-5xl'} px-4 py-5 sm:px-6 sm:py-8`}>
      <header className="mb-5 flex flex-wrap items-end justify-between gap-3">
        <div>
          {eyebrow && <p className="text-sm font-medium text-soil-600">{eyebrow}</p>}
          <h1 className="text-2xl font-semibold tracking-tight text-field-900 sm:text-3xl">{title}</h1>
        </div>
        {actions && <div className="flex flex-wrap gap-2">{actions}</div>}
      </header>
      <div className="space-y-6">{children}</div>
    </div>
  );
}

export function Panel({ title, actions, children, className = '' }: { title?: ReactNode; actions?: ReactNode; children: ReactNode; className?: string }) {
  return (
    <section className={`rounded-lg bg-white p-4 shadow-sm ring-1 ring-soil-300/60 sm:p-5 ${className}`}>
      {(title || actions) && (
        <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
          {title && <h2 className="text-lg font-semibold text-field-900">{title}</h2>}
          {actions}
        </div>
      )}
      {children}
    </section>
  );
}
