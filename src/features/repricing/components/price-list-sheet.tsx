import { formatDate, formatMoney } from '../../../lib/format';
import type { PriceList } from '../api/get-price-list';

/**
 * The counter's price list: drinks by category, a column per cup size, allergen marks in words
 * beside each drink, add-ons, the date effective and the allergen caution. High contrast and no
 * navigation when printed (the print stylesheet in index.css).
 */
export function PriceListSheet({ list }: { list: PriceList }) {
  const c = list.business.currency;
  const categories = [...new Set(list.drinks.map((d) => d.category))];
  return (
    <article className="flex flex-col gap-6 rounded-lg border border-rule bg-card p-6 text-ink print:border-0 print:p-0">
      <header className="flex flex-wrap items-baseline justify-between gap-2 border-b-2 border-ink pb-3">
        <h2 className="text-3xl font-bold">{list.business.name}</h2>
        <p className="text-sm">
          Prices effective from {formatDate(list.effectiveFrom ?? list.date)} · {list.taxNote}
        </p>
        {list.nextChangeFrom && <p className="w-full text-sm text-muted print:hidden">New prices are scheduled from {formatDate(list.nextChangeFrom)}: choose that date to print them.</p>}
      </header>
      {categories.map((cat) => (
        <section key={cat} aria-label={cat} className="break-inside-avoid">
          <h3 className="mb-2 text-xl font-bold">{cat}</h3>
          <table className="w-full border-collapse text-left">
            <thead>
              <tr className="border-b border-ink">
                <th scope="col" className="py-1 pr-3 font-medium">Drink</th>
                {list.sizes.map((s) => (
                  <th key={s.sizeId} scope="col" className="px-2 py-1 text-right font-medium">
                    {s.name}
                  </th>
                ))}
                <th scope="col" className="py-1 pl-3 font-medium">Contains</th>
              </tr>
            </thead>
            <tbody>
              {list.drinks
                .filter((d) => d.category === cat)
                .map((d) => (
                  <tr key={d.id} className="border-b border-rule">
                    <th scope="row" className="py-1.5 pr-3 text-left font-medium">
                      {d.name} {d.temperature === 'iced' && <span className="text-sm font-normal">(iced)</span>}
                    </th>
                    {list.sizes.map((s) => {
                      const price = d.sizes.find((x) => x.sizeId === s.sizeId)?.price ?? null;
                      return (
                        <td key={s.sizeId} className="px-2 py-1.5 text-right tabular-nums">
                          {price ? formatMoney(price, c) : <span aria-label="not offered">–</span>}
                        </td>
                      );
                    })}
                    <td className="py-1.5 pl-3 text-sm">{d.allergens.length ? d.allergens.map((a) => list.allergenNames[a] ?? a).join(', ') : 'None of the 14 entered'}</td>
                  </tr>
                ))}
            </tbody>
          </table>
        </section>
      ))}
      {list.modifiers.length > 0 && (
        <section aria-label="Add-ons and swaps" className="break-inside-avoid">
          <h3 className="mb-2 text-xl font-bold">Add-ons and swaps</h3>
          <ul className="grid gap-1 sm:grid-cols-2">
            {list.modifiers.map((m) => (
              <li key={m.id} className="flex justify-between gap-3 border-b border-rule py-1">
                <span>
                  {m.name}
                  {m.allergens.length > 0 && <span className="text-sm"> · contains {m.allergens.map((a) => list.allergenNames[a] ?? a).join(', ')}</span>}
                </span>
                <span className="tabular-nums">{m.upcharge ? `+${formatMoney(m.upcharge, c)}` : ''}</span>
              </li>
            ))}
          </ul>
        </section>
      )}
      <footer className="border-t-2 border-ink pt-3 text-sm">
        <p className="font-medium">Allergens: please ask before you order.</p>
        <p>{list.allergenCaution}</p>
      </footer>
    </article>
  );
}
