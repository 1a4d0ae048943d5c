import { Link, Outlet } from 'react-router-dom';
import { focusRing } from '../../components/ui/cx';
import { paths } from '../../lib/paths';

/** The frame around the signed-out pages: the product name and a single card. */
export function AuthLayout() {
  return (
    <div className="flex min-h-dvh flex-col items-center px-4 py-10 sm:py-16">
      <header className="mb-8">
        <Link to={paths.home.href()} className={`rounded-sm text-2xl font-bold text-ink no-underline ${focusRing}`}>
          Tamp <span className="text-copper">&amp;</span> Tally
        </Link>
      </header>
      <main id="main" className="w-full max-w-xl">
        <Outlet />
      </main>
    </div>
  );
}
