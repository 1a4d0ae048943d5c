import { useId, type HTMLAttributes, type ReactNode } from 'react';
import { cx } from './cx';

export function Card({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return <div className={cx('rounded-lg border border-rule bg-card p-5 shadow-sm print:border-ink print:shadow-none', className)} {...rest} />;
}

/** A titled part of a page, in a card; the heading labels the region for screen readers. */
export function CardSection({ title, children }: { title: string; children: ReactNode }) {
  const id = useId();
  return (
    <section aria-labelledby={id}>
      <Card>
        <h2 id={id} className="mb-4 text-lg font-bold text-ink">
          {title}
        </h2>
        {children}
      </Card>
    </section>
  );
}
