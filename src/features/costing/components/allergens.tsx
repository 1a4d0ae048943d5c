import { ALLERGENS, type AllergenCode } from '../../../shared/allergens';
import { cx } from '../../../components/ui/cx';

/** The allergens by their plain names (or "None entered"), always with the caution beside them. */
export function AllergenSummary({ allergens, caution, large = false }: { allergens: readonly AllergenCode[]; caution: string; large?: boolean }) {
  return (
    <div className={cx('flex flex-col gap-2', large && 'text-lg')}>
      {allergens.length > 0 ? (
        <ul className="flex flex-wrap gap-2" aria-label="Allergens">
          {allergens.map((a) => (
            <li key={a} className="rounded-md border-2 border-ink bg-card px-2 py-0.5 font-bold text-ink">
              {ALLERGENS[a]}
            </li>
          ))}
        </ul>
      ) : (
        <p className="font-medium text-ink">None of the 14 listed allergens entered.</p>
      )}
      <AllergenCaution text={caution} />
    </div>
  );
}

export function AllergenCaution({ text }: { text: string }) {
  return (
    <p className="rounded-md border border-butter bg-butter/20 px-3 py-2 text-sm text-ink print:border-ink print:bg-transparent">
      <span className="font-medium">Check before you tell a customer. </span>
      {text}
    </p>
  );
}
