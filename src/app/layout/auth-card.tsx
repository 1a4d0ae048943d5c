import type { ReactNode } from 'react';
import { Card } from '../../components/ui/card';
import { usePageTitle } from '../../lib/use-page-title';

/** A signed-out page: its title (also the tab's), the form, and links under it. */
export function AuthCard({ title, intro, footer, wide, children }: { title: string; intro?: ReactNode; footer?: ReactNode; wide?: boolean; children: ReactNode }) {
  usePageTitle(title);
  return (
    <div className={wide ? 'w-full' : 'mx-auto w-full max-w-md'}>
      <Card className="p-6 sm:p-8">
        <h1 className="text-2xl font-bold text-ink">{title}</h1>
        {intro && <p className="mt-2 text-muted">{intro}</p>}
        <div className="mt-6">{children}</div>
      </Card>
      {footer && <div className="mt-6 text-center text-sm text-muted">{footer}</div>}
    </div>
  );
}
