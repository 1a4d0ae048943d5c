import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { usePageTitle } from '../../lib/use-page-title';
import { paths } from '../../lib/paths';

/** Shown when a page crashes: says so plainly and offers a way back. */
export function RouteError() {
  const error = useRouteError();
  usePageTitle('Something went wrong');
  const detail = isRouteErrorResponse(error) ? `${error.status} ${error.statusText}` : error instanceof Error ? error.message : null;
  return (
    <main className="mx-auto max-w-xl p-6">
      <h1 className="text-2xl font-bold text-ink">Something went wrong</h1>
      <p className="mt-2 text-ink">This page stopped working. Reload it; if it keeps happening, go back to Home and try again.</p>
      {detail && <p className="mt-2 text-sm text-muted">Detail: {detail}</p>}
      {/* A full reload clears whatever state broke the page. */}
      <a href={paths.home.href()} className={buttonClasses('primary', 'md', 'mt-6 no-underline')}>
        Go to Home
      </a>
    </main>
  );
}
