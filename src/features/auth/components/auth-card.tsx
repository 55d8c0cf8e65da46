import { useEffect, type ReactNode } from 'react';
import { Link } from 'react-router';

/** The signed-out pages' frame: the product's name over one short form. */
export function AuthCard({ title, intro, children, footer }: { title: string; intro?: ReactNode; children: ReactNode; footer?: ReactNode }) {
  useEffect(() => {
    document.title = `${title} · Patchwise`;
  }, [title]);
  return (
    <main className="flex min-h-screen flex-col items-center justify-center bg-gradient-to-b from-field-50 to-straw-100 px-4 py-10">
      <Link to="/" className="mb-6 flex items-center gap-2 text-2xl font-semibold text-field-800">
        <span aria-hidden="true" className="inline-block h-7 w-7 rounded-md bg-field-700 ring-4 ring-patch-400/60" />
        Patchwise
      </Link>
      <div className="w-full max-w-sm rounded-xl bg-white p-6 shadow-md ring-1 ring-soil-300/50">
        <h1 className="text-xl font-semibold text-soil-900">{title}</h1>
        {intro && <p className="mt-1 text-sm text-soil-600">{intro}</p>}
        <div className="mt-5">{children}</div>
      </div>
      {footer && <div className="mt-4 text-sm text-soil-700">{footer}</div>}
    </main>
  );
}
