import { Link, isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { Brand } from '../../components/layouts/brand';

/** Shown for an unknown address. */
export function NotFoundPage() {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center gap-4 px-4 text-center">
      <Brand size="lg" />
      <h1 className="text-xl font-bold">This page is not on the map</h1>
      <p className="text-slate">The address may be mistyped, or the page moved.</p>
      <Link to="/" className="text-moss-deep underline">Go to your home page</Link>
    </div>
  );
}

/** Each route's error boundary: says what happened and how to go on. */
export function RouteErrorPage() {
  const error = useRouteError();
  const message = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : 'Unknown error';
  return (
    <div role="alert" className="mx-auto mt-16 max-w-lg rounded-md border border-clay/40 bg-card p-6">
      <h1 className="text-xl font-bold text-clay">Something went wrong on this page</h1>
      <p className="mt-2 text-sm">{message}</p>
      <p className="mt-2 text-sm text-slate">Your saved work is safe. Reload the page, or go back and try again.</p>
      <button className="mt-4 rounded bg-moss px-4 py-2 text-sm font-semibold text-white" onClick={() => window.location.reload()}>Reload</button>
    </div>
  );
}
