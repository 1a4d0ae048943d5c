import type { ReactNode } from 'react';
import { Card } from '../../components/ui/card';
import { usePageTitle } from '../../lib/use-page-title';

/** A signed-out page: its title (also the tab's), the form, and links under it. */
export function AuthCard({ title, intro, footer, children }: { title: string; intro?: ReactNode; footer?: ReactNode; children: ReactNode }) {
  usePageTitle(title);
  return (
    <>
      <Card className="p-6 sm:p-8">
        <h1 className="text-2xl font-bold text-ink">{title}</h1>
        {intro && <p className="mt-2 text-muted">{intro}</p>}
        <div className="mt-6">{children}</div>
      </Card>
      {footer && <div className="mt-6 text-center text-sm text-muted">{footer}</div>}
    </>
  );
}
