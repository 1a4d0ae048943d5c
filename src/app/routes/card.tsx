import { useParams } from 'react-router-dom';
import { Button, TextLink } from '../../components/ui/button';
import { ErrorState } from '../../components/ui/error-state';
import { SkeletonRows } from '../../components/ui/skeleton';
import { usePageTitle } from '../../lib/use-page-title';
import { paths } from '../../lib/paths';
import { useCard } from '../../features/costing/api/queries';
import { RecipeCardView } from '../../features/costing/components/recipe-cards';

export function CardRoute() {
  const { drinkId = '' } = useParams();
  const card = useCard(drinkId);
  usePageTitle(card.data ? `${card.data.card.name} recipe card` : 'Recipe card');
  return (
    <div className="max-w-6xl">
      <div className="mb-4 flex items-center justify-between gap-3 print:hidden">
        <TextLink to={paths.cards.href()}>← All recipe cards</TextLink>
        {card.data && (
          <Button variant="secondary" onClick={() => window.print()}>
            Print this card
          </Button>
        )}
      </div>
      {card.isPending ? (
        <SkeletonRows rows={6} label="Loading the card" />
      ) : card.isError ? (
        <ErrorState error={card.error} onRetry={() => card.refetch()} />
      ) : (
        <RecipeCardView card={card.data.card} />
      )}
    </div>
  );
}
