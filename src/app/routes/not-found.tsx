import { ButtonLink } from '../../components/ui/button';
import { usePageTitle } from '../../lib/use-page-title';
import { paths } from '../../lib/paths';

export function NotFoundRoute() {
  usePageTitle('Page not found');
  return (
    <div className="max-w-xl">
      <h1 className="text-2xl font-bold text-ink">Page not found</h1>
      <p className="mt-2 text-muted">There is no page at this address. It may not be built yet, or the link is mistyped.</p>
      <ButtonLink to={paths.home.href()} className="mt-6">
        Go to Home
      </ButtonLink>
    </div>
  );
}
