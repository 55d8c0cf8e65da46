import { isRouteErrorResponse, Link, useRouteError } from 'react-router';
import { PageFrame } from '../components/page-frame.tsx';

export function NotFound() {
  return (
    <PageFrame title="Page not found">
      <p className="text-soil-700">
        There is nothing at this address.{' '}
        <Link to="/" className="font-medium text-field-700 underline">
          Go to your home page
        </Link>
        .
      </p>
    </PageFrame>
  );
}

/** Last resort for a page that crashed or a chunk that failed to load (often after a new release). */
export function RouteError() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <main className="mx-auto max-w-lg p-6">
      <h1 className="text-2xl font-semibold text-field-900">This page stopped working</h1>
      <p className="mt-2 text-soil-700">Reload the page to try again. If it keeps happening, tell your admin what you were doing.</p>
      <pre className="mt-4 overflow-x-auto rounded bg-straw-100 p-3 text-xs text-soil-800">{message}</pre>
      <button type="button" className="mt-4 font-medium text-field-700 underline" onClick={() => window.location.reload()}>
        Reload
      </button>
    </main>
  );
}
