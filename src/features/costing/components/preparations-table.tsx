import { TextLink } from '../../../components/ui/button';
import { StatusMark } from '../../../components/ui/status-mark';
import { Table, Td, Th, THead } from '../../../components/ui/table';
import { formatMoney, formatQuantity } from '../../../lib/format';
import { paths } from '../../../lib/paths';
import { ALLERGENS } from '../../../shared/allergens';
import type { PreparationSummary } from '../api/types';
import { unitSymbol } from './units';

/** What the café makes in batches: yield, cost per batch and per unit. */
export function PreparationsTable({ preparations, currency }: { preparations: PreparationSummary[]; currency: string }) {
  return (
    <Table caption="Preparations">
      <THead>
        <tr>
          <Th>Preparation</Th>
          <Th figure>One batch makes</Th>
          <Th figure>Cost per batch</Th>
          <Th figure>Cost per unit</Th>
          <Th>Allergens</Th>
        </tr>
      </THead>
      <tbody>
        {[...preparations].sort((a, b) => a.name.localeCompare(b.name)).map((p) => (
          <tr key={p.id}>
            <Td>
              <TextLink to={paths.preparation.href(p.id)}>{p.name}</TextLink>
            </Td>
            <Td figure>{formatQuantity(p.yield.quantity, unitSymbol(p.yield.unit))}</Td>
            <Td figure>{p.batchCost ? formatMoney(p.batchCost, currency, { detail: true }) : <StatusMark tone="attention">cannot be costed</StatusMark>}</Td>
            <Td figure>
              {p.unitCost ? (
                <>
                  {formatMoney(p.unitCost, currency, { detail: true })} <span className="text-muted">/ {p.baseUnit}</span>
                </>
              ) : (
                <span className="text-muted">{p.problem ?? '—'}</span>
              )}
            </Td>
            <Td>{p.allergens.length ? p.allergens.map((a) => ALLERGENS[a].split(' (')[0]).join(', ') : <span className="text-muted">none entered</span>}</Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
