import { Link } from 'react-router-dom';
import { EmptyState } from '../../../components/ui/empty-state';
import { cx, focusRing } from '../../../components/ui/cx';
import { formatQuantity } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGENS } from '../../../shared/allergens';
import type { CardSummary, RecipeCard } from '../../../shared/contract/costing';
import { AllergenSummary } from './allergens';

/** The drinks a barista can open, grouped by category, big enough to tap on a phone. */
export function CardList({ cards }: { cards: CardSummary[] }) {
  if (cards.length === 0)
    return <EmptyState title="No recipe cards yet" next="Cards appear here once a manager or owner adds drinks and their builds." />;
  const byCategory = new Map<string, CardSummary[]>();
  for (const c of cards) byCategory.set(c.category, [...(byCategory.get(c.category) ?? []), c]);
  return (
    <div className="flex flex-col gap-6">
      {[...byCategory.entries()].map(([category, list]) => (
        <section key={category} aria-labelledby={`cat-${category}`}>
          <h2 id={`cat-${category}`} className="mb-2 text-lg font-bold capitalize text-muted">
            {category}
          </h2>
          <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
            {list.map((c) => (
              <li key={c.id}>
                <Link
                  to={paths.card.href(c.id)}
                  className={cx('flex min-h-14 flex-col justify-center rounded-lg border border-rule bg-card px-4 py-3 text-ink no-underline hover:border-copper', focusRing)}
                >
                  <span className="text-xl font-bold">{c.name}</span>
                  <span className="text-base text-muted">
                    {c.temperature === 'hot' ? 'Hot' : 'Iced'} · {c.sizes.join(', ') || 'no sizes yet'}
                  </span>
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

/** One drink's card for the bar: the build per size in large type and its allergens. No costs. */
export function RecipeCardView({ card }: { card: RecipeCard }) {
  return (
    <article className="recipe-card flex flex-col gap-6 text-lg" aria-labelledby="card-title">
      <header>
        <p className="text-base font-medium uppercase tracking-wide text-muted print:text-ink">
          {card.category} · {card.temperature === 'hot' ? 'Hot' : 'Iced'}
        </p>
        <h1 id="card-title" className="text-3xl font-bold text-ink sm:text-4xl">
          {card.name}
        </h1>
        {card.notes && <p className="mt-2 text-xl text-ink">{card.notes}</p>}
      </header>
      {card.sizes.length === 0 ? (
        <EmptyState title="No build yet" next="Ask a manager to add this drink's builds for each cup size." />
      ) : (
        <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3 print:grid-cols-2">
          {card.sizes.map((s) => (
            <section key={s.sizeId} aria-labelledby={`card-size-${s.sizeId}`} className="break-inside-avoid rounded-lg border-2 border-ink bg-card p-4">
              <h2 id={`card-size-${s.sizeId}`} className="mb-3 flex items-baseline justify-between gap-2 text-2xl font-bold text-ink">
                {s.name}
                <span className="text-lg font-medium text-muted tabular-nums print:text-ink">{formatQuantity(s.volumeMl, 'ml')} cup</span>
              </h2>
              <ol className="flex flex-col divide-y divide-rule print:divide-ink">
                {s.lines.map((l, i) => (
                  <li key={i} className="flex items-baseline justify-between gap-4 py-2 text-xl">
                    <span className="font-medium text-ink">{l.itemName}</span>
                    <span className="shrink-0 text-right font-bold tabular-nums text-ink">
                      {formatQuantity(l.quantity)} {l.unitLabel}
                    </span>
                  </li>
                ))}
              </ol>
            </section>
          ))}
        </div>
      )}
      <section aria-labelledby="card-allergens" className="break-inside-avoid">
        <h2 id="card-allergens" className="mb-2 text-2xl font-bold text-ink">
          Allergens
        </h2>
        <AllergenSummary allergens={card.allergens} caution={card.allergenCaution} large />
      </section>
      {card.modifiers.length > 0 && (
        <section aria-labelledby="card-modifiers" className="break-inside-avoid">
          <h2 id="card-modifiers" className="mb-2 text-2xl font-bold text-ink">
            Add-ons and swaps
          </h2>
          <ul className="flex flex-col gap-1">
            {card.modifiers.map((m) => (
              <li key={m.id} className="text-ink">
                <span className="font-medium">{m.name}</span>
                {m.allergens.length > 0 && <span className="text-muted print:text-ink"> adds {m.allergens.map((a) => ALLERGENS[a]).join(', ')}</span>}
              </li>
            ))}
          </ul>
        </section>
      )}
    </article>
  );
}
