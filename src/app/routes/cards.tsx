import { ErrorState } from '../../components/ui/error-state';
import { PageHeader } from '../../components/ui/page-header';
import { SkeletonRows } from '../../components/ui/skeleton';
import { useCards } from '../../features/costing/api/queries';
import { CardList } from '../../features/costing/components/recipe-cards';

/** The list of recipe cards; also what a barista's Home page shows. */
export function CardsSection() {
  const cards = useCards();
  if (cards.isPending) return <SkeletonRows rows={6} label="Loading the recipe cards" />;
  if (cards.isError) return <ErrorState error={cards.error} onRetry={() => cards.refetch()} />;
  return <CardList cards={cards.data.cards} />;
}

export function CardsRoute() {
  return (
    <div className="max-w-5xl">
      <PageHeader title="Recipe cards" description="The build of each drink for every cup size, for the bar. Open one to read or print it." />
      <CardsSection />
    </div>
  );
}
