import { useLayoutEffect, useRef, useState, type RefObject } from 'react';
import { Link, Navigate, Outlet, useLocation } from 'react-router-dom';
import { cx, focusRing } from '../../components/ui/cx';
import { ErrorState, ForbiddenState } from '../../components/ui/error-state';
import { Skeleton, SkeletonRows } from '../../components/ui/skeleton';
import { paths } from '../../lib/paths';
import { useMe } from '../../features/auth/api/get-me';
import { useBusiness } from '../../features/business/api/get-business';
import { entryForPath, mayOpen } from '../navigation';
import { SideNav } from './side-nav';
import { SiteSwitcher } from './site-switcher';
import { UserMenu } from './user-menu';

function LoadingShell() {
  return (
    <div className="mx-auto max-w-5xl p-6" aria-busy="true">
      <Skeleton className="mb-8 h-8 w-48" />
      <SkeletonRows rows={5} label="Opening Tamp & Tally" />
    </div>
  );
}

/**
 * When a page change takes the focused control away with the old page (a link or a button inside
 * it, such as "Add a drink" or a form's Save that opens the saved item), the focus would fall back
 * to the document and the next Tab would start from nowhere a reader can tell. The new page's title
 * takes it instead. A control that is still there (a section link in the side navigation) keeps it.
 */
function useFocusAfterPageChange(pathname: string, mainRef: RefObject<HTMLElement | null>) {
  const shown = useRef(pathname);
  // Before the browser paints the new page, so the focus is never seen lost.
  useLayoutEffect(() => {
    if (shown.current === pathname) return;
    shown.current = pathname;
    const active = document.activeElement;
    if (active && active !== document.body && active.isConnected) return;
    const main = mainRef.current;
    const title = main?.querySelector('h1');
    if (title && !title.hasAttribute('tabindex')) title.tabIndex = -1;
    (title ?? main)?.focus();
  }, [pathname, mainRef]);
}

/**
 * The signed-in frame: top bar (business, site, person), section navigation,
 * and the page. Sends signed-out visitors to sign in and keeps each section
 * to the roles listed for it in navigation.ts.
 */
export function AppLayout() {
  const me = useMe();
  const business = useBusiness();
  const location = useLocation();
  const [menuOpen, setMenuOpen] = useState(false);
  const mainRef = useRef<HTMLElement>(null);
  useFocusAfterPageChange(location.pathname, mainRef);

  if (me.isPending) return <LoadingShell />;
  if (me.isError)
    return (
      <main className="mx-auto max-w-xl p-6">
        <ErrorState error={me.error} onRetry={() => me.refetch()} />
      </main>
    );
  if (!me.data) return <Navigate to={paths.signIn.href(`${location.pathname}${location.search}`)} replace />;

  const { user } = me.data;
  const businessName = business.data?.name ?? me.data.business.name;
  const section = entryForPath(location.pathname);
  const allowed = !section || mayOpen(user.role, section);
  const barista = user.role === 'barista';

  return (
    <div className={cx('min-h-dvh', barista && 'text-lg')}>
      <a href="#main" className={cx('sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-card focus:px-3 focus:py-2', focusRing)}>
        Skip to the page
      </a>
      <header data-app-bar className="sticky top-0 z-20 border-b border-rule bg-card/95 backdrop-blur">
        <div className="mx-auto flex max-w-7xl items-center gap-3 px-4 py-2">
          <button
            type="button"
            className={cx('whitespace-nowrap rounded-md border border-rule px-3 py-1.5 text-sm font-medium text-ink md:hidden', focusRing)}
            aria-expanded={menuOpen}
            aria-controls="phone-nav"
            onClick={() => setMenuOpen((o) => !o)}
          >
            {menuOpen ? 'Close menu' : 'Menu'}
          </button>
          <Link to={paths.home.href()} className={cx('shrink-0 rounded-sm font-bold text-ink no-underline', focusRing)}>
            Tamp <span className="text-copper">&amp;</span> Tally
          </Link>
          <span aria-hidden="true" className="hidden text-rule sm:inline">
            |
          </span>
          <p className="hidden min-w-0 truncate font-medium text-ink sm:block" title={businessName}>
            {businessName}
          </p>
          <div className="ml-auto flex items-center gap-3">
            <div className="hidden sm:block">
              <SiteSwitcher businessId={user.businessId} />
            </div>
            <UserMenu user={user} />
          </div>
        </div>
        {menuOpen && (
          <nav id="phone-nav" aria-label="Sections" className="border-t border-rule px-4 py-3 md:hidden">
            <div className="mb-3 flex flex-col gap-2 border-b border-rule pb-3 sm:hidden">
              <p className="truncate font-medium text-ink">{businessName}</p>
              <SiteSwitcher businessId={user.businessId} />
            </div>
            <SideNav role={user.role} onNavigate={() => setMenuOpen(false)} />
          </nav>
        )}
      </header>
      <div className="mx-auto flex max-w-7xl gap-8 px-4">
        <nav aria-label="Sections" className="sticky top-16 hidden h-fit w-52 shrink-0 py-6 md:block">
          <SideNav role={user.role} />
        </nav>
        <main ref={mainRef} id="main" tabIndex={-1} className="min-w-0 flex-1 py-6 focus:outline-none">
          {allowed ? <Outlet /> : <ForbiddenState />}
        </main>
      </div>
    </div>
  );
}
