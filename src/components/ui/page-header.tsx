import type { ReactNode } from 'react';
import { usePageTitle } from '../../lib/use-page-title';

interface PageHeaderProps {
  title: string;
  /** One line on what the page is for. */
  description?: ReactNode;
  /** The page's main action, shown top right. */
  action?: ReactNode;
}

/** The page's title (also the browser tab's) and its main action at the top right. */
export function PageHeader({ title, description, action }: PageHeaderProps) {
  usePageTitle(title);
  return (
    <div className="mb-6 flex flex-wrap items-start justify-between gap-4">
      <div className="min-w-0">
        {/* As wide as its words, so the ring it shows when a page change gives it the focus hugs them. */}
        <h1 className="w-fit max-w-full text-2xl font-bold text-ink">{title}</h1>
        {description && <p className="mt-1 max-w-prose text-muted">{description}</p>}
      </div>
      {/* At most the page's width, so several actions wrap on a phone instead of pushing past its edge. */}
      {action && <div className="max-w-full shrink-0 print:hidden">{action}</div>}
    </div>
  );
}
