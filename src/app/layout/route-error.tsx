import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { buttonClasses } from '@/components/ui/button';

/** Last-resort page for a route that failed to load or render. */
export function RouteError() {
  const error = useRouteError();
  const chunkFailed = error instanceof Error && /dynamically imported module|Importing a module script failed|Failed to fetch/i.test(error.message);
  let message = 'Something went wrong while showing this page.';
  if (chunkFailed) message = 'Part of Threadline could not be loaded. The app may have been updated, or the connection dropped.';
  else if (isRouteErrorResponse(error)) message = `${error.status} ${error.statusText}`;
  return (
    <main className="mx-auto max-w-lg space-y-4 p-6">
      <h1 className="text-xl font-semibold">This page could not be shown</h1>
      <p className="text-ink-700">{message}</p>
      {error instanceof Error && !chunkFailed && <pre className="overflow-x-auto rounded bg-ink-100 p-3 text-xs">{error.message}</pre>}
      <div className="flex gap-2">
        <button type="button" className={buttonClasses('primary')} onClick={() => window.location.reload()}>
          Reload
        </button>
        <Link to="/projects" className={buttonClasses('secondary')}>
          Go to projects
        </Link>
      </div>
    </main>
  );
}
