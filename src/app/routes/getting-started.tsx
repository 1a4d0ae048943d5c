import { ButtonLink } from '../../components/ui/button';
import { Card } from '../../components/ui/card';
import { PageHeader } from '../../components/ui/page-header';
import { paths } from '../../lib/paths';

const steps = [
  {
    title: 'Set your cup sizes',
    body: 'Name the cups you serve and how much each holds, so every drink can be costed per size.',
    to: paths.cupSizes.href(),
    action: 'Set cup sizes',
  },
  {
    title: "Add a supplier's packs",
    body: 'Enter what you buy, pack by pack: the pack size and what you pay for it. Costs per gram or millilitre follow from that.',
    to: paths.suppliers.href(),
    action: 'Add a supplier',
  },
  {
    title: 'Cost your first drink',
    body: 'Build a drink from its shots, milk and syrups for each cup size, and see what it costs to make and the margin at your price.',
    to: paths.drinks.href(),
    action: 'Cost a drink',
  },
];

/** The first-run guide shown straight after signing up. */
export function GettingStartedRoute() {
  return (
    <div className="max-w-3xl">
      <PageHeader title="Getting started" description="Three steps take you from an empty account to the cost of a cup. Do them in order; each takes a few minutes." />
      <ol className="flex flex-col gap-4">
        {steps.map((s, i) => (
          <li key={s.title}>
            <Card className="flex flex-col gap-3 sm:flex-row sm:items-center">
              <span aria-hidden="true" className="flex h-10 w-10 shrink-0 items-center justify-center rounded-full bg-copper/10 text-lg font-bold text-copper">
                {i + 1}
              </span>
              <div className="flex-1">
                <h2 className="font-bold text-ink">
                  <span className="sr-only">Step {i + 1}: </span>
                  {s.title}
                </h2>
                <p className="text-muted">{s.body}</p>
              </div>
              <ButtonLink to={s.to} variant={i === 0 ? 'primary' : 'secondary'}>
                {s.action}
              </ButtonLink>
            </Card>
          </li>
        ))}
      </ol>
      <p className="mt-6 text-muted">
        You can come back to this list at any time from Home.
      </p>
    </div>
  );
}
