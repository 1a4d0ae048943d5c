import { isApiError } from '../../lib/api-client';
import { usePageTitle } from '../../lib/use-page-title';
import { Button } from './button';

function explain(error: unknown): { title: string; advice: string } {
  if (isApiError(error)) {
    if (error.status === 403)
      return { title: 'Not allowed for your role', advice: 'This part is kept to other roles. If you need it, ask an owner of the business.' };
    if (error.status === 404) return { title: 'Not found', advice: 'It may have been removed, or the link is out of date.' };
    if (error.status === 0) return { title: 'Could not reach the server', advice: 'Check your connection, then try again.' };
    if (error.status >= 500)
      return {
        title: 'The server ran into a problem',
        advice: `Try again in a moment.${error.requestId ? ` If it keeps happening, quote reference ${error.requestId}.` : ''}`,
      };
    return { title: 'That did not work', advice: error.message };
  }
  return { title: 'Something went wrong', advice: 'Reload the page and try again.' };
}

/** What went wrong and what to try, with a retry when one can help. */
export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const { title, advice } = explain(error);
  const forbidden = isApiError(error) && error.status === 403;
  return (
    <div role="alert" className="rounded-lg border border-rose/40 bg-card px-6 py-8">
      <p className="font-medium text-rose">{title}</p>
      <p className="mt-1 max-w-prose text-ink">{advice}</p>
      {onRetry && !forbidden && (
        <Button variant="secondary" className="mt-4" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

/** The plain state a page shows to someone whose role may not use it. */
export function ForbiddenState() {
  usePageTitle('Not allowed');
  return (
    <div role="alert" className="rounded-lg border border-rule bg-card px-6 py-8">
      <p className="font-medium text-ink">Not allowed for your role</p>
      <p className="mt-1 max-w-prose text-muted">This page is kept to other roles. If you need it, ask an owner of the business.</p>
    </div>
  );
}
